/** Bring-up: test vectors, the printable bring-up sheet, the shared record of the bench, suspects and build photos. */
export { BringupPanel } from './bringup-panel';
export { useBringup, type Bringup } from './use-bringup';
