/** The board list and one board's REST side: queries, create form, title editor, delete, safety caution. */
export { boardKeys, boardQueryOptions, boardsQueryOptions } from './api';
export { BoardTitleEditor } from './components/board-title-editor';
export { BoardsTable } from './components/boards-table';
export { CreateBoardForm } from './components/create-board-form';
export { DeleteBoardButton } from './components/delete-board-button';
export { SafetyCaution } from './components/safety-caution';
