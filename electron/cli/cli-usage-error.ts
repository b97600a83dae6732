// A mistake in the command line itself (unknown option, missing argument, value out
// of range). The CLI prints its message and exits with status 2.
export class CliUsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CliUsageError';
  }
}
