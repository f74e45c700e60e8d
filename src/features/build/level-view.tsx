/** The level check: grid/base voltage for all inputs low and one input high, margins, the indicator stage; values editable. */
import type { LevelCheckResult } from '../../../shared/build';
import { milliamps, volts } from './format';
import type { Settings } from './use-build-sheet';

const EDITABLE: [key: string, label: string][] = [
  ['VH', 'logic high, V'], ['VN', 'negative rail, V'], ['R1', 'series R1'], ['R2', 'R2 to rail'], ['RS', 'LED series'], ['RSH', 'LED shunt'],
];

function Verdict({ pass }: { pass: boolean }) {
  return <span className={pass ? 'text-emerald-300' : 'text-rose-300'}>{pass ? 'pass' : 'warn'}</span>;
}

export function LevelView({ check, settings, fields, onChange }: { check: LevelCheckResult; settings: Settings; fields: Record<string, string>; onChange(next: Settings): void }) {
  const keys = EDITABLE.filter(([k]) => k in check.values);
  return (
    <div className="space-y-1.5" data-testid="level-check">
      <p className="text-[11px] text-slate-300">
        {check.device}: all inputs low <span className="font-mono" data-testid="level-low">{volts(check.low.grid)}</span> (margin {check.low.margin.toFixed(2)} V below {check.cutoff.off} V, <Verdict pass={check.low.pass} />);
        one input high <span className="font-mono" data-testid="level-high">{volts(check.high.grid)}</span>
        {check.high.clamped && <> (open-circuit {volts(check.high.openCircuit)}, clamped)</>}, margin {check.high.margin.toFixed(2)} V above {check.cutoff.on} V, <Verdict pass={check.high.pass} />.
        {' '}<strong>Levels, both states: <span data-testid="level-verdict"><Verdict pass={check.pass} /></span></strong>
      </p>
      {check.indicator && (
        <p className="text-[11px] text-slate-300" data-testid="level-indicator">
          Indicator: LED {milliamps(check.indicator.onMa)} when the output is high; {volts(check.indicator.offVolts)} across it when low ({check.indicator.offMa ? milliamps(check.indicator.offMa) : 'dark'}), <Verdict pass={check.indicator.pass} />.
        </p>
      )}
      <div className="grid grid-cols-3 gap-1">
        {keys.map(([key, label]) => (
          <label key={key} className="text-[10px] text-slate-500">
            {key} <span className="sr-only">{label}</span>
            <input aria-label={`${key} (${label})`} data-testid={`level-${key}`} placeholder={String(check.values[key])}
              value={settings[key] ?? ''} onChange={(e) => onChange({ ...settings, [key]: e.target.value })}
              className={`w-full rounded border bg-mat-950 px-1 py-0.5 font-mono text-[11px] text-slate-100 ${fields[key] ? 'border-rose-600' : 'border-mat-600'}`} />
          </label>
        ))}
      </div>
      <p className="text-[10px] text-slate-500">Resistors as 22k, 4k7 or 470; an empty field keeps the family's value. Sources: {check.sources.cutoff}.</p>
    </div>
  );
}
