/**
 * The build facts of each logic family: devices, packages, parts per gate, rails, heaters, fan-out,
 * maximum delays, warm-up, and the input network the level check uses. Every value carries its source.
 * What the simulator needs (typical delays, the floating-input reading, the caution) stays owned by
 * shared/sim's FAMILIES and is read from there (`familyFacts`), never copied here.
 */
import type { FamilyId } from '../board';
import { familyOf, type FamilyData } from '../sim';
import { COMMON_PRACTICE, FROM_MEMORY, sourced, type Sourced } from './sourced';
import { CMOS_4000B_PACKAGES, CMOS_74HC_PACKAGES, TTL_74LS_PACKAGES, type PackageSpec } from './packages';

/** How a family builds a gate. */
export type BuildStyle = 'ideal' | 'tube' | 'relay' | 'transistor' | 'package';

/** One line of the parts one gate (or one lamp) takes: `perGate + perInput × inputs` pieces. */
export interface PartLine {
  item: 'tube' | 'relay' | 'transistor' | 'diode' | 'resistor' | 'capacitor' | 'socket' | 'led' | 'lamp';
  /** type or value as printed in the parts list (a resistor's value in ohms in `ohms`) */
  name: string;
  /** a resistor's key in the level check's values (R1, R2…), so `--set` changes the parts list too */
  key?: string;
  ohms?: number;
  perGate: number;
  perInput?: number;
  source: string;
}

/** A supply rail. */
export interface Rail {
  name: string;
  volts: Sourced<number>;
}

/** The input network of a gate for the level check: node → R1 → grid/base, R2 from there to VN. */
export interface LevelNetwork {
  device: string;
  /** the input node: `or` (diode-OR / resistor inputs: one high input lifts it), `and` (DTL: one low input pulls it down) */
  style: 'or' | 'and';
  /** volts and ohms by key: VH logic high, VL logic low, VD diode drop, VS level shift, R1 series, R2 to VN, VN negative rail */
  values: Record<'VH' | 'VL' | 'VD' | 'VS' | 'R1' | 'R2' | 'VN', Sourced<number>>;
  /** the grid/base cannot rise above this once it conducts (grid current, base–emitter junction) */
  clamp: Sourced<number>;
  /** surely off below `off`, surely conducting above `on` (volts) */
  cutoff: Sourced<{ off: number; on: number }>;
  /** indicator stage: output → RS → LED, RSH across the LED; VP output high, VPL output low, VF LED forward drop */
  indicator?: Record<'VP' | 'VPL' | 'RS' | 'RSH' | 'VF', Sourced<number>>;
}

/** Build facts of one family (see the module comment). */
export interface BuildFamily {
  id: FamilyId;
  style: BuildStyle;
  /** gates a gate of this family is built as (discrete families convert the board to it first) */
  builtAs?: Sourced<'nor' | 'nand'>;
  /** gate kinds the family builds directly */
  nativeGates: Sourced<string[]>;
  /** device of one gate, with its parts */
  gateParts: PartLine[];
  /** parts of one indicator (a lamp part on the board) */
  indicatorParts: PartLine[];
  /** maximum propagation delays of one gate, ns (typical ones are the simulator's) */
  maxDelayNs: Sourced<{ tPLH: number; tPHL: number }>;
  /** loads one gate output may drive (null: no limit) */
  fanOut: Sourced<number | null>;
  /** heater warm-up before tubes conduct, seconds */
  warmUpS?: Sourced<number>;
  rails: Rail[];
  /** per gate, mA drawn from each rail at most (by rail name) */
  railMaPerGate?: Record<string, Sourced<number>>;
  heater?: { tube: string; volts: Sourced<number>; amps: Sourced<number> };
  packages?: PackageSpec[];
  /** quiescent and dynamic supply figures of CMOS (per gate C_PD, pF) */
  cpdPf?: Sourced<number>;
  level?: LevelNetwork;
  unusedInputAdvice: Sourced<string>;
}

