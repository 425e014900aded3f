import { writeFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { InputError } from '../../core/common/InputError';
import { plotRejections } from '../../core/field/plotFieldState';
import type { Site } from '../../core/model/types';
import { designOutputBytes } from '../../io/plots/designOutput';
import { parsePlotFile } from '../../io/plots/parsePlotFile';
import type { CliIo, Command } from '../command';
import { IMPORT_FLAG_SPECS, type ImportFlagValues, importFlagsHelp, importFlagsRead } from '../importFlags';
import { optionNumber } from '../optionNumber';
import { readInputFile } from '../readInput';
import { siteFromInputs } from '../siteFromInputs';

/** --format values and the file extension each is written as. */
const FORMATS: Record<string, { ext: string; pdf?: 'report' | 'sheets'; what: string }> = {
  gpx: { ext: 'gpx', what: 'GPX 1.1 for GPS units: plot and access waypoints, strata and exclusion tracks' },
  kml: { ext: 'kml', what: 'KML 2.2, one folder per layer' },
  kmz: { ext: 'kmz', what: 'KMZ: KML with our plot icons' },
  csv: { ext: 'csv', what: 'plot table for spreadsheets and phones (UTF-8)' },
  geojson: { ext: 'geojson', what: 'GeoJSON plot file with the design summary' },
  shp: { ext: 'zip', what: 'zipped shapefiles (WGS84 .prj, UTF-8 .cpg), one per layer and shape type' },
  gpkg: { ext: 'gpkg', what: 'GeoPackage, one table per layer' },
  sheets: { ext: 'pdf', pdf: 'sheets', what: 'printable field sheets (PDF)' },
  report: { ext: 'pdf', pdf: 'report', what: 'design report (PDF)' },
};

const USAGE = `stratplot export <plots.geojson> --format F --out FILE [options]

Writes a design's plots (primaries and ranked reserves) for the field: GPS units, phones,
desktop GIS, print. Every file follows the field state recorded in the plot file (stratplot
reject / restore): a rejected plot is struck out with its reason (GPX leaves it out and lists it in
the file's description), a promoted reserve shows as the plot that replaces it, and the walking
order on the field sheets runs over the plots to visit only.

  --format F          ${Object.keys(FORMATS).join(' | ')}
${Object.entries(FORMATS)
  .map(([k, f]) => `                        ${k.padEnd(8)} ${f.what}`)
  .join('\n')}
  --out FILE          file to write
  --strata FILE       the strata map the design was made on: adds strata to multi-layer formats and
                      the map to PDFs
  --field NAME        property holding each polygon's stratum (default stratum)
  --site-name NAME    the site's name on sheets, reports and GPS files (default: the strata file's name)
  --exclude FILE      exclusions (repeat for more files); needs --strata
  --access FILE       access points (repeat for more files); needs --strata
  --bom               csv: start with a UTF-8 byte-order mark (for some spreadsheet programs)
  --paper P           sheets/report: a4 | letter (default a4)
  --survey-date D     survey day YYYY-MM-DD (sets the magnetic declination; default today)
  --from ACCESS       access point (its id or name) that distances and bearings are measured from
                      (default: each plot's nearest access point); needs --access
  --cliff-near-m M    note plots within M metres of a cliff edge (default 50)
  --private-near-m M  note plots within M metres of private land (default 100)
  --remote-km K       note plots farther than K km from every access point (default 2)
With --strata, every plot gets its route from an access point (distance, true and magnetic
bearing, World Magnetic Model) and safety notes; the thresholds are common practice, no source:
set them to what your local rules and safety plan require.

${importFlagsHelp('--strata FILE')}

Plot positions are a plan: on the ground follow local codes, the landholder's permission and your
employer's safety plan, and do not enter ground that is unsafe on the day.`;

/** `stratplot export`: writes a plot file in a field format, optionally with its site. */
export const exportCommand: Command = {
  summary: 'write plots (and the site) as GPX, KML/KMZ, CSV, GeoJSON, shapefile, GeoPackage or PDF',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const parsed = parseArgs({
      args: argv,
      allowPositionals: true,
      options: {
        format: { type: 'string' },
        out: { type: 'string' },
        strata: { type: 'string' },
        field: { type: 'string' },
        'site-name': { type: 'string' },
        exclude: { type: 'string', multiple: true },
        access: { type: 'string', multiple: true },
        bom: { type: 'boolean' },
        paper: { type: 'string' },
        'survey-date': { type: 'string' },
        from: { type: 'string' },
        'cliff-near-m': { type: 'string' },
        'private-near-m': { type: 'string' },
        'remote-km': { type: 'string' },
        ...IMPORT_FLAG_SPECS,
      },
    });
    const { values, positionals } = parsed as { values: Record<string, string | string[] | boolean | undefined>; positionals: string[] };
    if (positionals.length !== 1) throw new InputError('give one plot file, e.g. stratplot export plots.geojson --format gpx --out plots.gpx');
    const formatName = values.format as string | undefined;
    if (!formatName) throw new InputError(`--format is required: ${Object.keys(FORMATS).join(', ')}`);
    const format = FORMATS[formatName.toLowerCase()];
    if (!format) throw new InputError(`--format "${formatName}" is not one of ${Object.keys(FORMATS).join(', ')}`);
    const out = values.out as string | undefined;
    if (!out) throw new InputError('--out FILE is required');
    const outExt = out.includes('.') ? out.slice(out.lastIndexOf('.') + 1).toLowerCase() : '';
    const allowed = format.ext === 'geojson' ? ['geojson', 'json'] : [format.ext];
    if (!allowed.includes(outExt)) {
      throw new InputError(`--out ${out}: a ${formatName.toLowerCase()} export is written as .${format.ext}; name the file *.${format.ext}`);
    }
    const paper = (values.paper as string | undefined)?.toLowerCase() ?? 'a4';
    if (paper !== 'a4' && paper !== 'letter') throw new InputError(`--paper must be a4 or letter, got "${values.paper}"`);
    let surveyDate: Date | undefined;
    if (values['survey-date'] !== undefined) {
      const text = String(values['survey-date']);
      surveyDate = /^\d{4}-\d{2}-\d{2}$/.test(text) ? new Date(`${text}T12:00:00Z`) : undefined;
      if (!surveyDate || Number.isNaN(surveyDate.getTime())) throw new InputError(`--survey-date needs YYYY-MM-DD, got "${text}"`);
    }
    const exclude = (values.exclude as string[] | undefined) ?? [];
    const access = (values.access as string[] | undefined) ?? [];
    if (!values.strata && (exclude.length > 0 || access.length > 0)) {
      throw new InputError('--exclude and --access need --strata (the map the design was made on)');
    }

    const imports = importFlagsRead(values as ImportFlagValues);
    const usesImports = Object.keys(IMPORT_FLAG_SPECS).some((k) => values[k] !== undefined);
    if (!values.strata && usesImports) throw new InputError('--layer, --epsg, --encoding and --x-column/--y-column say how to read --strata FILE; give --strata');
    const plotsFile = await readInputFile(io, positionals[0]);
    const collection = parsePlotFile(plotsFile.name, plotsFile.bytes);
    let site: Site | undefined;
    if (values.strata) {
      const loaded = await siteFromInputs(io, { strata: String(values.strata), field: values.field as string | undefined, name: values['site-name'] as string | undefined, exclude, access, imports });
      site = loaded.site;
      for (const w of loaded.warnings) io.err(`warning: ${w}\n`);
    }
    const bytes = await designOutputBytes(`${out}.${format.ext}`, collection, site, {
      bom: values.bom === true,
      pdf: format.pdf,
      paper,
      surveyDate,
      annotate: site ? annotateOptions(values, site) : false,
    });
    await writeFile(resolve(io.cwd, out), bytes);
    const primaries = collection.features.filter((f) => f.properties.role === 'primary').length;
    const decisions = plotRejections(collection);
    const promoted = collection.features.filter((f) => f.properties.status === 'promoted').length;
    const field = decisions.length ? ` (field decisions: ${decisions.length} rejected, ${promoted} reserve${promoted === 1 ? '' : 's'} promoted)` : '';
    io.out(`wrote ${out} (${formatName.toLowerCase()}): ${primaries} primary and ${collection.features.length - primaries} reserve plots${field}${site ? `, site "${site.name}"` : ''}\n`);
    return 0;
  },
};

function positiveNumber(values: Record<string, unknown>, flag: string, scale = 1): number | undefined {
  const text = values[flag];
  if (text === undefined) return undefined;
  const n = optionNumber(String(text));
  if (!(n > 0)) throw new InputError(`--${flag} needs a positive number, got "${text}"`);
  return n * scale;
}

function annotateOptions(values: Record<string, unknown>, site: Site) {
  const from = values.from as string | undefined;
  let accessPointId: string | undefined;
  if (from !== undefined) {
    const hit = site.access.find((a) => a.id === from) ?? site.access.find((a) => a.name.toLowerCase() === from.toLowerCase());
    if (!hit) {
      const known = site.access.map((a) => `"${a.name}" (${a.id})`).join(', ');
      throw new InputError(`--from "${from}" is not an access point of the site; ${known ? `known: ${known}` : 'give --access FILE'}`);
    }
    accessPointId = hit.id;
  }
  return {
    accessPointId,
    cliffNearM: positiveNumber(values, 'cliff-near-m'),
    privateNearM: positiveNumber(values, 'private-near-m'),
    remoteM: positiveNumber(values, 'remote-km', 1000),
  };
}
