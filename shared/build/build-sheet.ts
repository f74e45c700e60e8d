/**
 * The build sheet of a board for a logic family: gates by kind, devices (tubes, relays, transistors,
 * packages packed by gates per package), the parts list, current per rail, heater current and power,
 * the critical path and the clock it allows, fan-out warnings, unused-input advice and, for tube and
 * transistor families, the level check. Figures are the family table's (each with its source) times counts.
 */
import { FAMILY_IDS, isInputKind, isOutputKind, type BoardFile } from '../board';
import { compileBoard, type Netlist } from '../sim';
import { convertBoard } from './convert';
import { familyFacts, type FamilyFacts, type PartLine } from './families';
import { fanOutWarnings, type FanOutWarning } from './fan-out';
import { levelCheck, type LevelCheckResult } from './level-check';
import { CMOS_4000B_SUPPLY, type PackageSpec } from './packages';
import { criticalPath, type CriticalPath } from './timing';
import { BuildError, formatOhms, parseSettings } from './values';

export { fanOutWarnings, type FanOutWarning };

export interface PackageCount { name: string; kind: string; inputs?: number; perPackage: number; used: number; packages: number; spare: number; source: string }
export interface PartsListLine { item: string; name: string; value?: string; quantity: number; source: string }
export interface RailLine { name: string; volts: number; currentMa: number; powerW: number; source: string }

export interface BuildSheet {
  family: string;
  familyTitle: string;
  title: string;
  gates: { kind: string; inputs?: number; count: number }[];
  gateCount: number;
  /** discrete families build every gate as NOR or NAND: the counts after conversion */
  builtAs: { to: 'nor' | 'nand'; gates: number; inverters: number; complementsUsed: number; source: string } | null;
  devices: { tubes: number; relays: number; transistors: number; packages: PackageCount[]; packageCount: number };
  parts: PartsListLine[];
  rails: RailLine[];
  heater: { tube: string; volts: number; ampsEach: number; tubes: number; amps: number; watts: number; source: string } | null;
  supply: { typicalMa: number; maxMa: number; powerW: number; dynamicMaPerMHz?: number; note: string };
  criticalPath: (CriticalPath & { tpdNs: number; tpdMaxNs: number; source: string }) | null;
  maxClockHz: { typical: number; worstCase: number } | null;
  fanOut: { limit: number | null; source: string; warnings: FanOutWarning[] };
  unusedInputs: { pins: string[]; advice: string; source: string };
  warmUpS: number | null;
  caution: string | null;
  levelCheck?: LevelCheckResult;
  notes: string[];
}

export interface BuildSheetOptions {
  /** level-check and parts values: `R1=22k,VN=-12` or an object; VDD picks 5, 10 or 15 V for CMOS 4000B */
  set?: string | Record<string, string | number>;
}

const round = (x: number, digits = 6) => Number(x.toFixed(digits));

/** The family's facts, or a BuildError naming the known ids. */
export function requireFamily(id: string): FamilyFacts {
  const f = familyFacts(id);
  if (!f) throw new BuildError(`unknown family "${id}" (families: ${FAMILY_IDS.join(', ')})`, { family: id });
  return f;
}

