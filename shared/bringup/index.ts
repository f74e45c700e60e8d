/**
 * Gatefold bring-up — test vectors for the real build, and diagnosis from what the bench shows.
 *
 * ```ts
 * const tv = testVectors(board);                 // the `test-vectors` JSON of CONTRACTS §2 (extended)
 * const d = diagnose(board, [{ in: '0101', out: '10' }]);   // the `diagnose` JSON: suspects, next vector
 * orderForBench(tv.vectors.map((v) => v.in));   // fewest switch changes between steps
 * ```
 * Combinational boards: bit-parallel fault simulation (fsim.ts), random settings then exhaustive or
 * PODEM search (podem.ts), cover by branch and bound (cover.ts). Boards with storage: sequences from
 * power-on on the event simulator of shared/sim (sequential.ts).
 */
export { testVectors, boardOf, detectionTable, EXACT_INPUTS, EXHAUSTIVE_INPUTS, type TestVectorOptions } from './generate';
export { diagnose, prepareDiagnosis, swapCandidates, type DiagnoseOptions } from './diagnose';
export { faultList, faultName, collapseClasses, collapseCount } from './faults';
export { buildModel, handInputs, readOutputs, isSequentialBoard, type Model } from './model';
export { FaultSimulator, faultSites, packVectors, type Site } from './fsim';
export { podem, type SearchResult } from './podem';
export { minimumCover, reduceRows, type CoverResult } from './cover';
export { withStuckPin, withSwappedPins } from './rewrite';
export { runSteps, randomWalk } from './sequential';
export { orderForBench, switchChanges, totalChanges } from './sheet';
export { BringupError, type Fault, type TestVector, type TestVectorsResult, type Observation, type Candidate, type DiagnoseResult, type Undetectable } from './types';
