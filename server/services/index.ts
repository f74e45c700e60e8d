import type { AppConfig } from '../config';
import type { Db } from '../db/knex';
import { createAuthService, type AuthService } from './auth';
import { createAuthzService, type AuthzService } from './authz';
import { createBoardsService, type BoardMetaWriter, type BoardsService } from './boards';
import type { AppEvents } from './events';
import { createLibraryService, type BoardDocEditor, type BoardFileReader, type LibraryService } from './library';
import { createInvitationsService, type InvitationsService } from './invitations';
import type { Mailer } from './mail';
import { createMembersService, type MembersService } from './members';
import { createOutboxService, type OutboxService } from './outbox';
import { createUsersService, type UsersService } from './users';

/** The business services of the foundation; features add their own beside these. */
export interface Services {
  auth: AuthService;
  authz: AuthzService;
  users: UsersService;
  boards: BoardsService;
  members: MembersService;
  invitations: InvitationsService;
  outbox: OutboxService;
  library: LibraryService;
}

export function createServices(db: Db, config: AppConfig, events: AppEvents, mailer: Mailer, boardMeta: BoardMetaWriter & BoardFileReader & BoardDocEditor): Services {
  const boards = createBoardsService(db, events, boardMeta);
  const invitations = createInvitationsService(db, events, mailer, boards);
  const authz = createAuthzService(db);
  return {
    auth: createAuthService(db, config, mailer, events),
    authz,
    users: createUsersService(db),
    boards,
    members: createMembersService(db, events, mailer, invitations),
    invitations,
    outbox: createOutboxService(db),
    library: createLibraryService(db, authz, boardMeta),
  };
}
