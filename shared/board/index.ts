/**
 * Gatefold boards — the one way into `shared/board`: kinds and pins, pin references, the label rule,
 * the board-file schema and its checks, the Yjs document and the named edits on it.
 */
export * from './kinds';
export * from './pins';
export * from './labels';
export * from './schema';
export * from './validate';
export * from './ydoc';
export * from './edits';
export * from './doc-check';
export * from './display-name';
export * from './modules';
export * from './flatten';
export * from './extract-module';
export * from './sim-log';
export * from './edits-modules';
export * from './module-doc-check';
