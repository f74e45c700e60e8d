/**
 * A board's server side in one folder: the store interface (store.ts; the SQLite implementation is
 * server/db/board-store.ts), the registry of open rooms and the way to a board's content
 * (registry.ts, board-docs.ts), the room (room.ts, update-log.ts, protocol.ts) and the websocket
 * upgrade (sockets.ts, auth.ts). Nothing here imports server/db: the store is injected.
 */
export { BoardRegistry, type BoardActivity, type BoardRegistryDeps } from './registry';
export { attachBoardSockets, type SocketsHandle } from './sockets';
export { exampleBoardContent, readExampleBoard } from './examples';
export { loadBoardDoc } from './board-docs';
export { ServerOrigin, type BoardFanout, type BoardMeta, type BoardStore, type NewBoardUpdate, type StoredBoard } from './store';
export { CollabError, DEFAULT_COLLAB_OPTIONS, type CollabOptions, type SocketContext } from './types';
export type { Room } from './room';
