/**
 * Test vectors for the single stuck-at faults of a board (the `test-vectors` JSON of CONTRACTS §2).
 * Combinational boards: boards of up to EXACT_INPUTS inputs take every input setting as a candidate
 * (the fault table is complete, so an exact cover is a proven minimum); larger boards first try random
 * settings (bit-parallel fault simulation with fault dropping), then every fault still open is searched
 * for: over all settings when there are at most EXHAUSTIVE_INPUTS inputs (a miss proves it undetectable),
 * else by PODEM (an exhausted search proves it). The candidates that detected something are then
 * reduced to a small cover. Sequential boards: see sequential.ts.
 */
import { flattenBoard, parseBoardFile, type BoardFile } from '../board';
import { compileBoard, mulberry32 } from '../sim';
import { minimumCover, reduceRows } from './cover';
import { collapseCount, faultList } from './faults';
import { FaultSimulator, faultSites, packVectors, bit, type Site } from './fsim';
import { buildModel, handInputs, observableNets, readOutputs, isSequentialBoard, type Model } from './model';
import { podem } from './podem';
import { sequentialTests } from './sequential';
import { orderForBench } from './sheet';
import { BringupError, type Fault, type TestVector, type TestVectorsResult, type Undetectable } from './types';

/** Boards with at most this many inputs use every input setting as a candidate (exact minimum). */
export const EXACT_INPUTS = 10;
/** Boards with at most this many inputs are searched exhaustively for faults random settings missed. */
export const EXHAUSTIVE_INPUTS = 20;

export interface TestVectorOptions {
  /** lamp/probe labels to read (default: all, in file order) */
  outputs?: string[];
  seed?: number;
  /** PODEM backtracks per fault */
  backtrackLimit?: number;
}

/** Parses and checks a board file, or throws BringupError naming the first problem. */
export function boardOf(raw: unknown): BoardFile {
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) throw new BringupError(parsed.problems[0].message, parsed.problems[0].id ?? parsed.problems[0].path);
  return parsed.board;
}

const bits = (v: ArrayLike<number>) => Array.from(v).join('');

/** The detection table of the candidates: for each fault, the candidate indices that detect it. */
export function detectionTable(model: Model, sites: Site[], faultIds: number[], candidates: number[][]): { rows: Map<number, number[]>; outputs: string[] } {
  const W = 8;
  const per = 32 * W;
  const sim = new FaultSimulator(model, W);
  const det = new Int32Array(W);
  const rows = new Map<number, number[]>(faultIds.map((f) => [f, []]));
  const outputs: string[] = [];
  for (let c0 = 0; c0 < candidates.length; c0 += per) {
    const block = candidates.slice(c0, c0 + per);
    sim.load(packVectors(block, model.inputs.length, W));
    sim.run();
    const good = sim.goodOutputs();
    block.forEach((_, p) => outputs.push(model.outputs.map((_o, k) => String(bit(good.subarray(k * W), p))).join('')));
    for (const f of faultIds) {
      if (!sim.simulate(sites[f], det)) continue;
      const r = rows.get(f)!;
      for (let p = 0; p < block.length; p++) if (bit(det, p)) r.push(c0 + p);
    }
  }
  return { rows, outputs };
}