const k = (ohms: number) => ohms;
const TUBE_NET: LevelNetwork = {
  device: '6AU6 control grid',
  style: 'or',
  values: {
    VH: sourced(24, 'CHECKS.md input-divider example: logic high +24 V (common practice, no source)'),
    VL: sourced(0, 'CHECKS.md input-divider example: logic low 0 V (common practice, no source)'),
    VD: sourced(0.7, 'CHECKS.md input-divider example: 0.7 V diode drop (common practice, no source)'),
    VS: sourced(0, COMMON_PRACTICE),
    R1: sourced(k(22_000), 'CHECKS.md input-divider example: 22 kΩ input node to grid (common practice, no source)'),
    R2: sourced(k(33_000), 'CHECKS.md input-divider example: 33 kΩ grid to −12 V (common practice, no source)'),
    VN: sourced(-12, 'CHECKS.md input-divider example: −12 V grid rail (common practice, no source)'),
  },
  clamp: sourced(0, 'grid clamped near 0 V by grid current through the grid stopper (CHECKS.md, common practice, no source)'),
  cutoff: sourced({ off: -2, on: -1 }, '6AU6 grid cutoff at low screen voltage about −1 to −2 V (from memory; RCA receiving-tube manual RC-22 is the source to cite if confirmed)'),
  indicator: {
    VP: sourced(24, 'plate at the +24 V supply when the tube is cut off (common practice, no source)'),
    VPL: sourced(2, 'plate of a conducting 6AU6 with a 4.7 kΩ load at a few volts (from memory)'),
    RS: sourced(k(10_000), FROM_MEMORY),
    RSH: sourced(k(4_700), FROM_MEMORY),
    VF: sourced(2.0, 'red LED forward voltage about 2 V (from memory)'),
  },
};

const TRANSISTOR_CUTOFF = sourced({ off: 0.5, on: 0.6 }, 'silicon base–emitter: off below about 0.5 V, conducting from about 0.6 V (from memory)');
const VBE = sourced(0.7, 'silicon base–emitter drop about 0.7 V once conducting (from memory)');
const LED_330: PartLine[] = [
  { item: 'led', name: 'LED, red', perGate: 1, source: COMMON_PRACTICE },
  { item: 'resistor', name: '330 Ω', ohms: 330, perGate: 1, source: 'LED series resistor for 5 V logic (from memory)' },
];

