import { writeFile } from 'node:fs/promises';
import { basename, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { designRun, designSampling } from '../../core/design/designRun';
import { type DesignStagesAhead, designStagesAhead } from '../designStagesAhead';
import { designSettingsDefault } from '../../core/design/designSettingsDefault';
import type { DesignSettings, PlotCollection, RngVersion } from '../../core/model/designTypes';
import { footprintParse } from '../../core/design/footprintParse';
import { InputError } from '../../core/common/InputError';
import { plotCollectionNamed } from '../../core/field/plotCollectionNamed';
import { RNG_VERSION_CURRENT, rngSeedFromClock } from '../../core/design/place/rng';
import { rngVersionOf, rngVersionText } from '../../core/design/place/rngStreams';
import { DESIGN_OUTPUT_FORMATS, designOutputBytes } from '../../io/plots/designOutput';
import { type CliIo, type Command, CommandStatus, EXIT_SHORT } from '../command';
import { IMPORT_FLAG_SPECS, type ImportChoices, importFlagsHelp, importFlagsRead, importOtherFile } from '../importFlags';
import { optionNumber } from '../optionNumber';
import { readInputFile } from '../readInput';
import { siteFromInputs } from '../siteFromInputs';
import { M2_PER_HA } from '../../core/common/units';

const USAGE = `stratplot plan <strata-file> --plots N [options]

Makes a stratified survey design: allocates plots to strata and places them wholly inside their
stratum, clear of every buffered exclusion, at a minimum spacing, with ranked reserves.

Allocation:
  --plots N                 total primary plots (required unless --target-halfwidth is given)
  --field NAME              property holding the stratum of each polygon (default stratum)
  --site-name NAME          the site's name in the files written (default: the strata file's name)
  --allocation A            proportional | equal | neyman (default proportional)
  --share-basis B           usable | mapped: area the shares follow (default usable)
  --min-per-stratum K       at least K plots in every stratum (default 2)
  --sd KEY=V,...            pilot standard deviations by stratum (neyman, target)
  --cost KEY=V,...          cost per plot by stratum: relative for neyman, in the budget's units
                            with --budget (default 1)
  --target-halfwidth X[%]   size the design for a 95 % CI half-width X of the stratified mean
                            (X% = relative to --pilot-mean)
  --pilot-mean M            pilot mean, for a relative target
  --budget C                size the design by a budget: the largest design whose plots cost at
                            most C less the overhead (neyman with --cost: the cost-optimum)
  --overhead C0             fixed cost of the survey whatever the number of plots (default 0)
  --redistribute            move plots a full stratum cannot hold to strata with room
Placement:
  --exclude FILE            exclusions (cliff, water, private, hazard, other); repeat for more files
  --access FILE             access points (car park, gate): field files get each plot's distance
                            and bearing from the nearest one, and safety notes
  --boundary FILE           site boundary: ground inside it that no stratum covers is warned about
  --method M                random | balanced | grid | transect (default random)
  --spacing M               minimum metres between plot centres (default 0)
  --footprint F             point | square:10 | rect:20x5@30 | circle:5 (metres; @angle clockwise
                            from true north; default point)
  --edge-buffer M           metres each footprint keeps from its stratum boundary (default 0)
  --reserve R               ranked reserve plots per stratum (default 0)
  --grid-spacing M          grid method: metres between grid lines (default: from --plots)
  --grid-angle DEG          grid method: turn the grid clockwise from true north (default 0)
  --baseline FILE           transect method: a line file; transects run perpendicular to it
  --transect-interval M     transect method: metres between transects
  --quadrat-interval M      transect method: metres between quadrats along a transect
  --seed S                  random seed (default: from the clock, printed to stderr)
  --rng-version V           random generator version: 3 (default), or 2 or 1 to make again a
                            design its plot file says was made with it (a file that records
                            no version was made with 1)
Output:
  --out FILE                write the design; the extension picks the format:
${Object.entries(DESIGN_OUTPUT_FORMATS)
  .map(([ext, what]) => `                              .${ext.padEnd(8)} ${what}`)
  .join('\n')}
  --json                    print the design summary as JSON to stdout
  --allow-short             exit 0 even when fewer plots or reserves fit than were asked for
Without --out the plot GeoJSON goes to stdout.

Exit status: 0 done; 2 bad input (one line on stderr says what and where); ${EXIT_SHORT} the design was
made and written but holds fewer plots or reserves than asked for (the shortfall per stratum is in
the output), unless --allow-short is given.

${importFlagsHelp('<strata-file>')}

Mapped buffers are a planning aid: on the ground follow local codes, the landholder's permission
and your employer's safety plan.`;

function numberOption(v: string | undefined, name: string): number | undefined {
  if (v === undefined) return undefined;
  const x = optionNumber(v);
  if (Number.isNaN(x)) throw new InputError(`${name} needs a number, got "${v.slice(0, 40)}"`);
  return x;
}

function wholeOption(v: string | undefined, name: string): number | undefined {
  const x = numberOption(v, name);
  if (x !== undefined && !(Number.isInteger(x) && x >= 0)) throw new InputError(`${name} needs a whole number ≥ 0, got "${v}"`);
  return x;
}

function rngVersionOption(v: string | undefined): RngVersion | undefined {
  if (v === undefined) return undefined;
  if (v === '1' || v === '2' || v === '3') return Number(v) as RngVersion;
  throw new InputError(`--rng-version needs 1, 2 or 3, got "${v}"`);
}

/** Reads "KEY=V,KEY=V" (a key may hold spaces; the value follows the last "="). */
function keyValues(v: string | undefined, name: string, keys: readonly string[]): Record<string, number> {
  const out: Record<string, number> = {};
  if (v === undefined) return out;
  for (const item of v.split(',')) {
    const at = item.lastIndexOf('=');
    if (at <= 0) throw new InputError(`${name}: "${item}" is not KEY=VALUE`);
    const key = item.slice(0, at).trim();
    const value = optionNumber(item.slice(at + 1));
    if (!keys.includes(key)) throw new InputError(`${name}: no stratum "${key}"; strata are ${keys.map((k) => `"${k}"`).join(', ')}`);
    if (Number.isNaN(value)) throw new InputError(`${name}: the value for "${key}" is not a number`);
    out[key] = value;
  }
  return out;
}

async function readBaseline(io: CliIo, path: string, imports: ImportChoices): Promise<number[][]> {
  const file = await readInputFile(io, path);
  const fc = await importOtherFile(file.name, file.bytes, imports);
  for (const f of fc.features) {
    if (f.geometry?.type === 'LineString') return f.geometry.coordinates;
    if (f.geometry?.type === 'MultiLineString' && f.geometry.coordinates.length) return f.geometry.coordinates[0];
  }
  throw new InputError(`${file.name}: no LineString feature to use as the transect baseline`);
}

function summaryTable(c: PlotCollection): string {
  const head = ['stratum', 'mapped ha', 'usable ha', 'share', 'plots', 'reserve', 'capacity'];
  const rows = c.design.allocation.map((r) => [
    r.stratum,
    (r.mapped_m2 / M2_PER_HA).toFixed(2),
    (r.usable_m2 / M2_PER_HA).toFixed(2),
    `${(r.share * 100).toFixed(1)} %`,
    String(r.plots),
    String(r.reserve),
    r.capacity === null ? '-' : String(r.capacity),
  ]);
  const widths = head.map((h, j) => Math.max(h.length, ...rows.map((x) => x[j].length)));
  const fmt = (cells: string[]) => cells.map((x, j) => (j === 0 ? x.padEnd(widths[j]) : x.padStart(widths[j]))).join('  ');
  const lines = [
    fmt(head),
    ...rows.map(fmt),
    '',
    `CRS: WGS84 / UTM zone ${c.design.crs.utm_zone} (EPSG:${c.design.crs.epsg}); seed ${c.design.seed}, ${rngVersionText(rngVersionOf(c.design.settings))}`,
  ];
  if (c.design.warnings.length) lines.push('', 'Warnings:', ...c.design.warnings.map((w) => `  - ${w}`));
  lines.push('', ...c.design.statements.map((s) => `* ${s}`), '');
  return lines.join('\n');
}

async function run(argv: string[], io: CliIo): Promise<number> {
  const parsed = parse(argv);
  const { values: o, positionals } = parsed;
  if (positionals.length !== 1) throw new InputError(`give exactly one strata file (got ${positionals.length}); see stratplot plan --help`);
  if (o.out !== undefined) {
    const dot = o.out.lastIndexOf('.');
    const ext = dot >= 0 ? o.out.slice(dot + 1).toLowerCase() : '';
    if (!Object.hasOwn(DESIGN_OUTPUT_FORMATS, ext)) {
      throw new InputError(`--out ${o.out}: unknown format; use one of ${Object.keys(DESIGN_OUTPUT_FORMATS).map((e) => `.${e}`).join(', ')}`);
    }
  }
  const imports = importFlagsRead(o);
  const ahead = designStagesAhead(designSampling(rngVersionOption(o['rng-version']) ?? RNG_VERSION_CURRENT));
  try {
    return await planWith(ahead, o, positionals[0], imports, io);
  } finally {
    ahead?.stop();
  }
}

type PlanOptions = ReturnType<typeof parse>['values'];

async function planWith(ahead: DesignStagesAhead | null, o: PlanOptions, strataPath: string, imports: ImportChoices, io: CliIo): Promise<number> {
  const loaded = await siteFromInputs(io, {
    strata: strataPath,
    field: o.field,
    exclude: o.exclude,
    access: o.access,
    boundary: o.boundary,
    name: o['site-name'],
    imports,
    onStrataRead: ahead ? (strata, parts) => ahead.strataRead(strata, parts) : undefined,
    onExclusionsRead: ahead ? (exclusions) => ahead.exclusionsRead(exclusions) : undefined,
  });
  const { site } = loaded;
  const { strata } = site;
  for (const w of loaded.warnings) io.err(`warning: ${w}\n`);
  const keys = strata.map((s) => s.key);
  const target = o['target-halfwidth'];
  let targetHalfwidth: DesignSettings['targetHalfwidth'] = null;
  if (target !== undefined) {
    const relative = target.trim().endsWith('%');
    const value = numberOption(relative ? target.trim().slice(0, -1) : target, '--target-halfwidth')!;
    targetHalfwidth = { value: relative ? value / 100 : value, relative };
  }
  const plots = wholeOption(o.plots, '--plots');
  const budgetTotal = numberOption(o.budget, '--budget');
  if (o.overhead !== undefined && budgetTotal === undefined) throw new InputError('--overhead needs --budget C');
  const budget = budgetTotal === undefined ? null : { total: budgetTotal, overhead: numberOption(o.overhead, '--overhead') ?? 0 };
  const method = o.method ?? 'random';
  const sizedByLayout = method === 'transect' || (method === 'grid' && o['grid-spacing'] !== undefined);
  if (plots === undefined && !targetHalfwidth && !budget && !sizedByLayout) {
    throw new InputError(
      method === 'grid' ? 'give --plots N or --grid-spacing M for a grid design' : 'give --plots N (or --target-halfwidth X or --budget C to size the design)',
    );
  }
  let seed = numberOption(o.seed, '--seed');
  if (seed === undefined) {
    seed = rngSeedFromClock(Date.now());
    io.err(`seed: ${seed} (give --seed ${seed} to repeat this design)\n`);
  }
  const settings = designSettingsDefault({
    plots: plots ?? 0,
    allocation: o.allocation as DesignSettings['allocation'] | undefined,
    shareBasis: o['share-basis'] as DesignSettings['shareBasis'] | undefined,
    minPerStratum: wholeOption(o['min-per-stratum'], '--min-per-stratum'),
    sd: keyValues(o.sd, '--sd', keys),
    cost: keyValues(o.cost, '--cost', keys),
    targetHalfwidth,
    budget,
    pilotMean: numberOption(o['pilot-mean'], '--pilot-mean'),
    spacingM: numberOption(o.spacing, '--spacing'),
    footprint: o.footprint === undefined ? undefined : footprintParse(o.footprint, '--footprint'),
    edgeBufferM: numberOption(o['edge-buffer'], '--edge-buffer'),
    reservePerStratum: wholeOption(o.reserve, '--reserve'),
    method: method as DesignSettings['method'],
    gridSpacingM: numberOption(o['grid-spacing'], '--grid-spacing'),
    gridAngleDeg: numberOption(o['grid-angle'], '--grid-angle'),
    baseline: o.baseline ? await readBaseline(io, o.baseline, imports) : undefined,
    transectIntervalM: numberOption(o['transect-interval'], '--transect-interval'),
    quadratIntervalM: numberOption(o['quadrat-interval'], '--quadrat-interval'),
    seed,
    rngVersion: rngVersionOption(o['rng-version']),
    redistributeShortfall: o.redistribute,
  });
  const stages = ahead ? await ahead.finish(site) : null;
  const collection = designRun(site, settings, { made: stages?.made });
  // The plot file names strata as people read them (current name and code), as every export does.
  const named = plotCollectionNamed(collection, site.strata);
  const geojson = JSON.stringify(named);
  if (o.out) {
    const lower = o.out.toLowerCase();
    const bytes = lower.endsWith('.geojson') || lower.endsWith('.json') ? geojson : await designOutputBytes(basename(o.out), collection, site);
    await writeFile(resolve(io.cwd, o.out), bytes);
  }
  if (o.json) io.out(`${JSON.stringify(named.design)}\n`);
  else if (o.out) io.out(summaryTable(named));
  else io.out(`${geojson}\n`);
  if (o.json && !o.out) io.err('note: with --json and no --out, no plot file was written\n');
  for (const w of named.design.warnings) if (!o.json && !o.out) io.err(`warning: ${w}\n`);
  const short = shortfall(collection, settings);
  if (short && !o['allow-short']) {
    throw new CommandStatus(EXIT_SHORT, `the design is short: ${short}; it was written with the shortfall per stratum in its summary; give --allow-short to accept a short design`);
  }
  return 0;
}

/**
 * What a design lacks against what was asked, in words, or null when it holds everything: the
 * primaries asked for (random and balanced designs of a given size), the reserves of every stratum,
 * and the strata where placement gave up.
 */
function shortfall(c: PlotCollection, s: DesignSettings): string | null {
  const rows = c.design.allocation;
  const placed = rows.reduce((a, r) => a + r.plots, 0);
  const reserves = rows.reduce((a, r) => a + r.reserve, 0);
  const wantedReserves = s.reservePerStratum * rows.length;
  const sized = s.method === 'random' || s.method === 'balanced';
  const gaveUp = rows.filter((r) => r.capacity !== null).map((r) => `"${r.stratum}" holds ${r.capacity}`);
  const parts: string[] = [];
  if (sized && !s.targetHalfwidth && placed < s.plots) parts.push(`${placed} of ${s.plots} plots placed`);
  else if (sized && s.targetHalfwidth && gaveUp.length > 0 && !s.redistributeShortfall) parts.push(`${placed} plots placed, fewer than the target needs`);
  if (reserves < wantedReserves) parts.push(`${reserves} of ${wantedReserves} reserves placed`);
  if (parts.length === 0) return null;
  return gaveUp.length > 0 ? `${parts.join(', ')} (${gaveUp.join(', ')})` : parts.join(', ');
}

function parse(argv: string[]) {
  return parseArgs({
    args: argv,
    allowPositionals: true,
    strict: true,
    options: {
      plots: { type: 'string' },
      field: { type: 'string' },
      'site-name': { type: 'string' },
      exclude: { type: 'string', multiple: true },
      access: { type: 'string', multiple: true },
      boundary: { type: 'string' },
      allocation: { type: 'string' },
      'share-basis': { type: 'string' },
      'min-per-stratum': { type: 'string' },
      sd: { type: 'string' },
      cost: { type: 'string' },
      'target-halfwidth': { type: 'string' },
      'pilot-mean': { type: 'string' },
      budget: { type: 'string' },
      overhead: { type: 'string' },
      spacing: { type: 'string' },
      footprint: { type: 'string' },
      'edge-buffer': { type: 'string' },
      reserve: { type: 'string' },
      method: { type: 'string' },
      'grid-spacing': { type: 'string' },
      'grid-angle': { type: 'string' },
      baseline: { type: 'string' },
      'transect-interval': { type: 'string' },
      'quadrat-interval': { type: 'string' },
      redistribute: { type: 'boolean' },
      'allow-short': { type: 'boolean' },
      seed: { type: 'string' },
      'rng-version': { type: 'string' },
      out: { type: 'string' },
      json: { type: 'boolean' },
      ...IMPORT_FLAG_SPECS,
    },
  });
}

/** `stratplot plan`: allocation, constrained placement and reserves, written as a plot file. */
export const planCommand: Command = {
  summary: 'allocate and place plots (random, balanced, grid or transect) with reserves',
  usage: USAGE,
  run,
};
