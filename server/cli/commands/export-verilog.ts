/** `export-verilog FILE`: the board as one structural Verilog (IEEE Std 1364) module on stdout. */
import { compileBoard, toVerilog } from '../../../shared/sim';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import type { CliCommand } from './types';

export const exportVerilog: CliCommand = {
  usage: 'export-verilog FILE',
  run(args, io) {
    const { positionals } = parseCommandArgs(args, {});
    const board = readBoard(positionals[0]);
    io.stdout(toVerilog(board, compileBoard(board)));
  },
};
