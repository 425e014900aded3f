import { isInputError } from '../core/common/InputError';
import { STRATPLOT_VERSION } from '../core/common/version';
import { argsProblem } from './argsProblem';
import { type CliIo, type Command, CommandStatus } from './command';
import { COMMANDS } from './commands';

const VERSION = STRATPLOT_VERSION;

function help(): string {
  const rows = Object.entries(COMMANDS).map(([name, c]) => `  ${name.padEnd(10)} ${c.summary}`);
  return [
    `stratplot ${VERSION} — stratified survey designs for vegetation and habitat`,
    '',
    'Usage: stratplot <command> [options]   (stratplot <command> --help for its options)',
    '',
    'Commands:',
    ...rows,
    '',
  ].join('\n');
}

/** Runs one CLI invocation and returns its exit code; never lets a stack trace reach the user. */
export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    io.out(help());
    return 0;
  }
  if (name === '--version' || name === '-V') {
    io.out(`${VERSION}\n`);
    return 0;
  }
  const command: Command | undefined = COMMANDS[name];
  if (!command) {
    io.err(`stratplot: unknown command "${name}"; commands are: ${Object.keys(COMMANDS).join(', ')}\n`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.out(`${command.usage}\n`);
    return 0;
  }
  // Notes a command writes to stderr (the seed, warnings) are held until it succeeds, so that a
  // failure prints exactly one line and nothing before it.
  const held: string[] = [];
  const commandIo: CliIo = { out: (t) => io.out(t), err: (t) => held.push(t), cwd: io.cwd };
  const fail = (message: string) => io.err(`stratplot ${name}: ${oneLine(message)}\n`);
  try {
    const code = await command.run(rest, commandIo);
    for (const t of held) io.err(t);
    return code;
  } catch (error) {
    if (isInputError(error)) {
      fail(error.message);
      return 2;
    }
    if (error instanceof CommandStatus) {
      fail(error.message);
      return error.status;
    }
    const fsError = fileSystemProblem(error, io.cwd);
    if (fsError) {
      fail(fsError);
      return 2;
    }
    const args = argsProblem(error);
    if (args) {
      fail(`${args} (see stratplot ${name} --help)`);
      return 2;
    }
    const message = error instanceof Error ? error.message : String(error);
    fail(`internal error: ${message} (please report this with the input that caused it)`);
    return 1;
  }
}

/** Why a file named on the command line could not be written (or read), when the error is the file system's. */
function fileSystemProblem(error: unknown, cwd: string): string | null {
  const e = error as NodeJS.ErrnoException;
  if (!(error instanceof Error) || typeof e.code !== 'string' || typeof e.path !== 'string') return null;
  const path = e.path.startsWith(`${cwd}/`) ? e.path.slice(cwd.length + 1) : e.path;
  const why: Record<string, string> = {
    ENOENT: 'its folder does not exist',
    EACCES: 'permission denied',
    EPERM: 'permission denied',
    EISDIR: 'it is a folder',
    ENOTDIR: 'a part of its path is not a folder',
    ENOSPC: 'the disk is full',
    EROFS: 'the disk is read-only',
  };
  return `cannot ${e.syscall === 'open' || e.syscall === 'write' ? 'write' : (e.syscall ?? 'use')} ${path}: ${why[e.code] ?? e.code}`;
}

/** A message on one line: line breaks (from a reader's message or a name in the file) become spaces. */
function oneLine(message: string): string {
  return message.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}
