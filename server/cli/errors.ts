/** An error the command line reports as one line `error: …` with exit code 2 (bad input or usage). */
export class CliError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CliError';
  }
}
