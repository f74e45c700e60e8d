/**
 * Output parts: lamp and probe. They only read their net; they show the net's own level, so an
 * undriven net shows Z (not the family's floating value, which is what a gate input would see).
 */
export const INDICATOR_SHOWS_NET_LEVEL = true;
