// Minimal typing of the parts of logic-solver (a SAT solver on npm) the analysis tests use.
declare module 'logic-solver' {
  export type Formula = string | object;
  export class Solver {
    require(...f: Formula[]): void;
    forbid(...f: Formula[]): void;
    solve(): { getTrueVars(): string[] } | null;
  }
  export function and(...f: Formula[]): Formula;
  export function or(...f: Formula[]): Formula;
  export function not(f: Formula): Formula;
  export function xor(...f: Formula[]): Formula;
  export function equiv(a: Formula, b: Formula): Formula;
  /** a whole number in binary (logic-solver's Bits) */
  export interface Bits { bits: Formula[] }
  export function weightedSum(f: Formula[], weights: number[] | number): Bits;
  export function constantBits(n: number): Bits;
  export function lessThan(a: Bits, b: Bits): Formula;
  export function lessThanOrEqual(a: Bits, b: Bits): Formula;
  export const TRUE: Formula;
  export const FALSE: Formula;
  const Logic: {
    Solver: typeof Solver; and: typeof and; or: typeof or; not: typeof not; xor: typeof xor; equiv: typeof equiv; TRUE: Formula; FALSE: Formula;
    weightedSum: typeof weightedSum; constantBits: typeof constantBits; lessThan: typeof lessThan; lessThanOrEqual: typeof lessThanOrEqual;
  };
  export default Logic;
}
