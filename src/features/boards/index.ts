/** The board list and one board's REST side: queries, create form, title editor, delete, safety caution. */
import { lazyNamed } from '../../lib/lazy-named';

// The panels and pages below are chunks of their own, loaded on first render (inside a Suspense boundary):
// the main script, which runs before a board's canvas draws, does not hold them.
export { boardKeys, boardQueryOptions, boardsQueryOptions } from './api';
export { BoardTitleEditor } from './components/board-title-editor';
export const BoardsTable = lazyNamed(() => import('./components/boards-table'), 'BoardsTable');
export { CreateBoardForm } from './components/create-board-form';
export { DeleteBoardButton } from './components/delete-board-button';
export { SafetyCaution } from './components/safety-caution';
