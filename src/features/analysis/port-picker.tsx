import { MAX_TABLE_INPUTS } from '../../../shared/analysis';
import type { PortChoice } from './protocol';
import { plural } from '../../lib/plural';

function Checks({ legend, ports, chosen, onChange, testId }: { legend: string; ports: PortChoice[]; chosen: string[]; onChange(next: string[]): void; testId: string }) {
  // a newly ticked port goes last; the order (first = most significant) is kept otherwise
  const toggle = (name: string) => onChange(chosen.includes(name) ? chosen.filter((n) => n !== name) : [...chosen, name]);
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

/** The chosen inputs in table order; each but the first can move one place towards the most significant end. */
function Order({ chosen, onChange }: { chosen: string[]; onChange(next: string[]): void }) {
  if (chosen.length < 2) return null;
  const earlier = (i: number) => onChange([...chosen.slice(0, i - 1), chosen[i], chosen[i - 1], ...chosen.slice(i + 1)]);
  return (
    <div className="flex flex-wrap items-center gap-1 text-xs" data-testid="input-order">
      <span className="text-[11px] uppercase tracking-wide text-slate-500">Column order</span>
      {chosen.map((name, i) => (
        <span key={name} className="flex items-center rounded bg-mat-800 font-mono">
          {i > 0 && <button type="button" onClick={() => earlier(i)} className="px-1 text-slate-400 hover:text-amber-300" aria-label={`Move ${name} before ${chosen[i - 1]}`}>‹</button>}
          <span className="px-1">{name}</span>
        </span>
      ))}
    </div>
  );
}

/** Choose the enumerated inputs (and their order), the outputs, and the select inputs of the function map. */
export function PortPicker({ inputs, outputs, chosenInputs, chosenOutputs, select, onInputs, onOutputs, onSelect }: {
  inputs: PortChoice[]; outputs: PortChoice[]; chosenInputs: string[]; chosenOutputs: string[]; select: string[];
  onInputs(next: string[]): void; onOutputs(next: string[]): void; onSelect(next: string[]): void;
}) {
  const selectable = chosenInputs.map((n) => inputs.find((p) => p.name === n)).filter((p): p is PortChoice => p !== undefined);
  return (
    <div className="space-y-1.5">
      <Checks legend={`Inputs (${chosenInputs.length}, ${plural(2 ** chosenInputs.length, 'row')})`} ports={inputs} chosen={chosenInputs} onChange={onInputs} testId="pick-inputs" />
      <Order chosen={chosenInputs} onChange={onInputs} />
      {chosenInputs.length > MAX_TABLE_INPUTS && <p role="alert" className="text-xs text-rose-300">At most {MAX_TABLE_INPUTS} inputs (about a million rows).</p>}
      <Checks legend="Outputs" ports={outputs} chosen={chosenOutputs} onChange={onOutputs} testId="pick-outputs" />
      <Checks legend="Select inputs (function map)" ports={selectable} chosen={select} onChange={onSelect} testId="pick-select" />
    </div>
  );
}
