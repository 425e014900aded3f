import { writeFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { InputError } from '../../core/common/InputError';
import { rngSeedFromClock } from '../../core/design/place/rng';
import { type TrapGridLayout, trapGridsPlace } from '../../core/design/trapGridsPlace';
import { designOutputBytes } from '../../io/plots/designOutput';
import type { CliIo, Command } from '../command';
import { IMPORT_FLAG_SPECS, importFlagsHelp, importFlagsRead } from '../importFlags';
import { optionNumber } from '../optionNumber';
import { siteFromInputs } from '../siteFromInputs';

const USAGE = `stratplot traps <strata-file> --grids G --rows R --cols C --spacing S --separation D [options]

Places live-trapping grids for mark–recapture: G grids of R × C stations per stratum, S metres
between stations, each grid wholly inside its stratum, clear of every buffered exclusion and at
least D metres from every other grid. Station ids are grid, row letter and column, e.g. G1-A03.

Options:
  --field NAME        stratum field of the strata file (default stratum)
  --exclude FILE      exclusions (cliff, water, private, hazard, other with buffer_m); repeatable
  --grids G           grids in every stratum, or KEY=G,KEY=G for chosen strata only
  --rows R --cols C   stations per grid (rows A–Z, at most 26)
  --spacing S         metres between neighbouring stations
  --separation D      metres between the outlines of any two grids (default 0)
  --edge-buffer M     metres every grid keeps from its stratum's edge (default 0)
  --angle DEG         turn of the rows from true east, degrees clockwise (default 0)
  --seed N            random seed (default from the clock, printed)
  --out FILE          write the stations: .geojson/.json plot file, or .gpx .kml .kmz .csv .zip .gpkg .pdf
  --json              print the grids and warnings as JSON

${importFlagsHelp('<strata-file>')}`;

function num(v: string | undefined, name: string, fallback?: number): number {
  if (v === undefined) {
    if (fallback === undefined) throw new InputError(`${name} is required (see stratplot traps --help)`);
    return fallback;
  }
  const x = optionNumber(v);
  if (Number.isNaN(x)) throw new InputError(`${name} needs a number, got "${v.slice(0, 40)}"`);
  return x;
}

function gridsOption(v: string | undefined, keys: readonly string[]): number | Record<string, number> {
  if (v === undefined) throw new InputError('--grids is required (see stratplot traps --help)');
  if (!v.includes('=')) return num(v, '--grids');
  const out: Record<string, number> = {};
  for (const item of v.split(',')) {
    const at = item.lastIndexOf('=');
    const key = item.slice(0, at).trim();
    if (at <= 0 || !keys.includes(key)) throw new InputError(`--grids: no stratum "${key}"; strata are ${keys.map((k) => `"${k}"`).join(', ')}`);
    out[key] = num(item.slice(at + 1), `--grids for "${key}"`);
  }
  return out;
}

function summary(layout: TrapGridLayout): string {
  const lines = layout.grids.map((g) => `  ${g.grid.padEnd(5)} ${g.stratum.padEnd(24)} centre ${g.centre[1].toFixed(6)}, ${g.centre[0].toFixed(6)}  ${g.stations} stations`);
  const d = layout.design;
  return [
    `${layout.grids.length} trap grids, ${layout.features.length} stations; CRS WGS84 / UTM zone ${d.crs.utm_zone} (EPSG:${d.crs.epsg}); seed ${d.seed}`,
    ...lines,
    ...(d.warnings.length ? ['', 'Warnings:', ...d.warnings.map((w) => `  - ${w}`)] : []),
    '',
    ...d.statements.map((s) => `* ${s}`),
    '',
  ].join('\n');
}

/** `stratplot traps`: trapping grids placed inside strata and clear of exclusions. */
export const trapsCommand: Command = {
  summary: 'place mark–recapture trapping grids inside strata',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const parsed = parse(argv);
    const { values: o, positionals } = parsed;
    if (positionals.length !== 1) throw new InputError(`give exactly one strata file (got ${positionals.length}); see stratplot traps --help`);
    const imports = importFlagsRead(o);
    const loaded = await siteFromInputs(io, { strata: positionals[0], field: o.field, exclude: o.exclude, imports });
    const { site } = loaded;
    const { strata } = site;
    for (const w of loaded.warnings) io.err(`warning: ${w}\n`);
    const seed = o.seed === undefined ? rngSeedFromClock(Date.now()) : num(o.seed, '--seed');
    const layout = trapGridsPlace(site, {
      gridsPerStratum: gridsOption(o.grids, strata.map((s) => s.key)),
      rows: num(o.rows, '--rows'),
      cols: num(o.cols, '--cols'),
      spacingM: num(o.spacing, '--spacing'),
      minSeparationM: num(o.separation, '--separation', 0),
      edgeBufferM: num(o['edge-buffer'], '--edge-buffer', 0),
      angleDeg: num(o.angle, '--angle', 0),
      seed,
    });
    if (o.seed === undefined) io.err(`seed ${seed} (give --seed ${seed} to repeat this layout)\n`);
    if (o.out) {
      const bytes = await designOutputBytes(o.out, layout, site);
      try {
        await writeFile(resolve(io.cwd, o.out), bytes);
      } catch (error) {
        throw new InputError(`cannot write ${o.out}: ${(error as Error).message}`);
      }
    }
    if (o.json) io.out(`${JSON.stringify({ grids: layout.grids, stations: layout.features.length, seed, crs: layout.design.crs, warnings: layout.design.warnings, statements: layout.design.statements })}\n`);
    else io.out(summary(layout));
    return 0;
  },
};

function parse(argv: string[]) {
  return parseArgs({
    args: argv,
    allowPositionals: true,
    strict: true,
    options: {
      field: { type: 'string' },
      exclude: { type: 'string', multiple: true },
      grids: { type: 'string' },
      rows: { type: 'string' },
      cols: { type: 'string' },
      spacing: { type: 'string' },
      separation: { type: 'string' },
      'edge-buffer': { type: 'string' },
      angle: { type: 'string' },
      seed: { type: 'string' },
      out: { type: 'string' },
      json: { type: 'boolean' },
      ...IMPORT_FLAG_SPECS,
    },
  });
}
