/**
 * Public types of the Gatefold simulator (shared/sim). The simulation UI, the analysers and the CLI
 * code against these; extend them, never rename or drop a field.
 */
import type { BoardFile, FamilyId, Part, PartKind } from '../board';
import type { Level } from './levels';

/** One pin of one part, as written in wires (`part.pin`). */
export interface PinRef {
  part: string;
  pin: string;
}

/** A net: every pin joined by wires (a union of pins). */
export interface NetInfo {
  id: number;
  /** label of the input/output part on it, else `<partId>_<pin>` of its driver, else of its first pin */
  name: string;
  /** output pins that drive the net (0: undriven, ≥ 2: conflict) */
  drivers: PinRef[];
  /** input pins that read the net */
  readers: PinRef[];
}

/** A part after compilation: its nets and delays. */
export interface CompiledPart {
  /** position in `netlist.parts` (= file order, notes included) */
  index: number;
  id: string;
  kind: PartKind;
  /** the part's label, or its id when it has none (the name used in outputs and ports) */
  name: string;
  /** input pin names, in pinsOf order */
  inputPins: string[];
  /** net id of each input pin */
  inputs: number[];
  /** output pin names, in pinsOf order */
  outputPins: string[];
  /** net id of each output pin */
  outputs: number[];
  /** delay of a rising (to 1) and a falling (to 0) output change, integer time units (0 for input parts) */
  rise: number;
  fall: number;
  /** the part as in the board file */
  part: Part;
}

/** A problem the driver analysis found. */
export interface NetProblem {
  kind: 'undriven' | 'conflict';
  net: number;
  name: string;
  message: string;
}

/** The compiled board (see compileBoard). */
export interface Netlist {
  board: BoardFile;
  family: FamilyId;
  nets: NetInfo[];
  parts: CompiledPart[];
  /** switch, button, clock and const parts, in file order */
  inputs: CompiledPart[];
  /** lamp and probe parts, in file order */
  outputs: CompiledPart[];
  /** ids of nets no output drives */
  undriven: number[];
  /** ids of nets two or more outputs drive */
  conflicts: number[];
  problems: NetProblem[];
  /** net of a pin; throws for a pin the board does not have */
  netOf(partId: string, pin: string): number;
  /** compiled part by id, or undefined */
  partById(partId: string): CompiledPart | undefined;
}

/** What one settle() found. */
export interface SettleReport {
  /** true when no event is left to process (nothing oscillates) */
  settled: boolean;
  /** simulation time when it stopped */
  time: number;
  /** events (net-driver changes) processed in this settle */
  events: number;
  /** names of nets that kept changing after the event budget was spent */
  oscillating: string[];
  /** names of nets with two or more drivers (they read X) */
  conflicts: string[];
  /** `part.pin` of every input pin on an undriven net (it reads the family's floating value) */
  undrivenInputs: string[];
  /** ids of built-in storage parts that met a race in this settle (SR released from 11, D changing on the clock edge) */
  races: string[];
  /**
   * names of the loop nets this settle chose a power-on level for (each driven low) because their X
   * sustained itself; empty except in the first settle after power-on or resetState() with `powerOn:
   * 'resolve'`
   */
  powerOn: string[];
}

/** Options of a Simulator. */
export interface SimulatorOptions {
  /** logic family for floating inputs and delays (default: the netlist's family) */
  family?: FamilyId;
  /** seed of the contact-bounce model (default 1) */
  seed?: number;
  /** events one settle() may process before it declares oscillation (default max(20000, 200 × parts)) */
  eventBudget?: number;
  /**
   * What gate loops do at power-on (default `'resolve'`): a real node never stays unknown, so the first
   * settle picks a level for a loop whose X only feeds itself (its lowest X net driven low, again until
   * none is left) — a ring of inverters then oscillates, a latch of gates starts at Q = 0. `'x'` keeps
   * IEEE Std 1364 semantics: such a loop stays X until something loads it.
   */
  powerOn?: 'resolve' | 'x';
  /**
   * Heater warm-up of tube families, in time units after power-on (default 0: none). Until its heater is
   * warm a tube passes no plate current, so every gate, multiplexer and storage part drives its outputs
   * high; they warm one after another in file order, one slowest gate delay apart (real heaters never
   * warm in the same instant, so a latch of gates settles instead of racing), and then the logic takes
   * over. settle() leaves the parts cold; runFor() lets the warm-up pass (see Simulator.warmUntil).
   */
  warmUp?: number;
}

/** Counters since the simulator was made. */
export interface SimStats {
  events: number;
  evaluations: number;
  settles: number;
}

/** Called on every net change, in time order. */
export type ChangeListener = (time: number, netId: number, level: Level) => void;
