import { parseArgs } from 'node:util';
import { InputError } from '../../core/common/InputError';
import { type StratumAreaTable, stratumAreaTable } from '../../core/design/stratumAreaTable';
import type { CliIo, Command } from '../command';
import { IMPORT_FLAG_SPECS, importFlagsHelp, importFlagsRead } from '../importFlags';
import { siteFromInputs } from '../siteFromInputs';
import { M2_PER_HA } from '../../core/common/units';

const USAGE = `stratplot areas <strata-file> [--field NAME] [--exclude FILE ...] [--boundary FILE] [--json]
                       [--layer NAME] [--epsg CODE] [--encoding NAME] [--x-column X --y-column Y]

Mapped and usable area of every stratum, measured on the WGS84 ellipsoid (geodesic edges,
Karney 2013). Usable area is the stratum less its exclusions widened by their buffer_m (clipped
in the site's UTM zone, then measured on the ellipsoid again).

Options:
  --field NAME     property that names each feature's stratum (default: stratum)
  --exclude FILE   exclusions (cliff, water, private, hazard, other) with buffer_m; repeatable
  --boundary FILE  site boundary (one polygon): warns of ground inside it that no stratum covers
  --json           print {"strata":[{stratum, features, area_m2, area_ha, share, usable_m2}],
                   "total_m2", "crs":{utm_zone, epsg}}; m² to 0.001, ha to 1e-7, share to 1e-9

${importFlagsHelp('<strata-file>')}

Exit status: 0 done; 2 bad input (one line on stderr saying what and where).`;

const round = (v: number, digits: number) => Number(v.toFixed(digits));

/** The --json document; field names and order are the published output format. */
function areasJson(t: StratumAreaTable): string {
  const doc = {
    strata: t.rows.map((r) => ({
      stratum: r.stratum,
      features: r.features,
      area_m2: round(r.area_m2, 3),
      area_ha: round(r.area_ha, 7),
      share: round(r.share, 9),
      usable_m2: round(r.usable_m2, 3),
    })),
    total_m2: round(t.total_m2, 3),
    crs: { utm_zone: t.crs.utm_zone, epsg: t.crs.epsg },
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}

function areasText(t: StratumAreaTable): string {
  const head = ['stratum', 'features', 'mapped ha', 'share %', 'usable ha'];
  const usableTotal = t.rows.reduce((s, r) => s + r.usable_m2, 0);
  const body = t.rows.map((r) => [r.stratum, String(r.features), (r.area_ha).toFixed(4), (r.share * 100).toFixed(1), (r.usable_m2 / M2_PER_HA).toFixed(4)]);
  const total = ['total', String(t.rows.reduce((s, r) => s + r.features, 0)), (t.total_m2 / M2_PER_HA).toFixed(4), t.total_m2 > 0 ? '100.0' : '0.0', (usableTotal / M2_PER_HA).toFixed(4)];
  const rows = [head, ...body, total];
  const widths = head.map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  const line = (r: string[]) => r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('  ');
  const rule = widths.map((w) => '-'.repeat(w)).join('  ');
  return [
    line(head),
    rule,
    ...body.map(line),
    rule,
    line(total),
    '',
    `Clipping frame: UTM zone ${t.crs.utm_zone} (EPSG:${t.crs.epsg}); areas on the WGS84 ellipsoid.`,
    '',
  ].join('\n');
}

function argsParse(argv: string[]) {
  return parseArgs({
    args: argv,
    options: { field: { type: 'string' }, exclude: { type: 'string', multiple: true }, boundary: { type: 'string' }, json: { type: 'boolean' }, ...IMPORT_FLAG_SPECS },
    allowPositionals: true,
    strict: true,
  });
}

async function run(argv: string[], io: CliIo): Promise<number> {
  const { values, positionals } = argsParse(argv);
  if (positionals.length !== 1) {
    throw new InputError(positionals.length === 0 ? 'give one strata file (see stratplot areas --help)' : `give one strata file, not ${positionals.length}: ${positionals.join(' ')}`);
  }
  const imports = importFlagsRead(values);
  const { site, warnings } = await siteFromInputs(io, { strata: positionals[0], field: values.field, exclude: values.exclude, boundary: values.boundary, imports });
  for (const w of warnings) io.err(`warning: ${w}\n`);
  const table = stratumAreaTable(site);
  for (const w of table.warnings ?? []) io.err(`warning: ${w}\n`);
  io.out(values.json ? areasJson(table) : areasText(table));
  return 0;
}

/** `stratplot areas`: the stratum area table of a strata file. */
export const areasCommand: Command = {
  summary: 'mapped and usable area of each stratum (WGS84 ellipsoid)',
  usage: USAGE,
  run,
};
