/** A signal the timing strip can record: an input, an output or another named net. */
export interface SignalChoice {
  name: string;
  group: 'input' | 'output' | 'net';
}

const GROUP_TITLES: Record<SignalChoice['group'], string> = { input: 'Inputs', output: 'Outputs', net: 'Nets' };

/** A drop-down list of checkboxes: which signals the strip shows, in the order of the board. */
export function SignalPicker({ available, chosen, onChoose }: { available: SignalChoice[]; chosen: string[]; onChoose(names: string[]): void }) {
  const picked = new Set(chosen);
  const toggle = (name: string) => {
    const next = new Set(picked);
    if (next.has(name)) next.delete(name);
    else next.add(name);
    onChoose(available.map((s) => s.name).filter((n) => next.has(n)));
  };
  return (
    <details className="relative">
      <summary className="cursor-pointer rounded border border-bench-600 px-2 hover:bg-bench-700">
        Signals ({chosen.length})
      </summary>
      <div className="absolute z-20 mt-1 max-h-64 w-56 overflow-auto rounded border border-bench-600 bg-bench-800 p-2 shadow-lg">
        {(['input', 'output', 'net'] as const).map((group) => {
          const items = available.filter((s) => s.group === group);
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
            </fieldset>
          );
        })}
        <div className="flex gap-2 border-t border-bench-700 pt-1">
          <button type="button" className="underline" onClick={() => onChoose(available.filter((s) => s.group !== 'net').map((s) => s.name))}>Inputs + outputs</button>
          <button type="button" className="underline" onClick={() => onChoose([])}>None</button>
        </div>
      </div>
    </details>
  );
}