/** The build sheet of `board` in family `familyId` (see the module comment). */
export function buildSheet(board: BoardFile, familyId: string, opts: BuildSheetOptions = {}): BuildSheet {
  const fam = requireFamily(familyId);
  const settings = parseSettings(opts.set);
  const notes: string[] = [];
  const vdd = settings.VDD ?? 5;
  if (settings.VDD !== undefined && (fam.id !== 'cmos-4000b' || ![5, 10, 15].includes(vdd))) {
    throw new BuildError(fam.id === 'cmos-4000b' ? `VDD=${vdd}: CMOS 4000B figures are for 5, 10 or 15 V` : `VDD applies to cmos-4000b only`, { VDD: String(settings.VDD) });
  }
  const netlist = compileBoard({ ...board, family: fam.id });
  const logic = netlist.parts.filter((p) => !isInputKind(p.kind) && !isOutputKind(p.kind) && p.kind !== 'note');
  const gatesMap = new Map<string, { kind: string; inputs?: number; count: number }>();
  for (const p of logic) {
    const inputs = 'inputs' in p.part ? p.part.inputs : undefined;
    const key = `${p.kind}/${inputs ?? ''}`;
    const g = gatesMap.get(key) ?? { kind: p.kind, inputs, count: 0 };
    g.count++;
    gatesMap.set(key, g);
  }
  const lamps = netlist.outputs.filter((p) => p.kind === 'lamp').length;

  // Devices and parts
  const parts = new PartsList();
  const devices = { tubes: 0, relays: 0, transistors: 0, packages: [] as PackageCount[], packageCount: 0 };
  let builtAs: BuildSheet['builtAs'] = null;
  let supplyTyp = 0;
  let supplyMax = 0;
  const addPerGate = (inputs: number) => {
    for (const line of fam.gateParts) parts.add(line, line.perGate + (line.perInput ?? 0) * inputs, settings);
  };
  if (fam.builtAs && logic.length) {
    const converted = convertBoard(board, fam.builtAs.value);
    builtAs = { to: fam.builtAs.value, gates: converted.gates, inverters: converted.inverters, complementsUsed: converted.complementsUsed, source: fam.builtAs.source };
    const cn = compileBoard(converted.board);
    for (const g of cn.parts) {
      if (g.kind !== fam.builtAs.value) continue;
      // an inverter's tied inputs are one input of the real gate
      addPerGate(new Set(g.inputs).size);
    }
    if (fam.style === 'tube') devices.tubes = converted.gates;
    else devices.transistors = parts.count('transistor');
  } else if (fam.style === 'relay') {
    devices.relays = logic.reduce((n, p) => n + (p.kind === 'dff' ? 2 : 1), 0);
    for (let i = 0; i < devices.relays; i++) addPerGate(0);
  } else if (fam.style === 'package' && fam.packages) {
    devices.packages = packPackages(logic.map((p) => ({ kind: p.kind, inputs: 'inputs' in p.part ? p.part.inputs : undefined })), fam.packages, notes);
    devices.packageCount = devices.packages.reduce((n, p) => n + p.packages, 0);
    const factor = fam.id === 'cmos-4000b' ? CMOS_4000B_SUPPLY[vdd as 5 | 10 | 15].iddFactor : 1;
    for (const p of devices.packages) {
      const spec = fam.packages.find((s) => s.name === p.name)!;
      supplyTyp += p.packages * spec.supplyMa.typ * factor;
      supplyMax += p.packages * spec.supplyMa.max * factor;
    }
    parts.addRaw('socket', 'DIP IC socket', devices.packageCount, 'one socket per package (common practice, no source)');
    parts.addRaw('capacitor', '100 nF decoupling capacitor', devices.packageCount, 'one per package across its supply pins (common practice, no source)');
  }
  const gatesBuilt = fam.style === 'tube' || fam.style === 'transistor' ? builtAs?.gates ?? 0 : fam.style === 'relay' ? devices.relays : 0;
  for (const line of fam.indicatorParts) parts.add(line, line.perGate * lamps, settings);

  // Level check (tube and transistor families), which also gives the indicator current
  let level: LevelCheckResult | undefined;
  if (fam.level) level = levelCheck(fam.level, settings);

  // Rails
  const rails: RailLine[] = [];
  const railMa = new Map(fam.rails.map((r) => [r.name, 0]));
  if (fam.railMaPerGate) for (const [name, per] of Object.entries(fam.railMaPerGate)) railMa.set(name, (railMa.get(name) ?? 0) + per.value * gatesBuilt);
  const firstRail = fam.rails[0];
  if (firstRail) {
    const ledMa = level?.indicator ? level.indicator.onMa : fam.style === 'package' || fam.style === 'transistor' ? ledMaOf(fam, firstRail.volts.value) : 0;
    railMa.set(firstRail.name, (railMa.get(firstRail.name) ?? 0) + ledMa * lamps);
    if (fam.style === 'package') railMa.set(firstRail.name, (railMa.get(firstRail.name) ?? 0) + supplyMax);
  }
  for (const r of fam.rails) {
    const volts = r.name === 'VDD' ? vdd : r.volts.value;
    const ma = railMa.get(r.name) ?? 0;
    const per = fam.railMaPerGate?.[r.name];
    rails.push({
      name: r.name, volts, currentMa: round(ma, 4), powerW: round(Math.abs(volts * ma) / 1000, 4),
      source: [per ? `${per.source}, × ${gatesBuilt} gates` : fam.style === 'package' ? 'package maximum supply current × packages (see packages)' : '', lamps && r === firstRail ? `+ ${lamps} indicator(s) lit` : '', `rail: ${r.volts.source}`].filter(Boolean).join('; '),
    });
  }
  const heater = fam.heater && devices.tubes
    ? {
      tube: fam.heater.tube, volts: fam.heater.volts.value, ampsEach: fam.heater.amps.value, tubes: devices.tubes,
      amps: round(devices.tubes * fam.heater.amps.value, 4), watts: round(devices.tubes * fam.heater.amps.value * fam.heater.volts.value, 4),
      source: `${fam.heater.volts.source}; ${fam.heater.amps.source}`,
    }
    : null;

  // Timing
  const tpd = delaysOf(fam, vdd);
  const cp = criticalPath(netlist, tpd.typ, tpd.max);
  const critical = cp ? { ...cp, tpdNs: tpd.typ, tpdMaxNs: tpd.max, source: tpd.source } : null;
  const maxClockHz = cp && fam.id !== 'ideal' ? { typical: round(1e9 / cp.delayNs, 3), worstCase: round(1e9 / cp.maxDelayNs, 3) } : null;
  if (fam.builtAs && logic.length) notes.push(`The critical path is counted on the board as drawn; built as ${fam.builtAs.value.toUpperCase()} gates it may take more levels (convert the board first for an exact figure).`);

  const dynamicMaPerMHz = fam.cpdPf ? round(fam.cpdPf.value * 1e-12 * vdd * 1e6 * 1000 * logic.length, 6) : undefined;
  const supplyTotalMa = [...railMa.values()].reduce((a, b) => a + Math.abs(b), 0);
  return {
    family: fam.id, familyTitle: fam.sim.title, title: board.title,
    gates: [...gatesMap.values()], gateCount: logic.length, builtAs, devices,
    parts: parts.lines(),
    rails, heater,
    supply: {
      typicalMa: round(fam.style === 'package' ? supplyTyp : supplyTotalMa, 4), maxMa: round(fam.style === 'package' ? supplyMax : supplyTotalMa, 4),
      powerW: round(rails.reduce((w, r) => w + r.powerW, 0) + (heater?.watts ?? 0), 4),
      ...(dynamicMaPerMHz !== undefined ? { dynamicMaPerMHz } : {}),
      note: fam.style === 'package' ? 'packages only (typical, maximum); CMOS adds C_PD·V·f per gate when switching' : 'worst case: every device conducting, every indicator lit; heaters apart',
    },
    criticalPath: critical, maxClockHz,
    fanOut: { limit: fam.fanOut.value, source: fam.fanOut.source, warnings: fanOutWarnings(netlist, fam.fanOut.value) },
    unusedInputs: { pins: unusedInputs(netlist), advice: fam.unusedInputAdvice.value, source: fam.unusedInputAdvice.source },
    warmUpS: fam.warmUpS?.value ?? null,
    caution: fam.sim.caution ?? null,
    ...(level ? { levelCheck: level } : {}),
    notes,
  };
}

