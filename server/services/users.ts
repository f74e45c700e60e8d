import type { ApiUser } from '../../shared/api';
import type { Db } from '../db/knex';
import { findUserById, type UserRow } from '../db/users';

/** The API's user object (no hash). */
export function toApiUser(row: UserRow): ApiUser {
  return { id: row.id, email: row.email, name: row.name, isAdmin: Boolean(row.is_admin), createdAt: row.created_at };
}

export interface UsersService {
  /** The user, or undefined if the id is unknown. */
  getById(id: number): Promise<ApiUser | undefined>;
}

export function createUsersService(db: Db): UsersService {
  return {
    async getById(id) {
      const row = await findUserById(db, id);
      return row ? toApiUser(row) : undefined;
    },
  };
}
