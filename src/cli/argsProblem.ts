/**
 * What was wrong with a command line that node:util's parseArgs refused, in the CLI's own words
 * ("unknown option --x", "option --x needs a value"), or null when the error is not parseArgs'.
 */
export function argsProblem(error: unknown): string | null {
  const e = error as Error & { code?: string };
  if (!(error instanceof Error) || typeof e.code !== 'string' || !e.code.startsWith('ERR_PARSE_ARGS')) return null;
  const named = /'([^']+)'/.exec(e.message)?.[1] ?? '';
  if (e.code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') return `unknown option ${named}`;
  if (e.code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE') return `option ${named.split(' ')[0]} needs a value`;
  if (e.code === 'ERR_PARSE_ARGS_UNEXPECTED_POSITIONAL') return `unexpected argument ${named}`;
  return e.message.split('\n')[0];
}