function ledMaOf(fam: FamilyFacts, volts: number): number {
  const r = fam.indicatorParts.find((l) => l.item === 'resistor')?.ohms;
  // red LED about 2 V (from memory), the rest across the series resistor (Ohm's law)
  return r ? Math.max(0, (volts - 2) / r) * 1000 : 0;
}

function delaysOf(fam: FamilyFacts, vdd: number): { typ: number; max: number; source: string } {
  if (fam.id === 'cmos-4000b' && vdd !== 5) {
    const s = CMOS_4000B_SUPPLY[vdd as 10 | 15];
    return { typ: s.tPHL.typ ?? fam.sim.tPHL, max: s.tPHL.max, source: s.source };
  }
  return {
    typ: Math.max(fam.sim.tPLH, fam.sim.tPHL), max: Math.max(fam.maxDelayNs.value.tPLH, fam.maxDelayNs.value.tPHL),
    source: `typical: ${fam.sim.source}; maximum: ${fam.maxDelayNs.source}`,
  };
}

/** Packs gates into packages: the package of the same kind with the fewest inputs ≥ the gate's, else a tree of two-input ones. */
export function packPackages(gates: { kind: string; inputs?: number }[], specs: PackageSpec[], notes: string[]): PackageCount[] {
  const used = new Map<string, number>();
  for (const g of gates) {
    const same = specs.filter((s) => s.kind === g.kind).sort((a, b) => (a.inputs ?? 0) - (b.inputs ?? 0));
    const fit = same.find((s) => s.inputs === undefined || s.inputs >= (g.inputs ?? 0));
    if (fit) { used.set(fit.name, (used.get(fit.name) ?? 0) + 1); continue; }
    const two = same[0];
    if (!two) { notes.push(`no package for ${g.kind} in this family`); continue; }
    const n = Math.max(1, (g.inputs ?? 2) - 1);
    used.set(two.name, (used.get(two.name) ?? 0) + n);
    notes.push(`a ${g.inputs}-input ${g.kind.toUpperCase()} is built from ${n} ${two.name} gates${g.kind === 'xor' || g.kind === 'and' || g.kind === 'or' ? '' : ' plus an inverter level (approximate)'}`);
  }
  return specs.filter((s) => used.has(s.name)).map((s) => {
    const u = used.get(s.name)!;
    const packages = Math.ceil(u / s.perPackage);
    return { name: s.name, kind: s.kind, inputs: s.inputs, perPackage: s.perPackage, used: u, packages, spare: packages * s.perPackage - u, source: s.source };
  });
}

