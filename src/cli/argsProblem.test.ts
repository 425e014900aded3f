import { describe, expect, it } from 'vitest';
import { COMMANDS } from './commands';
import { runCli } from './main';

async function cli(argv: string[]) {
  let err = '';
  const code = await runCli(argv, { out: () => {}, err: (t) => (err += t), cwd: process.cwd() });
  return { code, err };
}

describe('command-line option mistakes', () => {
  // One wording for every command, worded by argsProblem (common practice, no source).
  for (const name of Object.keys(COMMANDS)) {
    it(`${name}: an unknown option is one line naming it, exit 2`, async () => {
      expect(await cli([name, '--no-such-option'])).toEqual({ code: 2, err: `stratplot ${name}: unknown option --no-such-option (see stratplot ${name} --help)\n` });
    });
  }

  it('an option given without its value is named', async () => {
    expect(await cli(['plan', 'strata.geojson', '--spacing'])).toEqual({ code: 2, err: 'stratplot plan: option --spacing needs a value (see stratplot plan --help)\n' });
  });
});
