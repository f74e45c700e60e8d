/** The build sheet's figures as tables — shared by the panel and the printable page. */
import type { BuildSheet } from '../../../shared/build';
import { duration, milliamps, rate, watts } from './format';

const th = 'px-1.5 py-0.5 text-left font-normal text-slate-500';
const td = 'px-1.5 py-0.5 font-mono';

function Table({ label, head, rows, testId }: { label: string; head: string[]; rows: (string | number)[][]; testId?: string }) {
  return (
    <table className="gf-build-table w-full border-collapse text-[11px]" aria-label={label} data-testid={testId}>
      <thead><tr>{head.map((h) => <th key={h} className={th}>{h}</th>)}</tr></thead>
      <tbody>{rows.map((r, i) => <tr key={i} className="border-t border-mat-800">{r.map((c, k) => <td key={k} className={td}>{c}</td>)}</tr>)}</tbody>
    </table>
  );
}

function H({ children }: { children: string }) {
  return <h3 className="mt-2 text-xs font-semibold text-slate-300">{children}</h3>;
}

/** Everything but the level check (which the panel shows with its editable values). */
export function SheetView({ sheet }: { sheet: BuildSheet }) {
  const d = sheet.devices;
  const deviceLine = [
    d.tubes ? `${d.tubes} tube${d.tubes > 1 ? 's' : ''}` : '', d.relays ? `${d.relays} relay${d.relays > 1 ? 's' : ''}` : '',
    d.transistors ? `${d.transistors} transistor${d.transistors > 1 ? 's' : ''}` : '', d.packageCount ? `${d.packageCount} package${d.packageCount > 1 ? 's' : ''}` : '',
  ].filter(Boolean).join(' · ') || 'no devices';
  return (
    <div className="space-y-1" data-testid="build-sheet">
      <p className="text-xs text-slate-300">
        <span data-testid="build-gate-count">{sheet.gateCount} gate{sheet.gateCount === 1 ? '' : 's'}</span>
        {' → '}<strong className="text-amber-200" data-testid="build-devices">{deviceLine}</strong>
      </p>
      {sheet.builtAs && (
        <p className="text-[11px] text-slate-400">Built as {sheet.builtAs.to.toUpperCase()} gates: {sheet.builtAs.gates} ({sheet.builtAs.inverters} inverter{sheet.builtAs.inverters === 1 ? '' : 's'}{sheet.builtAs.complementsUsed ? `, ${sheet.builtAs.complementsUsed} switch complement${sheet.builtAs.complementsUsed === 1 ? '' : 's'} used` : ''}).</p>
      )}
      <H>Gates by kind</H>
      <Table label="Gates by kind" head={['kind', 'inputs', 'count']} rows={sheet.gates.map((g) => [g.kind.toUpperCase(), g.inputs ?? '–', g.count])} />
      {d.packages.length > 0 && (
        <>
          <H>Packages</H>
          <Table label="Packages" testId="build-packages" head={['package', 'gates each', 'used', 'packages', 'spare']} rows={d.packages.map((p) => [p.name, p.perPackage, p.used, p.packages, p.spare])} />
        </>
      )}
      <H>Parts list</H>
      <Table label="Parts list" testId="build-parts" head={['part', 'qty']} rows={sheet.parts.map((p) => [p.name, p.quantity])} />
      <H>Supply</H>
      <Table label="Rails" testId="build-rails" head={['rail', 'volts', 'current', 'power']} rows={[
        ...sheet.rails.map((r) => [r.name, `${r.volts} V`, milliamps(r.currentMa), watts(r.powerW)]),
        ...(sheet.heater ? [[`heaters (${sheet.heater.tubes} × ${sheet.heater.tube})`, `${sheet.heater.volts} V`, `${sheet.heater.amps.toFixed(2)} A`, watts(sheet.heater.watts)]] : []),
      ]} />
      {sheet.heater && <p className="text-[11px] text-slate-400" data-testid="build-heater">Heater current {sheet.heater.amps.toFixed(2)} A ({sheet.heater.tubes} × {sheet.heater.ampsEach} A at {sheet.heater.volts} V).</p>}
      <p className="text-[11px] text-slate-500">{sheet.supply.note}{sheet.supply.dynamicMaPerMHz !== undefined ? `; switching adds ${milliamps(sheet.supply.dynamicMaPerMHz)} per MHz` : ''}.</p>
      <H>Timing</H>
      {sheet.criticalPath ? (
        <p className="text-[11px] text-slate-300" data-testid="build-critical">
          Critical path {sheet.criticalPath.levels} gate delays: {duration(sheet.criticalPath.delayNs)} typical, {duration(sheet.criticalPath.maxDelayNs)} worst case
          {' '}(<span className="font-mono">{sheet.criticalPath.parts.join(' → ')}</span>).
          {sheet.maxClockHz && <> Clock limit <strong className="text-amber-200" data-testid="build-clock">{rate(sheet.maxClockHz.typical)}</strong> ({rate(sheet.maxClockHz.worstCase)} worst case).</>}
        </p>
      ) : <p className="text-[11px] text-slate-500">No gates, no critical path.</p>}
      {sheet.warmUpS !== null && <p className="text-[11px] text-slate-400">Heaters need about {sheet.warmUpS} s after switch-on; until then every tube gate's output sits high.</p>}
      <H>Fan-out</H>
      {sheet.fanOut.warnings.length
        ? <ul className="list-disc pl-4 text-[11px] text-amber-300" data-testid="build-fanout">{sheet.fanOut.warnings.map((w) => <li key={w.net}>{w.net} ({w.driver}, {w.kind}) drives {w.loads} loads; this family allows {w.limit}. {w.advice}</li>)}</ul>
        : <p className="text-[11px] text-slate-500">Every output within the family's fan-out{sheet.fanOut.limit !== null ? ` of ${sheet.fanOut.limit}` : ''}.</p>}
      {sheet.unusedInputs.pins.length > 0 && (
        <p className="text-[11px] text-slate-300" data-testid="build-unused">Open inputs {sheet.unusedInputs.pins.join(', ')}: {sheet.unusedInputs.advice}</p>
      )}
      {sheet.notes.map((n) => <p key={n} className="text-[11px] text-slate-500">{n}</p>)}
    </div>
  );
}
