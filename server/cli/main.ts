/**
 * `npm run -s cli -- <command> …`: Gatefold's command line (CONTRACTS §2), every command (run from
 * source with tsx, or as dist-cli/gatefold.cjs). scripts/cli.cjs runs the one-command bundle of the
 * command called instead, which holds the same code (run.ts with that command only).
 */
import { COMMANDS } from './commands';
import { runCli } from './run';

void runCli(process.argv.slice(2), COMMANDS);
