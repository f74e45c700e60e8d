/**
 * The command registry: name → a loader of the command. A command NAME lives in NAME.ts in this folder
 * and is that file's default export; add it with one line here. Each command is imported only when it
 * is called; scripts/build-cli.mjs also makes one bundle per command file (the same rule), so that a call
 * reads and runs the code of its own command only.
 */
import type { CliCommand } from './types';

export const COMMANDS: Record<string, () => Promise<CliCommand>> = {
  simulate: async () => (await import('./simulate')).default,
  'export-verilog': async () => (await import('./export-verilog')).default,
  analyze: async () => (await import('./analyze')).default,
  convert: async () => (await import('./convert')).default,
  'build-sheet': async () => (await import('./build-sheet')).default,
  'test-vectors': async () => (await import('./test-vectors')).default,
  diagnose: async () => (await import('./diagnose')).default,
};
