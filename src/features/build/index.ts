/** The build sheet: the panel beside the bench (family, counts, parts, supply, timing, level check, conversion) and its printable page. */
export { BuildPanel } from './build-panel';
export { BuildSheetPage } from './build-sheet-page';
export { useBuildSheet, type BuildSheetState } from './use-build-sheet';
