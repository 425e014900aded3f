import { basename } from 'node:path';
import { limitExceeded, limitNumber, limitText, MAX_ACCESS_POINTS, MAX_NAME_LENGTH } from '../core/common/inputLimits';
import { InputError } from '../core/common/InputError';
import { siteValidate } from '../core/site/siteValidate';
import type { AreaGeometry, Exclusion, Problem, Site, StratumInfo, StratumPart } from '../core/model/types';
import { accessFromFeatures } from '../io/site/accessFromFeatures';
import { exclusionsFromFeatures } from '../io/site/exclusionsFromFeatures';
import { parseFeatureFile } from '../io/site/parseFeatureFile';
import { strataFromFeatures } from '../io/site/strataFromFeatures';
import type { CliIo } from './command';
import { type ImportChoices, importOptionsFor, importOtherFile } from './importFlags';
import { readInputFile } from './readInput';

/** Map files named on a command line. */
export interface SiteInputs {
  strata: string;
  /** Property grouping strata features (default "stratum"). */
  field?: string;
  exclude?: string[];
  access?: string[];
  boundary?: string;
  /** The site's name for titles and documents (default: the strata file's name without extension). */
  name?: string;
  /** Reader options from the import flags (see importFlagsRead); default: none. */
  imports?: ImportChoices;
  /** Called with the strata as soon as they are read, before they are checked (to start work in another thread). */
  onStrataRead?: (strata: readonly StratumInfo[], parts: readonly StratumPart[]) => void;
  /** Called with the site's exclusions once every exclusion file is read, before any file is checked; the site gets this very list. */
  onExclusionsRead?: (exclusions: readonly Exclusion[]) => void;
}

function failOn(file: string, problems: Problem[]): string[] {
  const errors = problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) {
    const more = errors.length > 1 ? ` (${errors.length - 1} more error${errors.length > 2 ? 's' : ''}; fix this one first)` : '';
    throw new InputError(`${file}: ${errors[0].message}${more}`);
  }
  return problems.map((p) => `${file}: ${p.message}`);
}

/**
 * Reads, checks and assembles a site from the files named on a command line: strata (grouped by
 * `field`), exclusions, access points and a boundary polygon. The import flags' layer, EPSG code
 * and encoding reach the strata file only; their CSV columns reach every file. Validation runs per
 * file so that messages name the file and the feature index within it.
 * @returns the site and its warnings, one line each, already prefixed with the file name
 * Throws InputError (one line) for a missing or unreadable file or the first error-severity
 * problem found by siteValidate.
 */
export async function siteFromInputs(io: CliIo, inputs: SiteInputs): Promise<{ site: Site; warnings: string[] }> {
  const load = async (path: string, isStrata = false) => {
    const { name, bytes } = await readInputFile(io, path);
    const imports = inputs.imports ?? { strata: {}, other: {} };
    const fc = isStrata ? await parseFeatureFile(name, bytes, importOptionsFor(name, imports.strata)) : await importOtherFile(name, bytes, imports);
    return { name, fc };
  };
  const strataFile = await load(inputs.strata, true);
  const { strata, parts }: { strata: StratumInfo[]; parts: StratumPart[] } = strataFromFeatures(strataFile.fc, { field: inputs.field, fileName: strataFile.name });
  inputs.onStrataRead?.(strata, parts);
  if (inputs.name !== undefined) limitText(inputs.name.trim(), MAX_NAME_LENGTH, '--site-name', 'the site name');
  const empty: Site = { name: inputs.name?.trim() || basename(strataFile.name).replace(/\.[^.]+$/, ''), strata: [], parts: [], exclusions: [], access: [], boundary: null };
  // Exclusion files are read before the strata are checked, so their areas can be measured in
  // another thread during the check; a file that cannot be read is reported after the strata's own
  // problems, in the order the files were named, as if read one after the other.
  const exclusionFiles: { name: string; found: Exclusion[] }[] = [];
  let unreadable: { failure: unknown } | null = null;
  for (const path of inputs.exclude ?? []) {
    try {
      const file = await load(path);
      exclusionFiles.push({ name: file.name, found: exclusionsFromFeatures(file.fc, { fileName: file.name }) });
    } catch (failure) {
      unreadable = { failure };
      break;
    }
  }
  const exclusions: Exclusion[] = [];
  for (const file of exclusionFiles) {
    // An id an earlier file already gave is told apart by this file's name.
    const taken = new Set(exclusions.map((e) => e.id));
    for (const e of file.found) exclusions.push(taken.has(e.id) ? { ...e, id: `${file.name}:${e.id}` } : e);
  }
  if (!unreadable) inputs.onExclusionsRead?.(exclusions);
  const warnings = failOn(strataFile.name, siteValidate({ ...empty, strata, parts }));
  for (const file of exclusionFiles) {
    for (const w of failOn(file.name, siteValidate({ ...empty, exclusions: file.found }))) warnings.push(w);
  }
  if (unreadable) throw unreadable.failure;
  const access = [];
  for (const path of inputs.access ?? []) {
    const file = await load(path);
    const found = accessFromFeatures(file.fc, { fileName: file.name });
    for (const w of failOn(file.name, siteValidate({ ...empty, access: found }))) warnings.push(w);
    // A loop, not a spread: a call cannot take a very long list as arguments.
    for (const a of found) access.push(a);
    if (access.length > MAX_ACCESS_POINTS) {
      throw limitExceeded(file.name, `with it the site has ${limitNumber(access.length)} access points`, `${limitNumber(MAX_ACCESS_POINTS)} access points`);
    }
  }
  let boundary: AreaGeometry | null = null;
  if (inputs.boundary) {
    const file = await load(inputs.boundary);
    const polys = file.fc.features.filter((f) => f.geometry?.type === 'Polygon' || f.geometry?.type === 'MultiPolygon');
    if (polys.length !== 1 || file.fc.features.length !== 1) {
      throw new InputError(`${file.name}: a boundary file must hold exactly one Polygon or MultiPolygon feature (it has ${file.fc.features.length} features, ${polys.length} polygonal)`);
    }
    boundary = polys[0].geometry as AreaGeometry;
    for (const w of failOn(file.name, siteValidate({ ...empty, boundary }))) warnings.push(w);
  }
  const site: Site = { ...empty, strata, parts, exclusions, access, boundary };
  if (boundary) {
    // Gaps need strata and boundary together; the strata file's own problems were reported above.
    const gaps = siteValidate(site).filter((p) => p.code === 'boundary-gap');
    for (const w of gaps.map((p) => `${inputs.boundary}: ${p.message}`)) warnings.push(w);
  }
  return { site, warnings };
}
