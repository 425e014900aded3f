import { parseArgs } from 'node:util';
import { InputError } from '../../core/common/InputError';
import { type RecaptureEstimate, recaptureEffectiveAreaHa, recaptureEstimate } from '../../core/results/recapture';
import type { CliIo, Command } from '../command';
import { optionNumber } from '../optionNumber';

const USAGE = `stratplot recapture --marked M --caught n --recaptured m [area options] [--json]

Two-session mark–recapture abundance: Lincoln–Petersen and Chapman estimates, Seber's variance,
95 % CI, and density when a trapping area is given (Seber 1982, ch. 3).

Options:
  --marked M          animals marked and released in the first session
  --caught n          animals caught in the second session
  --recaptured m      marked animals among those caught in the second session
  --grid-area-ha A    trapping grid area in ha (taken as a square) ...
  --grid-spacing S --rows R --cols C
                      ... or a grid of R × C stations S metres apart
  --strip-m W         boundary strip added around the grid, m (required with a grid)
  --json              print the result as JSON`;

function count(values: Record<string, string | boolean | undefined>, name: string): number {
  const text = values[name];
  if (typeof text !== 'string') throw new InputError(`--${name} is required`);
  const v = optionNumber(text);
  // Beyond 2⁵³ a count is no longer a whole number in floating point, so it would be rounded silently.
  if (!/^\s*\d+\s*$/.test(text) || !Number.isSafeInteger(v)) throw new InputError(`--${name} must be a whole number ≥ 0, got "${text.slice(0, 40)}"`);
  return v;
}

function positive(values: Record<string, string | boolean | undefined>, name: string): number {
  const text = values[name];
  if (typeof text !== 'string') throw new InputError(`--${name} is required with this grid`);
  const v = optionNumber(text);
  if (Number.isNaN(v)) throw new InputError(`--${name} must be a number, got "${text.slice(0, 40)}"`);
  return v;
}

function areaFrom(values: Record<string, string | boolean | undefined>): number | undefined {
  const byArea = values['grid-area-ha'] !== undefined;
  const byGrid = values['grid-spacing'] !== undefined || values.rows !== undefined || values.cols !== undefined;
  if (!byArea && !byGrid) {
    if (values['strip-m'] !== undefined) throw new InputError('--strip-m needs a grid: give --grid-area-ha or --grid-spacing with --rows and --cols');
    return undefined;
  }
  if (byArea && byGrid) throw new InputError('give either --grid-area-ha or --grid-spacing/--rows/--cols, not both');
  if (values['strip-m'] === undefined) throw new InputError('--strip-m W is required with a grid (use 0 for no boundary strip)');
  const strip = positive(values, 'strip-m');
  if (byArea) return recaptureEffectiveAreaHa({ areaHa: positive(values, 'grid-area-ha') }, strip);
  return recaptureEffectiveAreaHa({ spacingM: positive(values, 'grid-spacing'), rows: positive(values, 'rows'), cols: positive(values, 'cols') }, strip);
}

const row = (label: string, value: string) => `  ${label.padEnd(36)} ${value}`;

function print(r: RecaptureEstimate, io: CliIo): void {
  const lines = [
    'Two-session mark–recapture estimate',
    row('Petersen N̂ = Mn/m', r.petersen === null ? 'n/a (no recaptures)' : r.petersen.toFixed(1)),
    row('Chapman N* = (M+1)(n+1)/(m+1) − 1', r.chapman.toFixed(1)),
    row('SE (Seber)', r.se.toFixed(2)),
    row('95 % CI', `${r.ci95[0].toFixed(1)} to ${r.ci95[1].toFixed(1)} (normal approximation; at least the ${r.knownMinimum} animals seen)`),
  ];
  if (r.density) {
    const d = r.density;
    lines.push(
      row('effective area', `${d.effectiveAreaHa.toFixed(3)} ha (grid plus boundary strip)`),
      row('density', `${d.perHa.toFixed(3)} per ha, SE ${d.sePerHa.toFixed(3)}, 95 % CI ${d.ci95PerHa[0].toFixed(3)} to ${d.ci95PerHa[1].toFixed(3)}`),
    );
  }
  if (r.warnings.length > 0) lines.push('', 'Warnings:', ...r.warnings.map((w) => `  - ${w}`));
  lines.push('', 'The estimate assumes:', ...r.assumptions.map((a) => `  - ${a}`));
  lines.push('', 'Handle and mark animals only under the permits and animal-ethics approval your jurisdiction requires.', '');
  io.out(lines.join('\n'));
}

/** `stratplot recapture`: Petersen/Chapman abundance and density from two sessions. */
export const recaptureCommand: Command = {
  summary: 'mark–recapture abundance and density (Petersen, Chapman)',
  usage: USAGE,
  async run(argv, io) {
    const { values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        marked: { type: 'string' },
        caught: { type: 'string' },
        recaptured: { type: 'string' },
        'grid-area-ha': { type: 'string' },
        'grid-spacing': { type: 'string' },
        rows: { type: 'string' },
        cols: { type: 'string' },
        'strip-m': { type: 'string' },
        json: { type: 'boolean' },
      },
    });
    const counts = { marked: count(values, 'marked'), caught: count(values, 'caught'), recaptured: count(values, 'recaptured') };
    const effectiveAreaHa = areaFrom(values);
    const r = recaptureEstimate(counts, { effectiveAreaHa });
    if (values.json) {
      io.out(
        `${JSON.stringify({
          marked: counts.marked,
          caught: counts.caught,
          recaptured: counts.recaptured,
          petersen: r.petersen,
          chapman: r.chapman,
          se: r.se,
          variance: r.variance,
          ci95: r.ci95,
          known_minimum: r.knownMinimum,
          effective_area_ha: r.density?.effectiveAreaHa ?? null,
          density_per_ha: r.density?.perHa ?? null,
          density_se_per_ha: r.density?.sePerHa ?? null,
          density_ci95_per_ha: r.density?.ci95PerHa ?? null,
          warnings: r.warnings,
          assumptions: r.assumptions,
          formulas: [
            'Petersen N̂ = Mn/m',
            'Chapman N* = (M+1)(n+1)/(m+1) − 1',
            'Seber v(N*) = (M+1)(n+1)(M−m)(n−m)/[(m+1)²(m+2)]',
            '95 % CI N* ± 1.96 √v, lower end at least M + n − m',
            'effective area = L1·L2 + 2W(L1 + L2) + πW²',
          ],
        })}\n`,
      );
    } else print(r, io);
    return 0;
  },
};
