import type { BoardFile } from '../board';
import type { BoardDiff } from '../render';
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
  /** Given to the board's owner only (and to the member themselves); others see name and role. */
  email?: string;
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

/** How a snapshot came to be. */
export type SnapshotKind = 'named' | 'automatic' | 'before-restore' | 'copied-from';

/** One entry of a board's history. */
export interface ApiSnapshot {
  id: number;
  boardId: number;
  name: string;
  kind: SnapshotKind;
  /** who took it (null: the server, automatically, or a deleted account) */
  authorId: number | null;
  authorName: string | null;
  createdAt: string;
  partCount: number;
  wireCount: number;
  /** its picture: `GET` this URL for an SVG */
  thumbnailUrl: string;
  /** for a copied-from snapshot: what the board was copied from */
  source: { boardId: number; boardTitle: string; snapshotId: number | null; snapshotName: string | null } | null;
}

export interface SnapshotsResponse { snapshots: ApiSnapshot[] }
export interface SnapshotResponse { snapshot: ApiSnapshot }
/** `GET /api/boards/:id/snapshots/:sid`: the snapshot with its board file. */
export interface SnapshotDetailResponse { snapshot: ApiSnapshot; board: BoardFile }
/** `POST /api/boards/:id/snapshots/:sid/restore`: what was restored and the snapshot that undoes it. */
export interface RestoreResponse { restored: ApiSnapshot; beforeRestore: ApiSnapshot }
/** `GET /api/boards/:id/snapshots/:sid/compare`: from the snapshot to the live board. */
export type CompareResponse = BoardDiff;

/**
 * The notice a restore leaves in the document's `meta` map under `RESTORE_NOTICE_KEY`, so that every
 * connected screen can say who restored which snapshot, and when.
 */
export interface RestoreNotice {
  snapshotId: number;
  snapshotName: string;
  byUserId: number;
  byName: string;
  at: string;
}
export const RESTORE_NOTICE_KEY = 'lastRestore';
