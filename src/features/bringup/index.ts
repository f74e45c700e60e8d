/** Bring-up: test vectors, the printable bring-up sheet, the shared record of the bench, suspects and build photos. */
import { lazyNamed } from '../../lib/lazy-named';

// The panels and pages below are chunks of their own, loaded on first render (inside a Suspense boundary):
// the main script, which runs before a board's canvas draws, does not hold them.
export const BringupPanel = lazyNamed(() => import('./bringup-panel'), 'BringupPanel');
export { useBringup, type Bringup } from './use-bringup';