/** `part.pin` of every gate, multiplexer or storage input left unconnected. */
export function unusedInputs(netlist: Netlist): string[] {
  return netlist.undriven.flatMap((id) => netlist.nets[id].readers
    .filter((r) => { const p = netlist.partById(r.part); return p !== undefined && !isOutputKind(p.kind); })
    .map((r) => `${r.part}.${r.pin}`));
}

/** The parts list, merged by item and value. */
class PartsList {
  private readonly map = new Map<string, PartsListLine>();

  add(line: PartLine, quantity: number, settings: Record<string, number>): void {
    if (quantity <= 0) return;
    const ohms = line.key && settings[line.key] !== undefined ? settings[line.key] : line.ohms;
    const value = line.item === 'resistor' && ohms !== undefined ? formatOhms(ohms) : undefined;
    const name = line.item === 'resistor' && ohms !== undefined ? `resistor ${value}` : line.name;
    const key = `${line.item}|${name}`;
    const cur = this.map.get(key);
    const source = line.item === 'resistor' ? `${line.name}${line.key ? ` (${line.key})` : ''}: ${line.source}` : line.source;
    if (cur) {
      cur.quantity += quantity;
      if (!cur.source.includes(source)) cur.source += `; ${source}`;
    } else {
      this.map.set(key, { item: line.item, name, ...(value ? { value } : {}), quantity, source });
    }
  }

  addRaw(item: string, name: string, quantity: number, source: string): void {
    if (quantity > 0) this.add({ item: item as PartLine['item'], name, perGate: 1, source }, quantity, {});
  }

  count(item: string): number {
    return [...this.map.values()].filter((l) => l.item === item).reduce((n, l) => n + l.quantity, 0);
  }

  lines(): PartsListLine[] {
    const order = ['tube', 'relay', 'transistor', 'socket', 'diode', 'resistor', 'capacitor', 'led', 'lamp'];
    return [...this.map.values()].sort((a, b) => order.indexOf(a.item) - order.indexOf(b.item) || a.name.localeCompare(b.name, 'en', { numeric: true }));
  }
}

