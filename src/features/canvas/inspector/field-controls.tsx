/**
 * The inspector's controls, one per kind of field. Each calls `onCommit` once per change the user means
 * (a pick, a click, or Enter / leaving a box), so each change is one named edit and one undo step.
 */
import { useRef, useState, type ReactNode } from 'react';
import type { InspectorField } from './inspector-fields';
import { parsePeriod, ROTATIONS } from './inspector-fields';

export const boxClass =
  'nodrag w-full rounded border border-mat-600 bg-mat-950 px-2 py-1 font-mono text-xs text-slate-100 focus:border-amber-glow focus:outline-none aria-[invalid=true]:border-rose-500';
const segClass = (on: boolean) =>
  `h-6 min-w-8 rounded px-1.5 font-mono text-[11px] ${on ? 'bg-amber-glow font-semibold text-mat-950' : 'border border-mat-600 bg-mat-800 text-slate-200 hover:border-mat-500'}`;

/** One line of the card: the field's name on the left, its control (and any refusal) on the right. */
export function Row({ title, htmlFor, error, children }: { title: string; htmlFor?: string; error?: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-[4.5rem_minmax(0,1fr)] items-start gap-x-2">
      <label className="pt-1 text-[11px] text-slate-400" htmlFor={htmlFor}>{title}</label>
      <div className="min-w-0">
        {children}
        {error ? <p className="mt-1 text-[11px] leading-snug text-rose-300" role="alert">{error}</p> : null}
      </div>
    </div>
  );
}

/** A text box kept as a draft until Enter or blur; Escape puts the stored value back. */
export function DraftBox({ id, value, onCommit, multiline, invalid, testId, placeholder }: {
  id: string; value: string; onCommit(text: string): void; multiline?: boolean; invalid?: boolean; testId: string; placeholder?: string;
}) {
  const [draft, setDraft] = useState(value);
  const [seen, setSeen] = useState(value);
  // Enter then blur must not send the same edit twice while the board catches up with the first.
  const sent = useRef<string | null>(null);
  if (value !== seen) { setSeen(value); setDraft(value); } // someone (maybe a collaborator) changed it
  const commit = () => {
    if (draft === value || draft === sent.current) return;
    sent.current = draft;
    onCommit(draft);
  };
  const common = {
    id, value: draft, className: boxClass, 'aria-invalid': invalid || undefined, 'data-testid': testId, placeholder,
    onChange: (e: { target: { value: string } }) => { sent.current = null; setDraft(e.target.value); },
    onBlur: commit,
  };
  if (multiline) {
    return <textarea {...common} rows={4} onKeyDown={(e) => { if (e.key === 'Escape') setDraft(value); }} />;
  }
  return (
    <input {...common} onKeyDown={(e) => {
      if (e.key === 'Enter') commit();
      if (e.key === 'Escape') setDraft(value);
    }} />
  );
}

export function RotationButtons({ value, onPick }: { value: number; onPick(r: (typeof ROTATIONS)[number]): void }) {
  return (
    <div className="grid grid-cols-4 gap-1" role="group" aria-label="Rotation">
      {ROTATIONS.map((r) => (
        <button key={r} type="button" className={segClass(value === r)} aria-pressed={value === r} data-testid={`inspector-rotation-${r}`}
          onClick={() => { if (value !== r) onPick(r); }}>{r}°</button>
      ))}
    </div>
  );
}

/** The control of one of the kind's own fields; `value` is the part's current value (or undefined). */
export function KindField({ spec, inputId, value, onCommit, invalid }: {
  spec: InspectorField; inputId: string; value: unknown; onCommit(value: unknown): void; invalid?: boolean;
}) {
  switch (spec.control) {
    case 'count':
      return (
        <select id={inputId} className={boxClass} value={String(value ?? spec.min)} data-testid={`inspector-${spec.field}`}
          onChange={(e) => onCommit(Number(e.target.value))}>
          {Array.from({ length: spec.max - spec.min + 1 }, (_, i) => spec.min + i).map((n) => <option key={n} value={n}>{n}</option>)}
        </select>
      );
    case 'check':
      return (
        <label className="flex items-center gap-2 text-xs text-slate-200">
          <input id={inputId} type="checkbox" className="accent-amber-500" checked={value === true} data-testid={`inspector-${spec.field}`}
            onChange={(e) => onCommit(e.target.checked)} />
          contact bounce
        </label>
      );
    case 'number':
      return (
        <div className="flex items-center gap-2">
          <PeriodBox id={inputId} value={typeof value === 'number' ? value : undefined} onCommit={onCommit} invalid={invalid} />
          <span className="shrink-0 text-[11px] text-slate-400" title="simulation time units">{spec.unit}</span>
        </div>
      );
    case 'bit':
      return (
        <div className="flex gap-1" role="group" aria-label={spec.title} id={inputId}>
          {[0, 1].map((b) => (
            <button key={b} type="button" className={segClass(value === b || (value === undefined && b === 0))} aria-pressed={value === b}
              data-testid={`inspector-${spec.field}-${b}`} onClick={() => { if (value !== b) onCommit(b); }}>{b}</button>
          ))}
        </div>
      );
    case 'text':
      return <DraftBox id={inputId} multiline value={typeof value === 'string' ? value : ''} onCommit={onCommit} testId={`inspector-${spec.field}`} />;
    default: {
      const never: never = spec;
      throw new Error(`unknown control ${String(never)}`);
    }
  }
}

/** Period box: empty means the simulator's default; a bad number is refused here with its reason. */
function PeriodBox({ id, value, onCommit, invalid }: { id: string; value: number | undefined; onCommit(v: unknown): void; invalid?: boolean }) {
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <div className="min-w-0 flex-1">
      <DraftBox id={id} value={value === undefined ? '' : String(value)} placeholder="default" invalid={invalid || !!problem} testId="inspector-period"
        onCommit={(text) => {
          const parsed = parsePeriod(text);
          setProblem(parsed.ok ? null : parsed.reason);
          if (parsed.ok && parsed.value !== value) onCommit(parsed.value);
        }} />
      {problem ? <p className="mt-1 text-[11px] text-rose-300" role="alert">{problem}</p> : null}
    </div>
  );
}
