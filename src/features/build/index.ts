/** The build sheet: the panel beside the bench (family, counts, parts, supply, timing, level check, conversion) and its printable page. */
import { lazyNamed } from '../../lib/lazy-named';

// The panels and pages below are chunks of their own, loaded on first render (inside a Suspense boundary):
// the main script, which runs before a board's canvas draws, does not hold them.
export const BuildPanel = lazyNamed(() => import('./build-panel'), 'BuildPanel');
export const BuildSheetPage = lazyNamed(() => import('./build-sheet-page'), 'BuildSheetPage');
export { useBuildSheet, type BuildSheetState } from './use-build-sheet';
