import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../src/cli/main';

const root = resolve(import.meta.dirname, '..');

/**
 * The command-line examples of the README, each as the argument list bash hands the program: the
 * README's own shell text is run by bash with `npx` replaced by a function that prints its arguments,
 * so quoting (a site name with spaces in a bash array) is tested as a user's shell applies it.
 */
function readmeCommands(): string[][] {
  const readme = readFileSync(join(root, 'README.md'), 'utf8');
  const block = /## Command line[\s\S]*?```sh\n([\s\S]*?)```/.exec(readme)?.[1];
  if (!block) throw new Error('README has no command-line example block');
  const script = `npx() { shift; printf '%s\\0' "$@"; printf '\\036'; }\n${block}`;
  const out = execFileSync('bash', ['-c', script], { encoding: 'utf8' });
  return out
    .split('\x1e')
    .filter((c) => c.length > 0)
    .map((c) => c.split('\0').slice(0, -1));
}

describe('the README’s command-line examples', () => {
  it('keep a quoted site name with spaces as one argument', () => {
    const commands = readmeCommands();
    const exports = commands.filter((c) => c[0] === 'export');
    expect(exports.length).toBeGreaterThanOrEqual(4);
    for (const c of exports) expect(c[c.indexOf('--site-name') + 1]).toBe('Ochre Spit (invented)');
  });

  it('run as written, in order, and the site name reaches the files', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'stratplot-readme-'));
    symlinkSync(join(root, 'demo-maps'), join(dir, 'demo-maps'));
    for (const argv of readmeCommands()) {
      let err = '';
      const code = await runCli(argv, { out: () => undefined, err: (t) => (err += t), cwd: dir });
      // The README's check example is the invented set with known faults: it exits 4 as documented.
      const expected = argv[0] === 'check' ? 4 : 0;
      expect({ argv: argv.join(' '), code, err }).toEqual({ argv: argv.join(' '), code: expected, err: expect.not.stringMatching(/error/) });
    }
    expect(readFileSync(join(dir, 'plots.gpx'), 'utf8')).toContain('<metadata><name>Ochre Spit (invented)</name>');
    expect(readFileSync(join(dir, 'check-report.pdf')).subarray(0, 5).toString()).toBe('%PDF-');
    const csv = readFileSync(join(dir, 'plots.csv'), 'utf8');
    expect(csv).toContain('access-north');
  }, 60_000);
});
