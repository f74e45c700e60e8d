import type { PortValue } from './use-live-sim';
import { LevelChip } from './level-chip';

const btn = 'h-6 rounded border border-mat-600 bg-mat-800 px-2 text-xs hover:border-mat-500 hover:bg-mat-700 disabled:opacity-50';

/** One input of the board with its value and, for switches and buttons, a control to operate it. */
export function InputRow({ port, onSet, disabled }: { port: PortValue; onSet(partId: string, value: boolean): void; disabled?: boolean }) {
  const high = port.value === '1';
  return (
    <li className="flex items-center gap-2 py-0.5" data-testid={`bench-input-${port.label}`}>
      <span className="w-16 truncate font-mono text-slate-200" title={port.partId}>{port.label}</span>
      <span className="w-14 text-[11px] text-slate-500">{port.kind}</span>
      <LevelChip level={port.value} />
      <span className="ml-auto">
        {port.kind === 'switch' && (
          <button type="button" className={btn} disabled={disabled} aria-pressed={high} aria-label={`Switch ${port.label}`} onClick={() => onSet(port.partId, !high)}>
            {high ? 'Turn off' : 'Turn on'}
          </button>
        )}
        {port.kind === 'button' && (
          <button
            type="button"
            className={btn}
            disabled={disabled}
            aria-label={`Press ${port.label}`}
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

/** One output (lamp or probe) and what it reads. */
export function OutputRow({ port }: { port: PortValue }) {
  return (
    <li className="flex items-center gap-2 py-0.5" data-testid={`bench-output-${port.label}`}>
      <span className="w-16 truncate font-mono text-slate-200" title={port.partId}>{port.label}</span>
      <span className="w-14 text-[11px] text-slate-500">{port.kind}</span>
      <LevelChip level={port.value} />
      {port.kind === 'lamp' && (
        <span
          aria-hidden="true"
          className={port.value === '1' ? 'ml-auto h-3 w-3 rounded-full bg-signal-high shadow-[0_0_8px_#ffb347]' : 'ml-auto h-3 w-3 rounded-full border border-mat-500 bg-mat-800'}
        />
      )}
    </li>
  );
}
