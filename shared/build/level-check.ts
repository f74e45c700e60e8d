/**
 * The level check: does a gate's input network really switch its tube or transistor? Divider arithmetic
 * (Ohm's law): the input node feeds the grid/base through R1, and R2 pulls the grid/base to the negative
 * rail VN, so the open-circuit grid voltage is (V_node·R2 + VN·R1)/(R1 + R2). Once positive of the clamp
 * (grid current, base–emitter junction) it cannot rise further. Low case: every input low; high case:
 * one input high, less its diode drop (diode-OR inputs). DTL (`and` inputs) reads one input low against
 * every input high. Plus the indicator stage: output → RS → LED with RSH across it.
 */
import type { LevelNetwork } from './families';

export interface LevelCase {
  /** input node voltage */
  node: number;
  /** grid/base voltage without grid or base current */
  openCircuit: number;
  /** grid/base voltage after the clamp (the contract's `grid`) */
  grid: number;
  clamped: boolean;
  /** volts to spare: below the cutoff (low case) or above the conduction point (high case) */
  margin: number;
  pass: boolean;
  /** current into the grid/base when clamped, mA */
  clampCurrentMa?: number;
}

export interface IndicatorCheck {
  /** LED current with the output high, mA: (VP − VF)/RS − VF/RSH */
  onMa: number;
  /** voltage across the LED with the output low: VPL·RSH/(RS + RSH) */
  offVolts: number;
  /** LED current with the output low, mA (0 below the forward voltage) */
  offMa: number;
  /** lit at least `visibleMa` when on, dark (below VF) when off */
  pass: boolean;
  visibleMa: number;
}

export interface LevelCheckResult {
  device: string;
  low: LevelCase;
  high: LevelCase;
  cutoff: { off: number; on: number };
  pass: boolean;
  /** every value used (defaults with the given settings over them), volts and ohms */
  values: Record<string, number>;
  /** keys whose value came from the settings rather than the family's default */
  changed: string[];
  sources: Record<string, string>;
  indicator?: IndicatorCheck;
}

/** A lit indicator LED is visible from about 0.5 mA (from memory). */
export const VISIBLE_LED_MA = 0.5;

const round = (x: number, digits = 6) => Number(x.toFixed(digits));

/** Runs the level check of a network with `settings` (volts and ohms by key) over its defaults. */
export function levelCheck(net: LevelNetwork, settings: Record<string, number> = {}): LevelCheckResult {
  const values: Record<string, number> = {};
  const sources: Record<string, string> = {};
  const changed: string[] = [];
  const take = (key: string, def: { value: number; source: string }) => {
    const given = settings[key];
    values[key] = given ?? def.value;
    sources[key] = given === undefined ? def.source : 'given';
    if (given !== undefined) changed.push(key);
  };
  for (const [key, def] of Object.entries(net.values)) take(key, def);
  if (net.indicator) for (const [key, def] of Object.entries(net.indicator)) take(key, def);
  const { VH, VL, VD, VS, R1, R2, VN } = values;
  const clamp = net.clamp.value;
  const { off, on } = net.cutoff.value;
  const divide = (node: number) => (node * R2 + VN * R1) / (R1 + R2);
  const at = (node: number, high: boolean): LevelCase => {
    const open = divide(node);
    const clamped = open > clamp;
    const grid = clamped ? clamp : open;
    const margin = high ? grid - on : off - grid;
    const c: LevelCase = { node: round(node), openCircuit: round(open), grid: round(grid), clamped, margin: round(margin), pass: margin > 0 };
    if (clamped) c.clampCurrentMa = round(((node - clamp) / R1 - (clamp - VN) / R2) * 1000);
    return c;
  };
  const low = at(net.style === 'or' ? VL - VS : VL + VD - VS, false);
  const high = at(net.style === 'or' ? VH - VD - VS : VH - VS, true);
  const result: LevelCheckResult = {
    device: net.device, low, high, cutoff: { off, on }, pass: low.pass && high.pass, values, changed,
    sources: { ...sources, clamp: net.clamp.source, cutoff: net.cutoff.source },
  };
  if (net.indicator) result.indicator = indicatorCheck(values);
  return result;
}

/** The indicator stage by Ohm's law (CHECKS.md "Indicator stage", common practice, no source). */
export function indicatorCheck(v: Record<string, number>): IndicatorCheck {
  const { VP, VPL, RS, RSH, VF } = v;
  const ledCurrent = (vout: number) => (vout * RSH / (RS + RSH) < VF ? 0 : ((vout - VF) / RS - VF / RSH) * 1000);
  const onMa = round(ledCurrent(VP));
  const offVolts = round(VPL * RSH / (RS + RSH));
  const offMa = round(ledCurrent(VPL));
  return { onMa, offVolts, offMa, pass: onMa >= VISIBLE_LED_MA && offMa === 0, visibleMa: VISIBLE_LED_MA };
}
