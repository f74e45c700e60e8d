import { FUNCTION_TITLES } from '../../../shared/analysis';
import { cn } from '../../lib/cn';
import { ExpressionText, type Notation } from './expression-text';
import type { AnalysisResult } from './protocol';

function copy(text: string) {
  void navigator.clipboard?.writeText(text);
}

/** Per output: its function name (two inputs), minimal SOP and POS readable and in machine form, flags. */
export function FormsView({ result, notation, focus, onFocus }: {
  result: AnalysisResult;
  notation: Notation;
  focus: string | null;
  onFocus(output: string | null): void;
}) {
  return (
    <ul className="space-y-2" data-testid="analysis-forms">
      {result.outputs.map((name, o) => {
        const f = result.forms[name];
        const t = result.terms[name];
        const hasUnknown = result.values[o].some((v) => v >= 2);
        return (
          <li key={name} className="rounded border border-mat-700 bg-mat-900/60 p-2" data-testid={`forms-${name}`}>
            <div className="flex flex-wrap items-center gap-2">
              <span className="font-mono font-semibold text-amber-300">{name}</span>
              {f.function && <span className="rounded bg-mat-700 px-1.5 text-xs" title={FUNCTION_TITLES[f.function]} data-testid={`function-${name}`} data-function={f.function}>{FUNCTION_TITLES[f.function]}</span>}
              {result.sequential[o] && <span className="rounded bg-fuchsia-950 px-1.5 text-xs text-fuchsia-200" title="A latch, flip-flop or feedback loop feeds this output: rows are simulated from power-on">depends on stored state</span>}
              <button type="button" onClick={() => onFocus(focus === name ? null : name)} aria-pressed={focus === name}
                className={cn('ml-auto rounded px-1.5 text-xs', focus === name ? 'bg-amber-glow text-mat-950' : 'text-slate-300 hover:bg-mat-700')}>
                {focus === name ? 'Hide on board' : 'Show on board'}
              </button>
            </div>
            {f.unknown && <p className="mt-1.5 text-sm text-fuchsia-200" data-testid={`unknown-${name}`}>Unknown: {name} is X or Z in every row, so it has no expression.</p>}
            {!f.unknown && (['sop', 'pos'] as const).map((kind) => (
              <div key={kind} className="mt-1.5">
                <div className="text-[11px] uppercase tracking-wide text-slate-500">{kind === 'sop' ? 'minimal sum of products' : 'minimal product of sums'}</div>
                <div className="text-sm text-slate-100">{t[kind].length || (f[kind] ?? '').length < 3 ? <ExpressionText terms={t[kind]} kind={kind} notation={notation} /> : <span className="text-slate-400">{f[kind]}</span>}</div>
                <div className="flex items-start gap-1.5">
                  <code className="min-w-0 flex-1 break-all font-mono text-[11px] text-slate-400" data-testid={`${kind}-${name}`}>{f[kind]}</code>
                  <button type="button" onClick={() => copy(f[kind] ?? '')} className="shrink-0 rounded px-1.5 text-[11px] text-slate-300 hover:bg-mat-700" aria-label={`Copy the ${kind.toUpperCase()} of ${name}`}>Copy</button>
                </div>
                {(kind === 'sop' ? f.sopAll : f.posAll).length > 1 && (
                  <details className="text-[11px] text-slate-400">
                    <summary>{(kind === 'sop' ? f.sopAll : f.posAll).length} equally small forms</summary>
                    <ul className="font-mono">{(kind === 'sop' ? f.sopAll : f.posAll).map((s) => <li key={s}>{s}</li>)}</ul>
                  </details>
                )}
              </div>
            ))}
            {!f.exact && <p className="mt-1 text-[11px] text-amber-300">Not proven minimal: {f.note}</p>}
            {hasUnknown && !f.unknown && <p className="mt-1 text-[11px] text-slate-400">Rows where {name} is X or Z are left free (don’t-care) in the forms.</p>}
          </li>
        );
      })}
    </ul>
  );
}
