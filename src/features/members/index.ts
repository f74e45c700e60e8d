/** A board's members and invitations: queries, the member list and table, adding members, accepting an invitation. */
export { invitationQueryOptions, membersQueryOptions } from './api';
export { AddMemberForm } from './components/add-member-form';
export { InvitationCard } from './components/invitation-card';
export { InvitationsList } from './components/invitations-list';
export { MemberAvatars } from './components/member-avatars';
export { MemberListPanel } from './components/member-list-panel';
export { MembersTable } from './components/members-table';
