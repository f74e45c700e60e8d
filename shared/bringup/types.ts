/** Types of the bring-up computations (test vectors, fault simulation, diagnosis). */

/** A single stuck-at fault on one pin: `"<part>.<pin> sa0"` or `"… sa1"`. */
export interface Fault {
  /** index in the fault list */
  index: number;
  part: string;
  pin: string;
  /** the stuck value */
  value: 0 | 1;
  /** `"g2.out sa0"` */
  name: string;
}

/** A fault shown undetectable, and why. */
export interface Undetectable {
  fault: string;
  reason: string;
}

/** One vector of the bring-up sheet: switch settings (first input first) and the expected lamps. */
export interface TestVector {
  in: string;
  out: string;
  /** sequential boards: which sequence from power-on (0-based) and the step in it (0-based) */
  sequence?: number;
  step?: number;
}

/** The `test-vectors` JSON of CONTRACTS §2, extended. */
export interface TestVectorsResult {
  /** every single stuck-at fault of the list (uncollapsed) */
  faults: number;
  detected: number;
  /** names of the faults shown undetectable */
  undetectable: string[];
  vectors: TestVector[];
  /** true only when no smaller set of vectors can detect every detectable fault (proved) */
  minimal: boolean;
  inputs: string[];
  outputs: string[];
  sequential: boolean;
  /** faults after structural equivalence collapsing */
  collapsed: number;
  /** detected / faults, 0…1 */
  coverage: number;
  reasons: Undetectable[];
  /** faults neither detected nor shown undetectable (search gave up, or a sequential board) */
  undecided: Undetectable[];
  /** how `minimal` was decided */
  minimalNote: string;
}

/** One observation from the bench: switch settings and what the lamps really showed (`?` = not read). */
export interface Observation {
  in: string;
  out: string;
}

/** A suspect: a fault (or wire swap) and how many observations it explains. */
export interface Candidate {
  fault: string;
  explains: number;
  of: number;
  /** faults that behave the same (cannot be told apart by any setting, or by the checks made) */
  equivalent: string[];
  /** part ids involved, for highlighting */
  parts: string[];
}

/** The `diagnose` JSON of CONTRACTS §2, extended. */
export interface DiagnoseResult {
  candidates: Candidate[];
  /** the next setting to try: splits the remaining suspects into `groups` different lamp readings */
  next: { in: string; groups: number } | null;
  /** how many observations the fault-free board explains */
  faultFree: { explains: number; of: number };
  inputs: string[];
  outputs: string[];
}

/** An error in the board or the request (the CLI exits 2, the API answers 400). */
export class BringupError extends Error {
  constructor(message: string, readonly field?: string) {
    super(message);
    this.name = 'BringupError';
  }
}