/** The test vectors of a board. */
export function testVectors(hierarchical: BoardFile, opts: TestVectorOptions = {}): TestVectorsResult {
  // faults and rewritten boards name parts inside instances by path (u3/g2), so work on the flat board
  const board = flattenBoard(hierarchical);
  const netlist = compileBoard(board);
  if (isSequentialBoard(netlist)) return sequentialVectors(board, opts);
  const model = buildModel(board, opts.outputs);
  const faults = faultList(netlist);
  const sites = faultSites(model, faults);
  const n = model.inputs.length;
  const random = mulberry32(opts.seed ?? 1);
  const reasons: Undetectable[] = [];
  const undecided: Undetectable[] = [];
  const undetectable = new Set<number>();
  const reach = observableNets(netlist, model.outputs.map((o) => o.net));
  const open = new Set<number>();
  faults.forEach((f, i) => {
    const p = netlist.partById(f.part)!;
    const pinNet = netlist.netOf(f.part, f.pin);
    const outPin = p.outputPins.includes(f.pin);
    const isRead = model.outputs.some((o) => o.part === f.part);
    if (!isRead && (!reach[pinNet] || (!outPin && !p.outputs.some((o) => reach[o])) || sites[i].kind === 'none')) {
      undetectable.add(i);
      reasons.push({ fault: f.name, reason: 'no path from this pin to a lamp that is read' });
    } else open.add(i);
  });

  let candidates: number[][] = [];
  let complete = false;
  if (n <= EXACT_INPUTS) {
    complete = true;
    candidates = Array.from({ length: 2 ** n }, (_, r) => Array.from({ length: n }, (_, i) => (r >> (n - 1 - i)) & 1));
  } else {
    const W = 8;
    const sim = new FaultSimulator(model, W);
    const det = new Int32Array(W);
    let idle = 0;
    for (let block = 0; block < 64 && open.size && idle < 4; block++) {
      const vecs = Array.from({ length: 32 * W }, () => Array.from({ length: n }, () => (random() < 0.5 ? 1 : 0)));
      sim.load(packVectors(vecs, n, W));
      sim.run();
      const used = new Set<number>();
      let found = 0;
      for (const f of [...open]) {
        if (!sim.simulate(sites[f], det)) continue;
        let p = 0;
        while (!bit(det, p)) p++;
        used.add(p);
        open.delete(f);
        found++;
      }
      for (const p of [...used].sort((a, b) => a - b)) candidates.push(vecs[p]);
      idle = found ? 0 : idle + 1;
    }
    if (n <= EXHAUSTIVE_INPUTS) exhaustiveSearch(model, sites, open, candidates, undetectable, reasons, faults);
    else podemSearch(model, sites, open, candidates, undetectable, reasons, undecided, faults, random, opts.backtrackLimit ?? 20000);
  }
  const detectable = faults.map((_, i) => i).filter((i) => !undetectable.has(i) && !undecided.some((u) => u.fault === faults[i].name));
  const { rows } = detectionTable(model, sites, detectable, candidates);
  const detected: number[] = [];
  for (const f of detectable) {
    if (rows.get(f)!.length) detected.push(f);
    else if (complete) { undetectable.add(f); reasons.push({ fault: faults[f].name, reason: `no setting of the ${n} inputs shows it (all ${2 ** n} checked)` }); }
    else undecided.push({ fault: faults[f].name, reason: 'no candidate vector detects it' });
  }
  const cover = minimumCover(reduceRows(detected.map((f) => rows.get(f)!)));
  const chosen = cover.columns.map((c) => candidates[c]);
  const order = orderForBench(chosen.map(bits));
  const expected = detectionTable(model, sites, [], order.map((s) => Array.from(s, Number))).outputs;
  const vectors: TestVector[] = order.map((s, k) => ({ in: s, out: expected[k] }));
  const minimal = complete && cover.optimal;
  const minimalNote = minimal
    ? `proved minimal: exact cover over all ${2 ** n} input settings`
    : complete
      ? 'smallest found; the exact search stopped at its budget'
      : `smallest found among ${candidates.length} candidate vectors; at least ${cover.lowerBound} are needed (faults no candidate detects together); not proved minimal`;
  const sortedReasons = reasons.sort((a, b) => faultOrder(faults, a.fault) - faultOrder(faults, b.fault));
  return {
    faults: faults.length, detected: detected.length, undetectable: sortedReasons.map((r) => r.fault), vectors, minimal,
    inputs: model.inputs.map((i) => i.label), outputs: model.outputs.map((o) => o.label), sequential: false,
    collapsed: collapseCount(netlist, faults), coverage: faults.length ? detected.length / faults.length : 1,
    reasons: sortedReasons, undecided, minimalNote,
  };
}

function faultOrder(faults: Fault[], name: string): number {
  return faults.findIndex((f) => f.name === name);
}

