import { writeFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { STRATPLOT_VERSION } from '../../core/common/version';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { footprintParse } from '../../core/design/footprintParse';
import { InputError } from '../../core/common/InputError';
import { plotCheckRecordJson } from '../../core/plotCheck/plotCheckRecordOut';
import { plotCheckCountsText, plotCheckSettingsText } from '../../core/plotCheck/plotCheckSettingsText';
import { PLOT_CHECK_SLACK_M, type PlotCheckRecord, type PlotsCheckReport } from '../../core/plotCheck/plotCheckTypes';
import { plotCheckRecordsBySeverity, plotsCheck } from '../../core/plotCheck/plotsCheck';
import { EXCLUSION_KINDS } from '../../core/model/types';
import { parseFeatureFile } from '../../io/site/parseFeatureFile';
import { type PlotCheckReportMeta, plotCheckReportCsv } from '../../io/plotCheck/plotCheckReportCsv';
import { plotsFromFeatures } from '../../io/plots/plotsFromFeatures';
import type { CliIo, Command } from '../command';
import { IMPORT_FLAG_SPECS, type ImportFlagValues, importFlagsRead, importOptionsFor } from '../importFlags';
import { readInputFile } from '../readInput';
import { siteFromInputs } from '../siteFromInputs';
import { M2_PER_HA } from '../../core/common/units';
import { stratumLabel } from '../../core/field/stratumLabel';

/** Exit status when at least one plot fails a check (0: every plot passes; 2: bad input). */
export const CHECK_EXIT_FAILED = 4;

const USAGE = `stratplot check <plots-file> --strata FILE [options]

Checks a set of plots made elsewhere (a contractor's design, last season's permanent plots,
waypoints a crew recorded) against the site, with the same geometry stratplot plan places plots
with: the stratum each plot falls in (or none, or a hole), whether the plot or its footprint lies
inside an exclusion widened by its buffer (with the exclusion's kind, name and distance), the
nearest exclusion of each kind, the footprint against its stratum's boundary and edge buffer, the
nearest other plot against --spacing, plots at the same position or with the same id, and the
distance and true/magnetic bearing from the nearest access point. For the set: plots per stratum
against a proportional allocation on the usable area, and notes on what it can stand for as a sample.

The plots file may be GeoJSON, GPX (waypoints), KML/KMZ (placemarks), point CSV, a zipped
shapefile or a GeoPackage; each plot keeps its id or name from the file (plot_id, id, name... or
--id-field). Lines and polygons, and the access points and exclusions stratplot writes beside
plots, are not read as plots.

  --strata FILE       the site's strata (required)
  --field NAME        property holding each polygon's stratum (default stratum)
  --exclude FILE      exclusions (repeat for more files)
  --access FILE       access points (repeat for more files): distances and bearings to each plot
  --spacing M         minimum metres between plot centres (default 0: no spacing test)
  --footprint F       point | square:10 | rect:20x5@30 | circle:5 (default point)
  --edge-buffer M     metres each footprint keeps from its stratum boundary (default 0)
  --survey-date D     survey day YYYY-MM-DD, for the magnetic declination (default today)
  --id-field NAME     property holding each plot's id (default: plot_id, id, name... whichever is there)
  --site-name NAME    the site's name in the report (default: the strata file's name)
  --json              print the summary and one record per plot (id, ok, problems, distances) as JSON
  --out FILE          also write the report: .pdf (map, tables, caution, lines to sign) or .csv
  --paper P           pdf: a4 | letter (default a4)
Limits (buffers, edge buffer, spacing) count as met to within ${PLOT_CHECK_SLACK_M} m, the rounding of positions in
plot files; a plot that stratplot plan writes passes with the same site and settings.

Exit status: 0 when every plot passes, ${CHECK_EXIT_FAILED} when any plot fails a check, 2 on bad input.

Reading the plots file (<plots-file>); the site's files must carry their own CRS and layer:
  --layer NAME        layer of a GeoPackage, a zip of several shapefiles or a KML/KMZ folder
  --epsg CODE         EPSG code of its coordinates (a shapefile without .prj, a CSV of eastings/northings)
  --encoding NAME     text encoding of a .dbf without .cpg, or of a CSV or GeoJSON file
  --x-column NAME     with --y-column: the coordinate columns of a point CSV (in --epsg when given,
  --y-column NAME     else longitude/latitude); these two also apply to CSVs given for the site

A check is a planning aid: on the ground follow local codes, the landholder's permission and your
employer's safety plan, and do not enter ground that is unsafe on the day.`;

function distanceOption(v: string | undefined, name: string): number | undefined {
  if (v === undefined) return undefined;
  const x = Number(v);
  if (v.trim() === '' || !Number.isFinite(x) || x < 0) throw new InputError(`${name} needs a distance of 0 or more metres, got "${v}"`);
  return x;
}

function recordLine(r: PlotCheckRecord): string {
  const where = r.stratum ? stratumLabel(r.stratum.name, r.stratum.code) : r.holeIn ? `in a hole in ${r.holeIn.name}` : 'no stratum';
  const near = EXCLUSION_KINDS.flatMap((k) => (r.nearestByKind[k] ? [`${k} ${r.nearestByKind[k]!.distanceM.toFixed(1)} m`] : []));
  const route = r.access ? `; from ${r.access.accessPointName} ${r.access.distanceM.toFixed(0)} m at ${r.access.bearingTrueDeg.toFixed(1)}° true / ${r.access.bearingMagDeg.toFixed(1)}° magnetic` : '';
  const head = `${r.ok ? 'pass' : 'FAIL'} ${r.id} (${r.where}), ${where}${near.length ? `; nearest ${near.join(', ')}` : ''}${route}`;
  return [head, ...r.problems.map((p) => `       - ${p.text}`)].join('\n');
}

function textReport(report: PlotsCheckReport, plotsFile: string, siteName: string): string {
  const head = ['stratum', 'usable ha', 'plots', 'passing', 'proportional'];
  const rows = report.strata.map((s) => [stratumLabel(s.name, s.code), (s.usableM2 / M2_PER_HA).toFixed(2), String(s.plots), String(s.passing), String(s.proportional)]);
  const widths = head.map((h, j) => Math.max(h.length, ...rows.map((x) => x[j].length)));
  const fmt = (cells: string[]) => cells.map((x, j) => (j === 0 ? x.padEnd(widths[j]) : x.padStart(widths[j]))).join('  ');
  return [
    `${plotsFile} against site "${siteName}": ${plotCheckCountsText(report)}`,
    `Settings: ${plotCheckSettingsText(report)}`,
    '',
    ...plotCheckRecordsBySeverity(report.plots).map(recordLine),
    '',
    fmt(head),
    ...rows.map(fmt),
    '',
    ...(report.notes.length ? ['Notes:', ...report.notes.map((n) => `  - ${n}`), ''] : []),
    FIELD_CAUTION,
    '',
  ].join('\n');
}

async function run(argv: string[], io: CliIo): Promise<number> {
  const parsed = parse(argv);
  const { values: o, positionals } = parsed;
  if (positionals.length !== 1) throw new InputError(`give exactly one plots file (got ${positionals.length}), e.g. stratplot check plots.gpx --strata strata.geojson`);
  if (!o.strata) throw new InputError('--strata FILE is required: plots are checked against the site it maps');
  const outExt = o.out === undefined ? null : o.out.slice(o.out.lastIndexOf('.') + 1).toLowerCase();
  if (o.out !== undefined && outExt !== 'pdf' && outExt !== 'csv') throw new InputError(`--out ${o.out}: the report is written as .pdf or .csv`);
  const paper = (o.paper ?? 'a4').toLowerCase();
  if (paper !== 'a4' && paper !== 'letter') throw new InputError(`--paper must be a4 or letter, got "${o.paper}"`);
  let surveyDate = new Date();
  if (o['survey-date'] !== undefined) {
    const text = o['survey-date'];
    surveyDate = new Date(/^\d{4}-\d{2}-\d{2}$/.test(text) ? `${text}T12:00:00Z` : 'invalid');
    if (Number.isNaN(surveyDate.getTime())) throw new InputError(`--survey-date needs YYYY-MM-DD, got "${text}"`);
  }
  const spacingM = distanceOption(o.spacing, '--spacing') ?? 0;
  const edgeBufferM = distanceOption(o['edge-buffer'], '--edge-buffer') ?? 0;
  const footprint = footprintParse(o.footprint ?? 'point', '--footprint');
  const imports = importFlagsRead(o as ImportFlagValues);

  const file = await readInputFile(io, positionals[0]);
  const fc = await parseFeatureFile(file.name, file.bytes, importOptionsFor(file.name, imports.strata));
  const read = plotsFromFeatures(fc, { fileName: file.name, idField: o['id-field'] });
  const loaded = await siteFromInputs(io, {
    strata: o.strata,
    field: o.field,
    exclude: o.exclude,
    access: o.access,
    name: o['site-name'],
    imports: { strata: imports.other, other: imports.other },
  });
  for (const w of [...read.warnings, ...loaded.warnings]) io.err(`warning: ${w}\n`);
  const report = plotsCheck(loaded.site, read.plots, { spacingM, footprint, edgeBufferM, surveyDate });
  for (const w of report.warnings) io.err(`warning: ${w}\n`);

  if (o.out !== undefined) {
    const meta: PlotCheckReportMeta = {
      siteName: loaded.site.name,
      files: [`plots: ${file.name}`, `strata: ${o.strata}`, ...(o.exclude ?? []).map((f) => `exclusions: ${f}`), ...(o.access ?? []).map((f) => `access points: ${f}`)],
      software: `stratplot ${STRATPLOT_VERSION}`,
    };
    // The PDF writer is loaded only for a PDF (see designOutputBytes).
    const bytes = outExt === 'pdf' ? (await import('../../io/plotCheck/plotCheckReportPdf')).plotCheckReportPdf(report, loaded.site, meta, { paper }) : plotCheckReportCsv(report, meta);
    await writeFile(resolve(io.cwd, o.out), bytes);
  }
  if (o.json) {
    const { plots: _plots, ...summary } = report;
    io.out(`${JSON.stringify({ file: file.name, site: loaded.site.name, ...summary, plots: report.plots.map(plotCheckRecordJson) })}\n`);
  } else {
    io.out(textReport(report, file.name, loaded.site.name));
    if (o.out !== undefined) io.out(`wrote ${o.out}\n`);
  }
  return report.counts.failing > 0 ? CHECK_EXIT_FAILED : 0;
}

function parse(argv: string[]) {
  return parseArgs({
    args: argv,
    allowPositionals: true,
    strict: true,
    options: {
      strata: { type: 'string' },
      field: { type: 'string' },
      exclude: { type: 'string', multiple: true },
      access: { type: 'string', multiple: true },
      spacing: { type: 'string' },
      footprint: { type: 'string' },
      'edge-buffer': { type: 'string' },
      'survey-date': { type: 'string' },
      'id-field': { type: 'string' },
      'site-name': { type: 'string' },
      json: { type: 'boolean' },
      out: { type: 'string' },
      paper: { type: 'string' },
      ...IMPORT_FLAG_SPECS,
    },
  });
}

/** `stratplot check`: checks plots from any file against the site; exits 4 when a plot fails. */
export const checkCommand: Command = {
  summary: 'check plots from any file (GPS waypoints, a contractor\'s design) against the site',
  usage: USAGE,
  run,
};
