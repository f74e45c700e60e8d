/**
 * The command registry: name → a loader of the command. Add a command with one line here and its file
 * beside. Each command is imported only when it is called, so that a call parses and runs the code of
 * its own command only (in the bundle built by scripts/build-cli.mjs a module's body runs on its first
 * import).
 */
import type { CliCommand } from './types';

export const COMMANDS: Record<string, () => Promise<CliCommand>> = {
  simulate: async () => (await import('./simulate')).simulate,
  'export-verilog': async () => (await import('./export-verilog')).exportVerilog,
  analyze: async () => (await import('./analyze')).analyze,
  convert: async () => (await import('./convert')).convert,
  'build-sheet': async () => (await import('./build-sheet')).buildSheetCommand,
  'test-vectors': async () => (await import('./test-vectors')).testVectorsCommand,
  diagnose: async () => (await import('./diagnose')).diagnoseCommand,
};
