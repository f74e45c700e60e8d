/**
 * The sixteen functions of two inputs A and B (CONTRACTS §2), indexed by their output column over
 * AB = 00, 01, 10, 11 read as a 4-bit number (00 is the most significant bit).
 */
export const FUNCTION_IDS = [
  'FALSE', 'AND', 'A_AND_NOT_B', 'A', 'NOT_A_AND_B', 'B', 'XOR', 'OR',
  'NOR', 'XNOR', 'NOT_B', 'A_OR_NOT_B', 'NOT_A', 'NOT_A_OR_B', 'NAND', 'TRUE',
] as const;
export type FunctionId = (typeof FUNCTION_IDS)[number];

/** Standard logic names for the UI (the usual names of the binary connectives). */
export const FUNCTION_TITLES: Record<FunctionId, string> = {
  FALSE: 'constant 0 (contradiction)',
  AND: 'AND (conjunction)',
  A_AND_NOT_B: 'A AND NOT B (material nonimplication, A ↛ B)',
  A: 'A (projection)',
  NOT_A_AND_B: 'NOT A AND B (converse nonimplication, A ↚ B)',
  B: 'B (projection)',
  XOR: 'XOR (exclusive or)',
  OR: 'OR (disjunction)',
  NOR: 'NOR (Peirce arrow, A ↓ B)',
  XNOR: 'XNOR (biconditional, A ↔ B)',
  NOT_B: 'NOT B (negation of B)',
  A_OR_NOT_B: 'A OR NOT B (converse implication, A ← B)',
  NOT_A: 'NOT A (negation of A)',
  NOT_A_OR_B: 'NOT A OR B (material implication, A → B)',
  NAND: 'NAND (Sheffer stroke, A ↑ B)',
  TRUE: 'constant 1 (tautology)',
};

/**
 * The id of a two-input function from its output column (4 characters over AB = 00, 01, 10, 11).
 * Returns undefined when the column has a character other than 0 and 1.
 */
export function functionIdOfColumn(column: string): FunctionId | undefined {
  if (!/^[01]{4}$/.test(column)) return undefined;
  return FUNCTION_IDS[parseInt(column, 2)];
}

/** The output column (over AB = 00, 01, 10, 11) of a function id. */
export function columnOfFunction(id: FunctionId): string {
  return FUNCTION_IDS.indexOf(id).toString(2).padStart(4, '0');
}
