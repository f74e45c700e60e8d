/** A command of the Gatefold command line. */
export interface CliIo {
  /** writes text to standard output (as is); an iterable is written piece by piece (a large JSON; bytes as UTF-8) */
  stdout(text: string | Iterable<string | Uint8Array>): void;
  /** writes a file (used by --vcd) */
  writeFile(path: string, text: string): void;
}

export interface CliCommand {
  /** one-line usage, shown on a usage error */
  usage: string;
  /** runs with the arguments after the command name; throws CliError on bad input */
  run(args: string[], io: CliIo): void | Promise<void>;
}
