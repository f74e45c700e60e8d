/**
 * The command registry: name → command. Add a command with one line here and its file beside.
 */
import type { CliCommand } from './types';
import { simulate } from './simulate';
import { exportVerilog } from './export-verilog';
import { analyze } from './analyze';
import { convert } from './convert';
import { buildSheetCommand } from './build-sheet';
import { testVectorsCommand } from './test-vectors';
import { diagnoseCommand } from './diagnose';

export const COMMANDS: Record<string, CliCommand> = {
  simulate,
  'export-verilog': exportVerilog,
  analyze,
  convert,
  'build-sheet': buildSheetCommand,
  'test-vectors': testVectorsCommand,
  diagnose: diagnoseCommand,
};
