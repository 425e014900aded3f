/** What a CLI command writes to; tests pass buffers, the binary passes the process streams. */
export interface CliIo {
  out(text: string): void;
  err(text: string): void;
  /** Working directory that relative paths are read from. */
  cwd: string;
}

/** One `stratplot <name>` command. */
export interface Command {
  summary: string;
  usage: string;
  /**
   * Returns the exit code: 0 done. Bad input is thrown as an InputError (exit 2); an outcome that
   * is not bad input but not a success either is thrown as a {@link CommandStatus}.
   */
  run(argv: string[], io: CliIo): Promise<number>;
}

/** Exit status of a design that could not place every plot it was asked for (bad input is 2). */
export const EXIT_SHORT = 3;

/**
 * Ends a command with a documented non-zero status other than 2 (e.g. {@link EXIT_SHORT}) and one
 * line saying why; what the command already wrote stays written.
 */
export class CommandStatus extends Error {
  override readonly name = 'CommandStatus';
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}
