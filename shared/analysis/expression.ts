import { cubeLiterals, type Cube } from './cube';

/** One literal of a term, ready for display. */
export interface Literal { name: string; negated: boolean }
/** A term of a two-level form: a product (SOP) or a sum (POS) of literals; empty = the constant. */
export type Term = Literal[];

/** The SOP terms of a cover of 1-rows, literals in input order. */
export function sopTerms(cover: Cube[], names: string[]): Term[] {
  return cover.map((c) => cubeLiterals(c, names.length).map((l) => ({ name: names[l.input], negated: l.negated })));
}

/** The POS terms of a cover of 0-rows: each cube of zeros is the sum of its complemented literals. */
export function posTerms(cover: Cube[], names: string[]): Term[] {
  return cover.map((c) => cubeLiterals(c, names.length).map((l) => ({ name: names[l.input], negated: !l.negated })));
}

const lit = (l: Literal) => (l.negated ? `~${l.name}` : l.name);

/**
 * Machine form of a sum of products (CONTRACTS §2): `A & ~B | ~A & B`; `0` when there is no term,
 * `1` when a term has no literal.
 */
export function formatSop(terms: Term[]): string {
  if (!terms.length) return '0';
  if (terms.some((t) => !t.length)) return '1';
  return terms.map((t) => t.map(lit).join(' & ')).join(' | ');
}

/** Machine form of a product of sums: `(A | B) & (~A | ~B)`; a one-literal sum, or a lone sum, has no parentheses. */
export function formatPos(terms: Term[]): string {
  if (!terms.length) return '1';
  if (terms.some((t) => !t.length)) return '0';
  // parentheses only where a sum meets another term: a lone sum reads `~A | B`
  if (terms.length === 1) return terms[0].map(lit).join(' | ');
  return terms.map((t) => (t.length === 1 ? lit(t[0]) : `(${t.map(lit).join(' | ')})`)).join(' & ');
}

/** Readable notations for the UI: `logic` uses ¬ ∧ ∨, `overbar` uses a combining overline and · +. */
export type ReadableStyle = 'logic' | 'overbar';

function readableLit(l: Literal, style: ReadableStyle): string {
  if (!l.negated) return l.name;
  return style === 'logic' ? `¬${l.name}` : [...l.name].map((ch) => `${ch}\u0305`).join('');
}

/** Readable sum of products, e.g. `A·B̄ + Ā·B` or `A ∧ ¬B ∨ ¬A ∧ B`. */
export function readableSop(terms: Term[], style: ReadableStyle = 'logic'): string {
  if (!terms.length) return '0';
  if (terms.some((t) => !t.length)) return '1';
  const and = style === 'logic' ? ' ∧ ' : '·';
  const or = style === 'logic' ? ' ∨ ' : ' + ';
  return terms.map((t) => t.map((l) => readableLit(l, style)).join(and)).join(or);
}

/** Readable product of sums, e.g. `(A + B)·(Ā + B̄)` or `(A ∨ B) ∧ (¬A ∨ ¬B)`. */
export function readablePos(terms: Term[], style: ReadableStyle = 'logic'): string {
  if (!terms.length) return '1';
  if (terms.some((t) => !t.length)) return '0';
  const and = style === 'logic' ? ' ∧ ' : '·';
  const or = style === 'logic' ? ' ∨ ' : ' + ';
  if (terms.length === 1) return terms[0].map((l) => readableLit(l, style)).join(or);
  return terms.map((t) => (t.length === 1 ? readableLit(t[0], style) : `(${t.map((l) => readableLit(l, style)).join(or)})`)).join(and);
}
