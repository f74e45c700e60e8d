import type { Part } from '../../../shared/board';
import type { PortValue } from './use-live-sim';
import { LevelChip } from './level-chip';

/** What a row shows as a part's name (`shown`, cut to the column if long) and says in full (hover, screen readers). */
export interface RowName {
  shown: string;
  full: string;
}

/**
 * A row's name from the part and its readable name on the board (displayNames). An unlabelled constant
 * shows the level it is tied to ("logic 1"): its numbered name ("Constant 1") counts constants, which
 * reads like its value and does not fit the column; the numbered name stays in the full name.
 */
export function rowName(part: Part | undefined, name: string): RowName {
  if (part?.kind === 'const' && !part.label) {
    const shown = `logic ${part.value}`;
    return { shown, full: `${name}, tied to ${shown}` };
  }
  return { shown: name, full: name };
}

/** The name column: the shown name, the full one on hover and, where they differ, for screen readers. */
function NameCell({ name, partId }: { name: RowName; partId: string }) {
  return (
    <span className="w-24 shrink-0 truncate font-mono text-slate-200" title={`${name.full} (id ${partId})`}>
      {name.shown === name.full ? name.shown : (
        <>
          <span aria-hidden="true">{name.shown}</span>
          <span className="sr-only">{name.full}</span>
        </>
      )}
    </span>
  );
}

const btn = 'h-6 rounded border border-mat-600 bg-mat-800 px-2 text-xs hover:border-mat-500 hover:bg-mat-700 disabled:opacity-50';

/** One input of the board (its readable name, in full and with the id in the tooltip) with its value and, for switches and buttons, a control to operate it. */
export function InputRow({ port, name, onSet, disabled }: { port: PortValue; name: RowName; onSet(partId: string, value: boolean): void; disabled?: boolean }) {
  const high = port.value === '1';
  return (
    <li className="flex items-center gap-2 py-0.5" data-testid={`bench-input-${port.label}`}>
      <NameCell name={name} partId={port.partId} />
      <span className="w-14 text-[11px] text-slate-500">{port.kind}</span>
      <LevelChip level={port.value} />
      <span className="ml-auto">
        {port.kind === 'switch' && (
          <button type="button" className={btn} disabled={disabled} aria-pressed={high} aria-label={`Switch ${name.full}`} onClick={() => onSet(port.partId, !high)}>
            {high ? 'Turn off' : 'Turn on'}
          </button>
        )}
        {port.kind === 'button' && (
          <button
            type="button"
            className={btn}
            disabled={disabled}
            aria-label={`Press ${name.full}`}
            onPointerDown={(e) => {
              e.currentTarget.setPointerCapture?.(e.pointerId);
              onSet(port.partId, true);
            }}
            onPointerUp={() => onSet(port.partId, false)}
            onKeyDown={(e) => (e.key === ' ' || e.key === 'Enter') && !e.repeat && onSet(port.partId, true)}
            onKeyUp={(e) => (e.key === ' ' || e.key === 'Enter') && onSet(port.partId, false)}
          >
            Hold to press
          </button>
        )}
      </span>
    </li>
  );
}

/** One output (lamp or probe) and what it reads; on a net that does not settle, that it oscillates. */
export function OutputRow({ port, name }: { port: PortValue; name: RowName }) {
  return (
    <li className="flex items-center gap-2 py-0.5" data-testid={`bench-output-${port.label}`} data-oscillating={port.oscillating ? 'true' : undefined}>
      <NameCell name={name} partId={port.partId} />
      <span className="w-14 text-[11px] text-slate-500">{port.kind}</span>
      {port.oscillating ? (
        <span className="inline-flex h-5 items-center rounded border border-signal-x/60 bg-signal-x/20 px-1 font-mono text-xs text-signal-x"
          title="this net never settles: it keeps changing">oscillating</span>
      ) : <LevelChip level={port.value} />}
      {port.kind === 'lamp' && (
        <span
          aria-hidden="true"
          className={port.oscillating ? 'ml-auto h-3 w-3 animate-pulse rounded-full bg-signal-x'
            : port.value === '1' ? 'ml-auto h-3 w-3 rounded-full bg-signal-high shadow-[0_0_8px_#ffb347]' : 'ml-auto h-3 w-3 rounded-full border border-mat-500 bg-mat-800'}
        />
      )}
    </li>
  );
}
