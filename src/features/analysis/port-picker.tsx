import { MAX_TABLE_INPUTS } from '../../../shared/analysis';
import type { PortChoice } from './protocol';

function Checks({ legend, ports, chosen, onChange, testId }: { legend: string; ports: PortChoice[]; chosen: string[]; onChange(next: string[]): void; testId: string }) {
  const toggle = (name: string) => {
    const set = new Set(chosen);
    if (set.has(name)) set.delete(name); else set.add(name);
    // keep board (file) order: rows count with the first chosen input most significant
    onChange(ports.map((p) => p.name).filter((n) => set.has(n)));
  };
  return (
    <fieldset className="min-w-0" data-testid={testId}>
      <legend className="mb-0.5 text-[11px] uppercase tracking-wide text-slate-500">{legend}</legend>
      {ports.length === 0 ? <p className="text-xs text-slate-500">none on the board</p> : (
        <div className="flex flex-wrap gap-x-2.5 gap-y-0.5">
          {ports.map((p) => (
            <label key={p.partId} className="flex items-center gap-1 font-mono text-xs" title={p.kind}>
              <input type="checkbox" checked={chosen.includes(p.name)} onChange={() => toggle(p.name)} className="accent-amber-400" />
              {p.name}
            </label>
          ))}
        </div>
      )}
    </fieldset>
  );
}

/** Choose the enumerated inputs, the outputs, and the select inputs of the function map. */
export function PortPicker({ inputs, outputs, chosenInputs, chosenOutputs, select, onInputs, onOutputs, onSelect }: {
  inputs: PortChoice[]; outputs: PortChoice[]; chosenInputs: string[]; chosenOutputs: string[]; select: string[];
  onInputs(next: string[]): void; onOutputs(next: string[]): void; onSelect(next: string[]): void;
}) {
  const selectable = inputs.filter((p) => chosenInputs.includes(p.name));
  return (
    <div className="space-y-1.5">
      <Checks legend={`Inputs (${chosenInputs.length}, ${2 ** chosenInputs.length} rows)`} ports={inputs} chosen={chosenInputs} onChange={onInputs} testId="pick-inputs" />
      {chosenInputs.length > MAX_TABLE_INPUTS && <p role="alert" className="text-xs text-rose-300">At most {MAX_TABLE_INPUTS} inputs (about a million rows).</p>}
      <Checks legend="Outputs" ports={outputs} chosen={chosenOutputs} onChange={onOutputs} testId="pick-outputs" />
      <Checks legend="Select inputs (function map)" ports={selectable} chosen={select} onChange={onSelect} testId="pick-select" />
    </div>
  );
}
