import { describe, expect, it } from 'vitest';
import { runCli } from '../main';

async function run(argv: string[]) {
  let out = '';
  let err = '';
  const code = await runCli(argv, { out: (t) => (out += t), err: (t) => (err += t), cwd: '/' });
  return { code, out, err };
}

describe('stratplot recapture', () => {
  it('reproduces Krebs (1989) Box 2.1 as JSON', async () => {
    // Krebs, Ecological Methodology, 1989, Box 2.1 (docs/references.md §4): Chapman 2382.80, SE 129.06.
    const r = await run(['recapture', '--marked', '948', '--caught', '421', '--recaptured', '167', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.chapman).toBeCloseTo(2382.8, 2);
    expect(j.se).toBeCloseTo(129.06, 2);
    expect(Math.round(j.petersen)).toBe(2390);
    expect(j.density_per_ha).toBeNull();
  });

  it('gives the README’s invented Ochre Spit example (64, 58, 23) as worked by hand from Seber’s formulas', async () => {
    // Seber 1982 ch. 3 (docs/references.md §4): Chapman (65 · 59)/24 − 1 = 158.7917; variance
    // 65 · 59 · 41 · 35 / (24² · 25) = 5 503 225 / 14 400 = 382.1684, SE 19.549; Petersen 64 · 58/23 = 161.39.
    const j = JSON.parse((await run(['recapture', '--marked', '64', '--caught', '58', '--recaptured', '23', '--json'])).out);
    expect(j.chapman).toBeCloseTo(158.7917, 4);
    expect(j.se).toBeCloseTo(Math.sqrt(5503225 / 14400), 9);
    expect(j.petersen).toBeCloseTo((64 * 58) / 23, 9);
  });

  it('gives density over a station grid plus strip', async () => {
    const r = await run(['recapture', '--marked', '421', '--caught', '332', '--recaptured', '88', '--grid-spacing', '10', '--rows', '10', '--cols', '10', '--strip-m', '20', '--json']);
    const j = JSON.parse(r.out);
    const area = (8100 + 7200 + Math.PI * 400) / 1e4;
    expect(j.effective_area_ha).toBeCloseTo(area, 12);
    expect(j.density_per_ha).toBeCloseTo(j.chapman / area, 9);
  });

  it('prints the estimate, the warnings and the assumptions', async () => {
    const r = await run(['recapture', '--marked', '50', '--caught', '40', '--recaptured', '3', '--grid-area-ha', '4', '--strip-m', '15']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('Chapman');
    expect(r.out).toContain('only 3 recaptures (fewer than 7)');
    expect(r.out).toContain('closed between the sessions');
    expect(r.out).toContain('per ha');
  });

  it('exits 2 with one line for bad counts and options', async () => {
    expect((await run(['recapture', '--marked', '10', '--caught', '5', '--recaptured', '6'])).err).toBe(
      'stratplot recapture: recaptured (6) cannot exceed caught (5)\n',
    );
    expect((await run(['recapture', '--marked', 'ten', '--caught', '5', '--recaptured', '1'])).err).toBe(
      'stratplot recapture: --marked must be a whole number ≥ 0, got "ten"\n',
    );
    expect((await run(['recapture', '--caught', '5', '--recaptured', '1'])).err).toBe('stratplot recapture: --marked is required\n');
    expect((await run(['recapture', '--marked', '9', '--caught', '5', '--recaptured', '1', '--grid-area-ha', '2'])).err).toBe(
      'stratplot recapture: --strip-m W is required with a grid (use 0 for no boundary strip)\n',
    );
    const both = await run(['recapture', '--marked', '9', '--caught', '5', '--recaptured', '1', '--grid-area-ha', '2', '--rows', '3', '--strip-m', '5']);
    expect(both.code).toBe(2);
    expect(both.err).toBe('stratplot recapture: give either --grid-area-ha or --grid-spacing/--rows/--cols, not both\n');
  });
});