/** Every input setting, block by block, for the open faults: a fault no setting shows is undetectable. */
function exhaustiveSearch(model: Model, sites: Site[], open: Set<number>, candidates: number[][], undetectable: Set<number>, reasons: Undetectable[], faults: Fault[]): void {
  if (!open.size) return;
  const n = model.inputs.length;
  const W = 64;
  const sim = new FaultSimulator(model, W);
  const det = new Int32Array(W);
  const total = 2 ** n;
  for (let r0 = 0; r0 < total && open.size; r0 += 32 * W) {
    sim.loadCounting(r0);
    sim.run();
    for (const f of [...open]) {
      if (!sim.simulate(sites[f], det)) continue;
      let p = 0;
      while (!bit(det, p)) p++;
      if (r0 + p >= total) continue;
      candidates.push(Array.from({ length: n }, (_, i) => Math.floor((r0 + p) / 2 ** (n - 1 - i)) & 1));
      open.delete(f);
    }
  }
  for (const f of open) { undetectable.add(f); reasons.push({ fault: faults[f].name, reason: `no setting of the ${n} inputs shows it (all ${total} checked)` }); }
  open.clear();
}

/** PODEM for each open fault; each test found is fault-simulated against the faults still open. */
function podemSearch(
  model: Model, sites: Site[], open: Set<number>, candidates: number[][], undetectable: Set<number>, reasons: Undetectable[],
  undecided: Undetectable[], faults: Fault[], random: () => number, limit: number,
): void {
  const n = model.inputs.length;
  const sim = new FaultSimulator(model, 1);
  const det = new Int32Array(1);
  for (const f of [...open]) {
    if (!open.has(f)) continue;
    const r = podem(model, sites[f], limit);
    open.delete(f);
    if (r.kind === 'undetectable') {
      undetectable.add(f);
      reasons.push({ fault: faults[f].name, reason: 'redundant: the search tried every way to set the pin against its stuck level and carry the difference to a lamp (PODEM, search exhausted)' });
      continue;
    }
    if (r.kind === 'gave-up') { undecided.push({ fault: faults[f].name, reason: `search gave up after ${limit} backtracks` }); continue; }
    const vec = Array.from(r.bits, (b) => (b === 2 ? (random() < 0.5 ? 1 : 0) : b));
    candidates.push(vec);
    sim.load(packVectors([vec], n, 1));
    sim.run();
    for (const g of [...open]) if (sim.simulate(sites[g], det) && det[0] & 1) open.delete(g);
  }
}

/** Sequential boards: random-walk sequences from power-on (sequential.ts). */
function sequentialVectors(board: BoardFile, opts: TestVectorOptions): TestVectorsResult {
  const netlist = compileBoard(board);
  const faults = faultList(netlist);
  const inputs = handInputs(netlist);
  const outputs = readOutputs(netlist, opts.outputs);
  if (!outputs.length) throw new BringupError('the board has no lamp or probe to read', 'outputs');
  const reach = observableNets(netlist, outputs.map((o) => o.net));
  const reasons: Undetectable[] = [];
  const candidates: number[] = [];
  faults.forEach((f, i) => {
    const p = netlist.partById(f.part)!;
    const isRead = outputs.some((o) => o.part === f.part);
    const pinNet = netlist.netOf(f.part, f.pin);
    const outPin = p.outputPins.includes(f.pin);
    if (!isRead && (!reach[pinNet] || (!outPin && !p.outputs.some((o) => reach[o])))) reasons.push({ fault: f.name, reason: 'no path from this pin to a lamp that is read' });
    else candidates.push(i);
  });
  const seq = sequentialTests(board, netlist, faults, candidates, inputs, outputs, opts.seed ?? 1);
  const undecided = candidates.filter((i) => !seq.detected.has(i)).map((i) => ({
    fault: faults[i].name, reason: 'not shown by random single-switch walks from power-on (storage: not proved undetectable)',
  }));
  return {
    faults: faults.length, detected: seq.detected.size, undetectable: reasons.map((r) => r.fault), vectors: seq.vectors, minimal: false,
    inputs: inputs.map((i) => i.label), outputs: outputs.map((o) => o.label), sequential: true,
    collapsed: collapseCount(netlist, faults), coverage: faults.length ? seq.detected.size / faults.length : 1,
    reasons, undecided,
    minimalNote: `sequences from power-on (${seq.sequences.length}), each cut after its last new detection; not proved minimal`,
  };
}
