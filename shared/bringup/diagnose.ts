/**
 * Diagnosis: which single stuck-at fault (or swap of two adjacent pins of one part) explains what the
 * bench showed. Every candidate is simulated on the observed settings; a candidate explains an
 * observation when it predicts every lamp that was read. Candidates that behave alike are one suspect:
 * on boards of up to EXACT_INPUTS inputs "alike" means the same lamps for every input setting (truly
 * equivalent); on larger boards the same lamps on the observations, the test vectors and 1024 random
 * settings; on sequential boards the same lamps on the observations and four 64-step random walks.
 * Suspects are ranked by observations explained, then by how many faults they stand for (with every
 * single fault equally likely, a larger class is likelier). The next vector is the setting whose
 * predicted lamps split the best-ranked suspects into the most groups (ties: the smallest largest group).
 */
import { flattenBoard, isGateKind, type BoardFile } from '../board';
import { compileBoard, mulberry32, type Netlist } from '../sim';
import { faultList } from './faults';
import { FaultSimulator, faultSites, packVectors, bit } from './fsim';
import { buildModel, handInputs, readOutputs, isSequentialBoard, type Model } from './model';
import { withStuckPin, withSwappedPins } from './rewrite';
import { randomWalk, runSteps } from './sequential';
import { EXACT_INPUTS } from './generate';
import { BringupError, type Candidate, type DiagnoseResult, type Observation } from './types';

export interface DiagnoseOptions {
  outputs?: string[];
  /** how many suspects to list (default 25) */
  limit?: number;
  /** the generated vectors, used for telling suspects apart on larger boards */
  vectors?: string[];
  seed?: number;
}

interface Suspect {
  name: string;
  parts: string[];
  /** board with the fault in it (swaps and sequential boards) */
  board?: BoardFile;
  /** fault index in the list (stuck-at faults) */
  fault?: number;
}

/** Adjacent-pin swaps worth checking: not between inputs of a symmetric gate (that changes nothing). */
export function swapCandidates(netlist: Netlist): { part: string; a: string; b: string }[] {
  const out: { part: string; a: string; b: string }[] = [];
  const connected = (part: string, pin: string) => { const n = netlist.nets[netlist.netOf(part, pin)]; return n.drivers.length + n.readers.length > 1; };
  for (const p of netlist.parts) {
    if (p.kind === 'note' || isGateKind(p.kind)) continue;
    const groups = [p.inputPins, p.outputPins];
    for (const pins of groups) for (let k = 0; k + 1 < pins.length; k++) {
      if (connected(p.id, pins[k]) && connected(p.id, pins[k + 1])) out.push({ part: p.id, a: pins[k], b: pins[k + 1] });
    }
  }
  return out;
}

function checkObservations(obs: Observation[], nIn: number, nOut: number): void {
  if (!Array.isArray(obs) || !obs.length) throw new BringupError('give at least one observation [{"in": "…", "out": "…"}]', 'observed');
  obs.forEach((o, k) => {
    if (typeof o?.in !== 'string' || !new RegExp(`^[01]{${nIn}}$`).test(o.in)) throw new BringupError(`observation ${k + 1}: "in" must be ${nIn} characters 0 or 1`, `observed.${k}.in`);
    if (typeof o?.out !== 'string' || !new RegExp(`^[01?xX-]{${nOut}}$`).test(o.out)) throw new BringupError(`observation ${k + 1}: "out" must be ${nOut} characters 0, 1 or ? (not read)`, `observed.${k}.out`);
  });
}

function matches(pred: string, seen: string): boolean {
  for (let i = 0; i < seen.length; i++) if ((seen[i] === '0' || seen[i] === '1') && pred[i] !== seen[i]) return false;
  return true;
}

/** Predictions: index 0 the fault-free board, index i + 1 suspect i; one reading per setting. */
interface Engine {
  observed: string[][];
  /** predictions on further settings, for telling suspects apart */
  checks: string[][][];
  /** the best next setting for the top suspects (weights: how many faults each stands for) */
  next(top: number[], weights: number[]): { in: string; groups: number } | null;
}

/** Ranks the suspects for the observations. */
export function diagnose(board: BoardFile, observed: Observation[], opts: DiagnoseOptions = {}): DiagnoseResult {
  return prepareDiagnosis(board, opts)(observed);
}

