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
  /** Returns the exit code: 0 done, 2 bad input (after printing one line saying why). */
  run(argv: string[], io: CliIo): Promise<number>;
}
