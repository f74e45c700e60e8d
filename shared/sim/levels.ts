/** The four signal values: low, high, unknown, undriven (high impedance). */
export type Level = '0' | '1' | 'X' | 'Z';
export const LEVELS: readonly Level[] = ['0', '1', 'X', 'Z'];