/**
 * The work of a diagnosis that does not depend on the observations (suspects, their faulty boards, their
 * readings on the comparison settings), done once; the returned function ranks suspects for observations.
 */
export function prepareDiagnosis(hierarchical: BoardFile, opts: DiagnoseOptions = {}): (observed: Observation[]) => DiagnoseResult {
  // suspects inside instances are named by path (u3/g2); the faulty boards are flat ones
  const board = flattenBoard(hierarchical);
  const netlist = compileBoard(board);
  const inputs = handInputs(netlist);
  const outputs = readOutputs(netlist, opts.outputs);
  if (!outputs.length) throw new BringupError('the board has no lamp or probe to read', 'outputs');
  const faults = faultList(netlist);
  const suspects: Suspect[] = [
    ...faults.map((f, i) => ({ name: f.name, parts: [f.part], fault: i })),
    ...swapCandidates(netlist).map((s) => ({ name: `swap ${s.part}.${s.a}/${s.part}.${s.b}`, parts: [s.part], board: withSwappedPins(board, netlist, s.part, s.a, s.b) })),
  ];
  const random = mulberry32(opts.seed ?? 7);
  const prepared = isSequentialBoard(netlist)
    ? sequentialEngine(board, netlist, suspects, inputs, outputs, random)
    : combinationalEngine(board, suspects, random, opts);
  return (observed) => {
  checkObservations(observed, inputs.length, outputs.length);
  const obsSteps = observed.map((o) => Array.from(o.in, Number));
  const engine = prepared(obsSteps, observed);

  const of = observed.length;
  const explains = (preds: string[]) => preds.reduce((a, p, k) => a + (matches(p, observed[k].out) ? 1 : 0), 0);
  const blocks = [engine.observed, ...engine.checks];
  const signature = (i: number) => blocks.map((b) => b[i].join('|')).join('#');
  const goodSig = signature(0);
  const classes = new Map<string, number[]>();
  suspects.forEach((_, i) => {
    const key = signature(i + 1);
    if (key === goodSig) return; // behaves as the fault-free board everywhere checked
    const c = classes.get(key) ?? [];
    c.push(i);
    classes.set(key, c);
  });
  const scored = [...classes.values()].map((members) => ({ members, explains: explains(engine.observed[members[0] + 1]) }))
    .sort((a, b) => b.explains - a.explains || b.members.length - a.members.length || a.members[0] - b.members[0]);
  const candidates: Candidate[] = scored.slice(0, opts.limit ?? 25).map((c) => ({
    fault: suspects[c.members[0]].name, explains: c.explains, of,
    equivalent: c.members.slice(1).map((i) => suspects[i].name),
    parts: [...new Set(c.members.flatMap((i) => suspects[i].parts))],
  }));
  const bestScore = scored[0]?.explains ?? 0;
  let top = scored.filter((c) => c.explains === bestScore);
  if (top.length < 2) top = scored.slice(0, 5);
  top = top.slice(0, 64);
  return {
    candidates,
    next: top.length ? engine.next(top.map((c) => c.members[0]), top.map((c) => c.members.length)) : null,
    faultFree: { explains: explains(engine.observed[0]), of },
    inputs: inputs.map((i) => i.label), outputs: outputs.map((o) => o.label),
  };
  };
}

function allSettings(n: number): number[][] {
  return Array.from({ length: 2 ** n }, (_, r) => Array.from({ length: n }, (_, i) => (r >> (n - 1 - i)) & 1));
}

function pickNext(choices: number[][], predsOf: (k: number) => string[], weights: number[], skip: Set<string>): { in: string; groups: number } | null {
  let best: { in: string; groups: number; worst: number } | null = null;
  choices.forEach((s, k) => {
    const key = s.join('');
    if (skip.has(key)) return;
    const score = splitScore(predsOf(k), weights);
    if (!best || score.groups > best.groups || (score.groups === best.groups && score.worst < best.worst)) best = { in: key, ...score };
  });
  const b = best as { in: string; groups: number } | null;
  return b && { in: b.in, groups: b.groups };
}

type PreparedEngine = (obsSteps: number[][], observed: Observation[]) => Engine;

