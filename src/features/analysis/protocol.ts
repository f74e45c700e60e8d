import type { BoardFile } from '../../../shared/board';
import type { FunctionMapEntry, OutputForms, OutputTerms, TruthTable } from '../../../shared/analysis';

/** What the panel asks for: the board and the choices (labels); undefined = the contract defaults. */
export interface AnalysisRequest {
  board: BoardFile;
  inputs?: string[];
  outputs?: string[];
  select: string[];
  /** per output label, the rows the user marked don't-care */
  dontCares: Record<string, number[]>;
}

/** An input or output part the user can choose. */
export interface PortChoice { name: string; partId: string; kind: string }

/** Everything the panel shows, computed in the worker. Typed arrays travel as transferables. */
export interface AnalysisResult {
  inputs: string[];
  outputs: string[];
  rowCount: number;
  /** per output, a level code per row (0, 1, 2 = X, 3 = Z) */
  values: Uint8Array[];
  sequential: boolean[];
  method: string[];
  /** which kernel ran the table's bit-parallel outputs ('wasm' or 'js'; absent when none did) */
  kernel?: TruthTable['kernel'];
  forms: Record<string, OutputForms>;
  terms: Record<string, OutputTerms>;
  functionMap: FunctionMapEntry[];
  /** all the board's choosable inputs and outputs, file order */
  availableInputs: PortChoice[];
  availableOutputs: PortChoice[];
  /** per output label: ids of the parts its value depends on (the fan-in cone) */
  cones: Record<string, string[]>;
  ms: number;
}

export type ToWorker =
  | { type: 'analyze'; id: number; request: AnalysisRequest }
  | { type: 'cancel'; id: number };

export type FromWorker =
  | { type: 'progress'; id: number; done: number; total: number }
  | { type: 'result'; id: number; result: AnalysisResult }
  | { type: 'error'; id: number; message: string; cancelled: boolean };
