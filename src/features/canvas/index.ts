/** The live shared canvas: the board session (Yjs + y-websocket + per-user undo) and the workspace that shows it. */
export { preconnectBoard, useBoardSession } from './session/use-board-session';
export type { BoardSession, BoardSessionOptions, BoardRole, ConnectionStatus } from './session/use-board-session';
export { BoardWorkspace } from './workspace/board-workspace';
export type { BoardWorkspaceProps } from './workspace/board-workspace';
export type { PartBadge, BadgeTone } from './flow/types';
export { ImportBoardButton } from './io/import-board-button';
export { importBoardFile } from './io/board-file-io';
export { useViewportFollow, useViewportPublish, type Viewport, type SizedViewport } from './workspace/use-viewport-follow';