/** Build facts per family id. */
export const BUILD_FAMILIES: Record<FamilyId, BuildFamily> = {
  ideal: {
    id: 'ideal', style: 'ideal',
    nativeGates: sourced(['buffer', 'not', 'and', 'or', 'nand', 'nor', 'xor', 'xnor'], COMMON_PRACTICE),
    gateParts: [], indicatorParts: [],
    maxDelayNs: sourced({ tPLH: 1, tPHL: 1 }, 'unit delay (common practice, no source)'),
    fanOut: sourced(null, COMMON_PRACTICE), rails: [],
    unusedInputAdvice: sourced('An unconnected input reads X here; connect every input.', COMMON_PRACTICE),
  },
  'tube-drl-nor': {
    id: 'tube-drl-nor', style: 'tube',
    builtAs: sourced('nor', 'one pentode per gate as an inverting amplifier after a diode OR: a NOR (common practice, no source)'),
    nativeGates: sourced(['nor'], COMMON_PRACTICE),
    gateParts: [
      { item: 'tube', name: '6AU6 pentode', perGate: 1, source: 'one pentode per gate (common practice, no source)' },
      { item: 'socket', name: '7-pin miniature tube socket', perGate: 1, source: '6AU6 is a 7-pin miniature tube (from memory)' },
      { item: 'diode', name: '1N4148 (input diode)', perGate: 0, perInput: 1, source: 'a diode per input (common practice, no source)' },
      { item: 'resistor', name: 'input series', key: 'R1', ohms: 22_000, perGate: 1, source: TUBE_NET.values.R1.source },
      { item: 'resistor', name: 'grid to negative rail', key: 'R2', ohms: 33_000, perGate: 1, source: TUBE_NET.values.R2.source },
      { item: 'resistor', name: 'grid stopper', key: 'RG', ohms: 4_700, perGate: 1, source: FROM_MEMORY },
      { item: 'resistor', name: 'plate load', key: 'RL', ohms: 4_700, perGate: 1, source: FROM_MEMORY },
      { item: 'resistor', name: 'screen', key: 'RSC', ohms: 10_000, perGate: 1, source: FROM_MEMORY },
    ],
    indicatorParts: [
      { item: 'led', name: 'LED, red', perGate: 1, source: 'indicator stage: plate → series resistor → LED with a shunt resistor (CHECKS.md, common practice, no source)' },
      { item: 'resistor', name: 'indicator series', key: 'RS', ohms: 10_000, perGate: 1, source: FROM_MEMORY },
      { item: 'resistor', name: 'indicator shunt', key: 'RSH', ohms: 4_700, perGate: 1, source: FROM_MEMORY },
    ],
    maxDelayNs: sourced({ tPLH: 800, tPHL: 400 }, 'twice the typical delays (from memory)'),
    fanOut: sourced(4, 'diode-resistor inputs one plate load can hold up (from memory)'),
    warmUpS: sourced(11, 'indirectly heated receiving tubes conduct about 10 to 15 s after switch-on (from memory)'),
    rails: [
      { name: 'B+ (plate and screen)', volts: sourced(24, TUBE_NET.values.VH.source) },
      { name: 'C− (grid)', volts: sourced(-12, TUBE_NET.values.VN.source) },
    ],
    railMaPerGate: {
      'B+ (plate and screen)': sourced(24 / 4.7 + 24 / 10, "at most B+/plate load + B+/screen resistor with the tube fully on (Ohm's law bound, common practice, no source)"),
      'C− (grid)': sourced(12 / 33, "at most |C−|/33 kΩ with the grid clamped near 0 V (Ohm's law, common practice, no source)"),
    },
    heater: {
      tube: '6AU6',
      volts: sourced(6.3, '6AU6 heater 6.3 V (tube data tables)'),
      amps: sourced(0.3, '6AU6 heater 0.3 A (tube data tables)'),
    },
    level: TUBE_NET,
    unusedInputAdvice: sourced('An open input is pulled to the grid rail through the divider and reads low; a NOR needs nothing more, but leaving the diode out saves a part.', 'open input reads low (common practice, no source)'),
  },
  relay: {
    id: 'relay', style: 'relay',
    nativeGates: sourced(['buffer', 'not', 'and', 'or', 'nand', 'nor', 'xor', 'xnor'], 'contacts in series and parallel, make or break, give every gate (common practice, no source)'),
    gateParts: [
      { item: 'relay', name: '24 V relay, 4 changeover contacts', perGate: 1, source: 'one relay per gate output (common practice, no source)' },
      { item: 'socket', name: 'relay socket', perGate: 1, source: FROM_MEMORY },
      { item: 'diode', name: '1N4001 (coil flyback)', perGate: 1, source: 'a flyback diode across each coil (common practice, no source)' },
    ],
    indicatorParts: [{ item: 'lamp', name: '24 V indicator lamp', perGate: 1, source: FROM_MEMORY }],
    maxDelayNs: sourced({ tPLH: 10_000_000, tPHL: 5_000_000 }, 'operate 10 ms, release 5 ms at most (from memory)'),
    fanOut: sourced(4, 'four contact sets per relay (from memory)'),
    rails: [{ name: 'coil supply', volts: sourced(24, FROM_MEMORY) }],
    railMaPerGate: { 'coil supply': sourced(20, '24 V coil of about 1.2 kΩ: 20 mA when energised (from memory)') },
    unusedInputAdvice: sourced('An open input leaves its contact unpowered and reads low; no part is needed.', COMMON_PRACTICE),
  },
  rtl: {
    id: 'rtl', style: 'transistor',
    builtAs: sourced('nor', 'resistor-transistor NOR: one transistor per input on a shared collector resistor (from memory)'),
    nativeGates: sourced(['nor'], FROM_MEMORY),
    gateParts: [
      { item: 'transistor', name: '2N3904 NPN', perGate: 0, perInput: 1, source: 'one transistor per input (from memory)' },
      { item: 'resistor', name: 'base', key: 'R1', ohms: 470, perGate: 0, perInput: 1, source: 'about 450 to 470 Ω base resistors (from memory)' },
      { item: 'resistor', name: 'collector', key: 'RC', ohms: 640, perGate: 1, source: 'about 640 Ω collector resistor (from memory)' },
    ],
    indicatorParts: LED_330,
    maxDelayNs: sourced({ tPLH: 60, tPHL: 30 }, 'twice the typical delays (from memory)'),
    fanOut: sourced(5, FROM_MEMORY),
    rails: [{ name: 'VCC', volts: sourced(3.6, FROM_MEMORY) }],
    railMaPerGate: { VCC: sourced(3.6 / 640 * 1000, "at most VCC/640 Ω with the output low (Ohm's law bound, common practice, no source)") },
    level: {
      device: 'NPN base', style: 'or',
      values: {
        VH: sourced(3.6, 'unloaded high at VCC (from memory)'), VL: sourced(0.2, 'saturated collector about 0.2 V (from memory)'),
        VD: sourced(0, 'no input diode (common practice, no source)'), VS: sourced(0, COMMON_PRACTICE),
        R1: sourced(470, FROM_MEMORY), R2: sourced(10_000, 'base pull-down 10 kΩ (from memory)'), VN: sourced(0, 'pull-down to ground (from memory)'),
      },
      clamp: VBE, cutoff: TRANSISTOR_CUTOFF,
    },
    unusedInputAdvice: sourced('Leave out the transistor of an unused input; an open base is off and reads low.', COMMON_PRACTICE),
  },
  dtl: {
    id: 'dtl', style: 'transistor',
    builtAs: sourced('nand', 'diode-transistor NAND: a diode AND, two level-shift diodes and one inverting transistor (from memory)'),
    nativeGates: sourced(['nand'], FROM_MEMORY),
    gateParts: [
      { item: 'transistor', name: '2N3904 NPN', perGate: 1, source: 'one transistor per gate (from memory)' },
      { item: 'diode', name: '1N4148', perGate: 2, perInput: 1, source: 'a diode per input and two level-shift diodes (from memory)' },
      { item: 'resistor', name: 'input pull-up', key: 'RP', ohms: 2_000, perGate: 1, source: FROM_MEMORY },
      { item: 'resistor', name: 'base pull-down', key: 'R2', ohms: 5_000, perGate: 1, source: FROM_MEMORY },
      { item: 'resistor', name: 'collector', key: 'RC', ohms: 2_000, perGate: 1, source: FROM_MEMORY },
    ],
    indicatorParts: LED_330,
    maxDelayNs: sourced({ tPLH: 50, tPHL: 30 }, 'twice the typical delays (from memory)'),
    fanOut: sourced(8, FROM_MEMORY),
    rails: [{ name: 'VCC', volts: sourced(5, FROM_MEMORY) }],
    railMaPerGate: { VCC: sourced(5 / 2 + 5 / 2, "at most VCC/2 kΩ through the pull-up and the collector resistor (Ohm's law bound, common practice, no source)") },
    level: {
      device: 'NPN base', style: 'and',
      values: {
        VH: sourced(5, 'input node pulled up to VCC when every input is high (from memory)'), VL: sourced(0.2, 'saturated collector about 0.2 V (from memory)'),
        VD: sourced(0.7, 'input diode drop (from memory)'), VS: sourced(1.4, 'two level-shift diodes (from memory)'),
        R1: sourced(2_000, 'the 2 kΩ input pull-up, seen from the base through the level-shift diodes (from memory)'), R2: sourced(5_000, FROM_MEMORY), VN: sourced(0, FROM_MEMORY),
      },
      clamp: VBE, cutoff: TRANSISTOR_CUTOFF,
    },
    unusedInputAdvice: sourced('An open DTL input reads high (its diode does not conduct); tie it to a used input or leave its diode out.', 'open input reads high (common practice, no source)'),
  },
  'ttl-74ls': {
    id: 'ttl-74ls', style: 'package',
    nativeGates: sourced(['buffer', 'not', 'and', 'or', 'nand', 'nor', 'xor', 'xnor'], 'the 74LS series (from memory)'),
    gateParts: [], indicatorParts: LED_330,
    maxDelayNs: sourced({ tPLH: 15, tPHL: 15 }, 'SN74LS00 t_PLH, t_PHL 15 ns max (from memory); DM74LS00 (Fairchild) t_PLH max 10 ns at 15 pF'),
    fanOut: sourced(20, 'SN74LS00 (TI SDLS025): I_OL 8 mA / I_IL 0.4 mA = 20 LS loads'),
    rails: [{ name: 'VCC', volts: sourced(5, 'TI SDLS025: 5 V supply') }],
    packages: TTL_74LS_PACKAGES,
    unusedInputAdvice: sourced('An open TTL input reads high but picks up noise: tie unused NAND/AND inputs to a used input or to VCC through 1 kΩ, unused NOR/OR inputs to ground.', 'open TTL input reads high (from memory)'),
  },
  'cmos-4000b': {
    id: 'cmos-4000b', style: 'package',
    nativeGates: sourced(['buffer', 'not', 'and', 'or', 'nand', 'nor', 'xor', 'xnor'], 'the 4000B series (from memory)'),
    gateParts: [], indicatorParts: [
      { item: 'led', name: 'LED, red', perGate: 1, source: COMMON_PRACTICE },
      { item: 'resistor', name: '1 kΩ', ohms: 1_000, perGate: 1, source: 'LED series resistor for a 4000B output (from memory)' },
    ],
    maxDelayNs: sourced({ tPLH: 250, tPHL: 250 }, 'National CD4001BC datasheet: t_PHL 250 ns max at 5 V, C_L = 50 pF (t_PLH taken equal, from memory)'),
    fanOut: sourced(50, 'CMOS inputs draw no static current; 50 loads keeps edges reasonable (from memory)'),
    rails: [{ name: 'VDD', volts: sourced(5, 'National CD4001BC datasheet: 5 / 10 / 15 V') }],
    packages: CMOS_4000B_PACKAGES,
    cpdPf: sourced(14, 'National CD4001BC datasheet: C_PD 14 pF per gate'),
    unusedInputAdvice: sourced('CMOS inputs must never float: tie every unused input to VDD or VSS (or to a used input).', 'TI application report SCBA004'),
  },
  'cmos-74hc': {
    id: 'cmos-74hc', style: 'package',
    nativeGates: sourced(['buffer', 'not', 'and', 'or', 'nand', 'nor', 'xor', 'xnor'], 'the 74HC series (from memory)'),
    gateParts: [], indicatorParts: LED_330,
    maxDelayNs: sourced({ tPLH: 15, tPHL: 15 }, '74HC00 t_pd 15 ns max at 5 V, 25 °C (from memory)'),
    fanOut: sourced(10, '74HC drives 10 LSTTL loads (from memory)'),
    rails: [{ name: 'VCC', volts: sourced(5, 'Philips 74HC00 datasheet, Dec 1990: 5 V') }],
    packages: CMOS_74HC_PACKAGES,
    cpdPf: sourced(22, 'Philips 74HC00 datasheet, Dec 1990: C_PD 22 pF per gate'),
    unusedInputAdvice: sourced('CMOS inputs must never float: tie every unused input to VCC or GND (or to a used input).', 'TI application report SCBA004'),
  },
};

/** A family's build facts together with the simulator's facts of it (typical delays, floating input, caution). */
export interface FamilyFacts extends BuildFamily {
  sim: FamilyData;
}

/** Build and simulation facts of a family id (undefined for an unknown id). */
export function familyFacts(id: string): FamilyFacts | undefined {
  const build = (BUILD_FAMILIES as Record<string, BuildFamily>)[id];
  return build ? { ...build, sim: familyOf(build.id) } : undefined;
}
