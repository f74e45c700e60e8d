import { useEffect, useRef, useState } from 'react';
import { createPortal } from 'react-dom';

/** A signal the timing strip can record: an input, an output or another named net. */
export interface SignalChoice {
  name: string;
  group: 'input' | 'output' | 'net';
}

/** Most nets listed at once; a filter finds the rest (a large board has thousands). */
const MAX_NETS_SHOWN = 100;

const GROUP_TITLES: Record<SignalChoice['group'], string> = { input: 'Inputs', output: 'Outputs', net: 'Nets' };

/** A drop-down list of checkboxes: which signals the strip shows, in the order of the board. */
export function SignalPicker({ available, chosen, defaults, onChoose }: {
  available: SignalChoice[];
  chosen: string[];
  /** what the strip records until someone picks (inputs that can change, and outputs); default: every input and output */
  defaults?: string[];
  onChoose(names: string[]): void;
}) {
  const [filter, setFilter] = useState('');
  const [anchor, setAnchor] = useState<DOMRect | null>(null);
  const button = useRef<HTMLButtonElement>(null);
  const popup = useRef<HTMLDivElement>(null);
  // The strip sits in a clipped bottom dock, so the list lives in a portal above the button;
  // a press outside it or Escape closes it.
  useEffect(() => {
    if (!anchor) return;
    const away = (e: PointerEvent) => {
      const t = e.target as Node;
      if (!popup.current?.contains(t) && !button.current?.contains(t)) setAnchor(null);
    };
    const esc = (e: KeyboardEvent) => e.key === 'Escape' && setAnchor(null);
    document.addEventListener('pointerdown', away);
    document.addEventListener('keydown', esc);
    return () => {
      document.removeEventListener('pointerdown', away);
      document.removeEventListener('keydown', esc);
    };
  }, [anchor]);
  const picked = new Set(chosen);
  const needle = filter.trim().toLowerCase();
  const toggle = (name: string) => {
    const next = new Set(picked);
    if (next.has(name)) next.delete(name);
    else next.add(name);
    onChoose(available.map((s) => s.name).filter((n) => next.has(n)));
  };
  const list = anchor && (
    <div
      ref={popup}
      role="dialog"
      aria-label="Signals to record"
      style={{ position: 'fixed', left: anchor.left, bottom: window.innerHeight - anchor.top + 4 }}
      className="z-50 max-h-80 w-60 overflow-auto rounded border border-mat-600 bg-mat-800 p-2 text-xs text-slate-200 shadow-lg"
    >
      <input
        type="search"
        value={filter}
        onChange={(e) => setFilter(e.target.value)}
        placeholder="Filter signals"
        aria-label="Filter signals"
        className="mb-2 h-7 w-full rounded border border-mat-600 bg-mat-950 px-2 font-mono text-slate-200 focus:border-amber-glow focus:outline-none"
      />
      {(['input', 'output', 'net'] as const).map((group) => {
        const matching = available.filter((s) => s.group === group && (!needle || s.name.toLowerCase().includes(needle)));
        const items = group === 'net' ? matching.slice(0, MAX_NETS_SHOWN) : matching;
        if (!items.length) return null;
        return (
          <fieldset key={group} className="mb-2">
            <legend className="text-slate-400">{GROUP_TITLES[group]}</legend>
            {items.map((s) => (
              <label key={s.name} className="flex items-center gap-2 font-mono">
                <input type="checkbox" checked={picked.has(s.name)} onChange={() => toggle(s.name)} />
                {s.name}
              </label>
            ))}
            {matching.length > items.length && <p className="text-slate-500">{matching.length - items.length} more — type to filter</p>}
          </fieldset>
        );
      })}
      <div className="flex gap-2 border-t border-mat-700 pt-1">
        <button type="button" className="underline" title="The inputs that can change (switches, buttons, clocks) and the outputs"
          onClick={() => onChoose(defaults ?? available.filter((s) => s.group !== 'net').map((s) => s.name))}>Inputs + outputs</button>
        <button type="button" className="underline" onClick={() => onChoose([])}>None</button>
      </div>
    </div>
  );
  return (
    <>
      <button
        ref={button}
        type="button"
        aria-expanded={anchor !== null}
        className="rounded border border-mat-600 px-2 hover:bg-mat-700"
        onClick={() => setAnchor((a) => (a ? null : button.current!.getBoundingClientRect()))}
      >
        Signals ({chosen.length})
      </button>
      {list && createPortal(list, document.body)}
    </>
  );
}
