import Logic, { type Formula } from 'logic-solver';
import { parseExpression, type Expr } from '../../shared/analysis';

/** An expression as a logic-solver formula (an independent SAT solver from npm). */
export function toFormula(e: Expr): Formula {
  switch (e.kind) {
    case 'const': return e.value ? Logic.TRUE : Logic.FALSE;
    case 'var': return `v_${e.name}`;
    case 'not': return Logic.not(toFormula(e.arg));
    case 'and': return Logic.and(...e.args.map(toFormula));
    case 'or': return Logic.or(...e.args.map(toFormula));
    case 'xor': return Logic.xor(...e.args.map(toFormula));
    default: {
      const never: never = e;
      throw new Error(String(never));
    }
  }
}

/** The function given by its 1-rows and don't-care rows, as a formula over named inputs (first most significant). */
export function rowsFormula(names: string[], rows: number[]): Formula {
  const n = names.length;
  return Logic.or(...rows.map((m) => Logic.and(...names.map((name, i) => (m & (1 << (n - 1 - i)) ? `v_${name}` : Logic.not(`v_${name}`))))));
}

/**
 * True when `expr` agrees with the function on every care row, checked by SAT: no assignment outside
 * the don't-cares where they differ.
 */
export function satEquivalentOnCare(expr: string, names: string[], ones: number[], dontCares: number[]): boolean {
  const s = new Logic.Solver();
  const f = toFormula(parseExpression(expr));
  s.require(Logic.xor(f, rowsFormula(names, ones)));
  if (dontCares.length) s.forbid(rowsFormula(names, dontCares));
  return s.solve() === null;
}

/** Literal and term counts of a machine-form SOP or POS. */
export function counts(expr: string, kind: 'sop' | 'pos'): { terms: number; literals: number } {
  if (expr === '0' || expr === '1') return { terms: expr === (kind === 'sop' ? '0' : '1') ? 0 : 1, literals: 0 };
  const terms = expr.split(kind === 'sop' ? ' | ' : ' & ');
  return { terms: terms.length, literals: terms.reduce((s, t) => s + t.split(kind === 'sop' ? ' & ' : ' | ').length, 0) };
}
