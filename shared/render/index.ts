/**
 * Board pictures and compares — the one way into `shared/render`: part geometry (shared with the
 * canvas), the SVG renderer behind snapshot thumbnails and the SVG/PNG export, and the difference
 * between a snapshot and the live board.
 */
export * from './geometry';
export * from './theme';
export * from './board-svg';
export * from './board-diff';
