/**
 * `export-verilog FILE [--delays]`: the board as one structural Verilog (IEEE Std 1364) module on stdout
 * (a board with modules: one Verilog module per module, instantiated by name, the board's first);
 * `--delays` writes each part's rise/fall delays in the family's time unit.
 */
import { toHierarchicalVerilog } from '../../../shared/sim';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import type { CliCommand } from './types';

export const exportVerilog: CliCommand = {
  usage: 'export-verilog FILE [--delays]',
  run(args, io) {
    const { positionals, values } = parseCommandArgs(args, { delays: { type: 'boolean' } });
    const board = readBoard(positionals[0]);
    io.stdout(toHierarchicalVerilog(board, { delays: values.delays === true }));
  },
};

export default exportVerilog;
