import type { FamilyId } from '../board';

/** A board role, strongest first: owner > editor > viewer. */
export type BoardRole = 'owner' | 'editor' | 'viewer';

/** The signed-in user as the API returns it. Dates are ISO 8601 strings. */
export interface ApiUser {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
  createdAt: string;
}

/** A board as seen by one user (`role` is that user's role on it). */
export interface ApiBoard {
  id: number;
  title: string;
  family: FamilyId;
  ownerId: number;
  role: BoardRole;
  createdAt: string;
  updatedAt: string;
  memberCount: number;
}

/** A member of a board. */
export interface ApiMember {
  userId: number;
  email: string;
  name: string;
  role: BoardRole;
}

/** A pending invitation of an e-mail address that has no account yet (listed to owners only). */
export interface ApiInvitation {
  id: number;
  email: string;
  role: Exclude<BoardRole, 'owner'>;
  createdAt: string;
}

/** What `GET /api/invitations/:token` tells the person who follows the link. */
export interface ApiInvitationInfo {
  boardTitle: string;
  email: string;
  role: Exclude<BoardRole, 'owner'>;
  invitedBy: string;
}

/** One message in the outbox list. */
export interface ApiMailSummary {
  id: number;
  from: string;
  to: string;
  subject: string;
  date: string;
}

/** One message with its bodies. */
export interface ApiMail extends ApiMailSummary {
  text: string;
  html: string;
}

/** The error body every failing request returns. */
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

export interface HealthResponse { ok: true; version: string }
export interface UserResponse { user: ApiUser }
export interface BoardsResponse { boards: ApiBoard[] }
export interface BoardResponse { board: ApiBoard }
export interface MembersResponse { members: ApiMember[]; invitations: ApiInvitation[] }
/** `POST /api/boards/:id/members` answers one of the two. */
export type AddMemberResponse = { member: ApiMember } | { invitation: ApiInvitation };
export interface MemberResponse { member: ApiMember }
export interface InvitationInfoResponse { invitation: ApiInvitationInfo }
export interface OutboxResponse { messages: ApiMailSummary[] }
export interface OutboxMessageResponse { message: ApiMail }
export interface OkResponse { ok: true }
