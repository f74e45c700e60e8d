import type { Term } from '../../../shared/analysis';

export type Notation = 'overbar' | 'logic';

/** A literal: its name with an overbar (CSS overline) or with ¬ in front when complemented. */
function Lit({ name, negated, notation }: { name: string; negated: boolean; notation: Notation }) {
  if (!negated) return <span>{name}</span>;
  if (notation === 'logic') return <span>¬{name}</span>;
  return <span className="overline decoration-1" aria-label={`not ${name}`}>{name}</span>;
}

/** A readable SOP (`A·B̄ + Ā·B`, or `A ∧ ¬B ∨ ¬A ∧ B`) or POS rendered from its terms. */
export function ExpressionText({ terms, kind, notation }: { terms: Term[]; kind: 'sop' | 'pos'; notation: Notation }) {
  const and = notation === 'logic' ? ' ∧ ' : '·';
  const or = notation === 'logic' ? ' ∨ ' : ' + ';
  const inner = kind === 'sop' ? and : or;
  const outer = kind === 'sop' ? or : and;
  if (!terms.length) return <span>{kind === 'sop' ? '0' : '1'}</span>;
  if (terms.some((t) => !t.length)) return <span>{kind === 'sop' ? '1' : '0'}</span>;
  const paren = kind === 'pos' && terms.length > 1;
  return (
    <span className="font-mono">
      {terms.map((t, i) => (
        <span key={i}>
          {i > 0 && outer}
          {paren && t.length > 1 && '('}
          {t.map((l, j) => <span key={j}>{j > 0 && inner}<Lit {...l} notation={notation} /></span>)}
          {paren && t.length > 1 && ')'}
        </span>
      ))}
    </span>
  );
}
