import { isInputError } from '../core/InputError';
import type { CliIo, Command } from './command';
import { COMMANDS } from './commands';

const VERSION = '0.1.0';

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
  try {
    return await command.run(rest, io);
  } catch (error) {
    if (isInputError(error)) {
      io.err(`stratplot ${name}: ${error.message}\n`);
      return 2;
    }
    const message = error instanceof Error ? error.message : String(error);
    io.err(`stratplot ${name}: internal error: ${message} (please report this with the input that caused it)\n`);
    return 1;
  }
}
