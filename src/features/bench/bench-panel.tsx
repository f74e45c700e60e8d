import { useMemo, type ReactNode } from 'react';
import { displayNames } from '../../../shared/board';
import { familyOf } from '../../../shared/sim';
import { ClockControls } from './clock-controls';
import { FamilyField } from './family-field';
import { InputRow, OutputRow, rowName } from './port-rows';
import { SettleStatus } from './settle-status';
import { TryOutChip } from './try-out-chip';
import { StateChanges } from './state-changes';
import type { LiveSim, LiveSimSession, PortValue } from './use-live-sim';
import { plural } from '../../lib/plural';

/** The bench: every input and output with its value, the clock, stored state, settle status and family. */
export function BenchPanel({ sim, session }: { sim: LiveSim; session: LiveSimSession }) {
  const unitNs = familyOf(sim.family).timeUnitNs;
  const hasClock = sim.inputs.some((p) => p.kind === 'clock');
  const names = useMemo(() => displayNames(session.board), [session.board]);
  const partsById = useMemo(() => new Map(session.board.parts.map((p) => [p.id, p])), [session.board]);
  const nameOf = (p: PortValue) => rowName(partsById.get(p.partId), names.get(p.partId) ?? p.label);
  return (
    <section aria-label="Bench" data-testid="bench-panel" className="space-y-3 p-3 text-sm">
      <header className="flex items-center gap-2">
        <h2 className="font-semibold text-amber-300">Bench</h2>
        {!sim.ready && !sim.error && <span className="text-xs text-slate-500">starting the simulation…</span>}
      </header>
      {sim.tryOut.active && (sim.tryOut.values.size > 0 || sim.tryOut.clock) && <TryOutChip onReset={sim.tryOut.clear} />}
      {sim.error && <p role="alert" className="rounded border border-rose-800 bg-rose-950/50 p-2 text-xs text-rose-200">Simulation stopped: {sim.error}</p>}
      <Block title="Inputs">
        {sim.inputs.length === 0 ? (
          <p className="text-xs text-slate-500">No switches, buttons, clocks or constants yet.</p>
        ) : (
          <ul>{sim.inputs.map((p) => <InputRow key={p.partId} port={p} name={nameOf(p)} onSet={sim.setInput} />)}</ul>
        )}
        {sim.tryOut.active && <p className="mt-1 text-[11px] text-slate-500">You are viewing: input changes are a private try-out.</p>}
      </Block>
      <Block title="Outputs">
        {sim.outputs.length === 0 ? <p className="text-xs text-slate-500">No lamps or probes yet.</p> : <ul>{sim.outputs.map((p) => <OutputRow key={p.partId} port={p} name={nameOf(p)} />)}</ul>}
      </Block>
      <Block title={hasClock ? 'Clock' : 'Clock (no clock part on the board)'}>
        <ClockControls clock={sim.clock} />
        {sim.tryOut.active && <p className="mt-1 text-[11px] text-slate-500">You are viewing: your clock steps are a private try-out.</p>}
      </Block>
      <Block title="State">
        <button type="button" onClick={sim.resetState} className="h-7 rounded border border-mat-600 bg-mat-800 px-2.5 text-xs hover:bg-mat-700" title="Latches and flip-flops back to their power-on value; gate loops to X">
          Reset stored state
        </button>
        <StateChanges changes={sim.room.changes} />
        <div className="mt-2">
          <SettleStatus report={sim.report} family={sim.family} board={session.board} names={names} />
        </div>
        <dl className="mt-2 grid grid-cols-2 gap-x-2 font-mono text-[11px] text-slate-400" data-testid="bench-stats">
          <dt>sim time</dt>
          <dd>{sim.stats.time} u ({formatNs(sim.stats.time * unitNs)})</dd>
          <dt>events</dt>
          <dd>{sim.stats.events}</dd>
          <dt>last settle</dt>
          <dd>{plural(sim.stats.lastEvents, 'event')}</dd>
        </dl>
      </Block>
      <Block title="Family">
        <FamilyField family={session.board.family} readOnly={session.readOnly} doc={session.doc} origin={session.origin} />
      </Block>
    </section>
  );
}

function Block({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="border-t border-mat-700 pt-2">
      <h3 className="mb-1 text-[11px] font-semibold uppercase tracking-wide text-slate-500">{title}</h3>
      {children}
    </div>
  );
}

/** Nanoseconds in the unit a builder would say (ns, µs, ms, s). */
export function formatNs(ns: number): string {
  if (ns < 1e3) return `${round(ns)} ns`;
  if (ns < 1e6) return `${round(ns / 1e3)} µs`;
  if (ns < 1e9) return `${round(ns / 1e6)} ms`;
  return `${round(ns / 1e9)} s`;
}
const round = (v: number) => (v >= 100 ? Math.round(v) : Math.round(v * 10) / 10);
