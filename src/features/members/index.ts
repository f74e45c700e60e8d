/** A board's members and invitations: queries, the member list and table, adding members, accepting an invitation. */
import { lazyNamed } from '../../lib/lazy-named';

// The panels and pages below are chunks of their own, loaded on first render (inside a Suspense boundary):
// the main script, which runs before a board's canvas draws, does not hold them.
export { invitationQueryOptions, membersQueryOptions } from './api';
export { AddMemberForm } from './components/add-member-form';
export { InvitationCard } from './components/invitation-card';
export { InvitationsList } from './components/invitations-list';
export { MemberAvatars } from './components/member-avatars';
export const MemberListPanel = lazyNamed(() => import('./components/member-list-panel'), 'MemberListPanel');
export const MembersTable = lazyNamed(() => import('./components/members-table'), 'MembersTable');
