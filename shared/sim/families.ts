/**
 * Logic families: what an open (undriven) input reads and the typical propagation delays.
 * Delays are in ns; the simulator divides them by `timeUnitNs` and rounds (at least 1 unit).
 */
import type { FamilyId } from '../board';
import type { Level } from './levels';

/** Simulation data of one logic family. */
export interface FamilyData {
  id: FamilyId;
  title: string;
  /** what a reader of an undriven net sees */
  floating: Level;
  /** typical low-to-high and high-to-low propagation delay of one gate, ns */
  tPLH: number;
  tPHL: number;
  /** length of one simulation time unit, ns */
  timeUnitNs: number;
  /** where the figures come from */
  source: string;
  /** safety caution to show with this family (dangerous voltages), when there is one */
  caution?: string;
}

const TUBE_CAUTION = 'Tube circuits carry dangerous voltages (plate and grid supplies, heater transformers on mains). '
  + 'Build, power and probe them only as your local electrical codes and qualified practice allow.';
const RELAY_CAUTION = 'Relay logic is often powered from mains-fed supplies. '
  + 'Wire and test supplies only as your local electrical codes and qualified practice allow.';

/** Per family id. */
export const FAMILIES: Record<FamilyId, FamilyData> = {
  // Unit delay: 1 time unit for every gate; floating inputs are unknown.
  ideal: { id: 'ideal', title: 'Ideal (unit delay)', floating: 'X', tPLH: 1, tPHL: 1, timeUnitNs: 1,
    source: 'common practice, no source' },
  // Diode-resistor NOR driving a tube grid: an open input is pulled to the negative grid rail, reads low.
  // Delays of a few hundred ns for small receiving tubes with plate loads of tens of kΩ — from memory.
  'tube-drl-nor': { id: 'tube-drl-nor', title: 'Vacuum tube, diode-resistor NOR', floating: '0', tPLH: 400, tPHL: 200, timeUnitNs: 10,
    source: 'floating low: common practice, no source; delays from memory', caution: TUBE_CAUTION },
  // Relay logic: an open coil input is unpowered (low). Operate about 5 ms, release about 2 ms — from memory.
  relay: { id: 'relay', title: 'Relay', floating: '0', tPLH: 5_000_000, tPHL: 2_000_000, timeUnitNs: 100_000,
    source: 'floating low: common practice, no source; delays from memory', caution: RELAY_CAUTION },
  // RTL: an open input leaves the transistor base unbiased (off), which reads as low. Delays from memory.
  rtl: { id: 'rtl', title: 'Resistor-transistor logic', floating: '0', tPLH: 30, tPHL: 15, timeUnitNs: 1,
    source: 'floating low: common practice, no source; delays from memory' },
  // DTL: an open input diode does not conduct, so the input reads high, as in TTL. Delays from memory.
  dtl: { id: 'dtl', title: 'Diode-transistor logic', floating: '1', tPLH: 25, tPHL: 15, timeUnitNs: 1,
    source: 'floating high: common practice, no source; delays from memory' },
  // SN7400 (TI datasheet SDLS025): t_PLH 11 typ, t_PHL 7 typ ns; DM74LS00 (Fairchild) t_PLH max 10 ns.
  // LS typicals 9 / 10 ns are from memory. An open TTL input reads high (from memory).
  'ttl-74ls': { id: 'ttl-74ls', title: 'TTL 74LS', floating: '1', tPLH: 9, tPHL: 10, timeUnitNs: 1,
    source: 'TI datasheet SDLS025 (SN7400 11/7 ns typ); LS typicals from memory; open input high from memory' },
  // CD4001B (National CD4001BC datasheet, C_L = 50 pF): t_PHL 120 typ ns at 5 V; t_PLH taken equal (from memory).
  // CMOS inputs must never float (TI application report SCBA004): we assume a pull-down, reads low.
  'cmos-4000b': { id: 'cmos-4000b', title: 'CMOS 4000B (5 V)', floating: '0', tPLH: 120, tPHL: 120, timeUnitNs: 10,
    source: 'National CD4001BC datasheet (t_PHL 120 ns typ at 5 V); TI SCBA004 (no floating inputs; pull-down assumed)' },
  // 74HC00 (Philips datasheet, Dec 1990): t_pd typ 7 ns at 5 V, 15 pF. Pull-down assumed (TI SCBA004).
  'cmos-74hc': { id: 'cmos-74hc', title: 'CMOS 74HC (5 V)', floating: '0', tPLH: 7, tPHL: 7, timeUnitNs: 1,
    source: 'Philips 74HC00 datasheet, Dec 1990 (t_pd 7 ns typ at 5 V); TI SCBA004 (pull-down assumed)' },
};

/** The family's data (ideal for an unknown id). */
export function familyOf(id: FamilyId | undefined): FamilyData {
  return (id && FAMILIES[id]) || FAMILIES.ideal;
}

/** A family's gate delays in integer time units (each at least 1). */
export function familyDelays(id: FamilyId | undefined): { rise: number; fall: number } {
  const f = familyOf(id);
  return {
    rise: Math.max(1, Math.round(f.tPLH / f.timeUnitNs)),
    fall: Math.max(1, Math.round(f.tPHL / f.timeUnitNs)),
  };
}
