import type { BoardRole } from '../../shared/api';

/** Owners and editors change the board; viewers only look (and try inputs privately). */
export function canEdit(role: BoardRole): boolean {
  return role === 'owner' || role === 'editor';
}

export function isOwner(role: BoardRole): boolean {
  return role === 'owner';
}