function combinationalEngine(board: BoardFile, suspects: Suspect[], random: () => number, opts: DiagnoseOptions): PreparedEngine {
  const model = buildModel(board, opts.outputs);
  const faults = faultList(model.netlist);
  const sites = faultSites(model, faults);
  const swapModels = suspects.map((s) => (s.board ? safeModel(s.board, opts.outputs) : undefined));
  const n = model.inputs.length;
  const checks = n <= EXACT_INPUTS + 6
    ? allSettings(n)
    : [...(opts.vectors ?? []).map((v) => Array.from(v, Number)), ...Array.from({ length: 1024 }, () => Array.from({ length: n }, () => (random() < 0.5 ? 1 : 0)))];
  const predict = (steps: number[][]) => combinationalPredict(model, sites, suspects, swapModels, steps);
  const onChecks = predict(checks);
  const choices = n <= 12 ? checks : checks.slice(0, 512);
  const onChoices = n <= 12 ? onChecks : predict(choices);
  return (obsSteps, observed) => ({
    observed: predict(obsSteps),
    checks: [onChecks],
    next: (top, weights) => pickNext(choices, (k) => top.map((i) => onChoices[i + 1][k]), weights, new Set(observed.map((o) => o.in))),
  });
}

function sequentialEngine(board: BoardFile, netlist: Netlist, suspects: Suspect[], inputs: ReturnType<typeof handInputs>, outputs: ReturnType<typeof readOutputs>, random: () => number): PreparedEngine {
  const faults = faultList(netlist);
  const boards = [board, ...suspects.map((s) => s.board ?? withStuckPin(board, netlist, faults[s.fault!].part, faults[s.fault!].pin, faults[s.fault!].value))];
  const netlists = boards.map((b) => compileBoard(b));
  const n = inputs.length;
  const predict = (steps: number[][]) => netlists.map((b) => runSteps(b, inputs, outputs, steps));
  const walks = Array.from({ length: 4 }, () => randomWalk(n, 64, random));
  const checks = walks.map(predict);
  const choices = allSettings(Math.min(n, 8));
  return (obsSteps) => ({
    observed: predict(obsSteps),
    checks,
    next: (top, weights) => pickNext(choices, (k) => top.map((i) => runSteps(netlists[i + 1], inputs, outputs, [...obsSteps, choices[k]]).at(-1)!), weights, new Set()),
  });
}

function safeModel(board: BoardFile, outputs?: string[]): Model | undefined {
  try {
    const m = buildModel(board, outputs);
    return m.sequential ? undefined : m;
  } catch {
    return undefined;
  }
}

/** Lamp readings of the fault-free board (index 0) and of every suspect (index i + 1) on the settings. */
function combinationalPredict(model: Model, sites: ReturnType<typeof faultSites>, suspects: Suspect[], swapModels: (Model | undefined)[], steps: number[][]): string[][] {
  const W = 8;
  const per = 32 * W;
  const nOut = model.outputs.length;
  const out: string[][] = Array.from({ length: suspects.length + 1 }, () => []);
  const sim = new FaultSimulator(model, W);
  const swapSims = swapModels.map((m) => (m ? new FaultSimulator(m, W) : undefined));
  const det = new Int32Array(W);
  const words = new Int32Array(nOut * W);
  const read = (w: Int32Array, count: number, into: string[]) => {
    for (let p = 0; p < count; p++) { let s = ''; for (let k = 0; k < nOut; k++) s += bit(w.subarray(k * W), p); into.push(s); }
  };
  for (let s0 = 0; s0 < steps.length; s0 += per) {
    const block = steps.slice(s0, s0 + per);
    const packed = packVectors(block, model.inputs.length, W);
    sim.load(packed);
    sim.run();
    read(sim.goodOutputs(), block.length, out[0]);
    suspects.forEach((s, i) => {
      if (s.fault !== undefined) { sim.simulate(sites[s.fault], det, words); read(words, block.length, out[i + 1]); return; }
      const ss = swapSims[i];
      if (!ss) { for (let p = 0; p < block.length; p++) out[i + 1].push('?'.repeat(nOut)); return; }
      ss.load(packed);
      ss.run();
      read(ss.goodOutputs(), block.length, out[i + 1]);
    });
  }
  return out;
}

/** How well predictions split suspects: distinct readings, and the weight of the largest group. */
function splitScore(preds: string[], weights: number[]): { groups: number; worst: number } {
  const g = new Map<string, number>();
  preds.forEach((p, i) => g.set(p, (g.get(p) ?? 0) + (weights[i] ?? 1)));
  return { groups: g.size, worst: Math.max(...g.values()) };
}
