import type { FeatureCollection } from 'geojson';
import { limitShown, limitText, MAX_ID_LENGTH, MAX_NAME_LENGTH } from '../../core/common/inputLimits';
import { InputError } from '../../core/common/InputError';
import type { StratumInfo, StratumPart } from '../../core/model/types';
import { stratumCodeDerive } from './stratumCodeDerive';

/**
 * Paul Tol's "muted" qualitative scheme, distinct for the common forms of colour blindness
 * (Tol, "Colour Schemes", SRON/EPS/TN/09-002, issue 3.2, 2021; hex values as given there).
 * Used in order for strata whose features carry no colour.
 */
export const STRATUM_PALETTE = [
  '#cc6677',
  '#332288',
  '#ddcc77',
  '#117733',
  '#88ccee',
  '#882255',
  '#44aa99',
  '#999933',
  '#aa4499',
] as const;

const COLOUR_RE = /^#(?:[0-9a-f]{3}|[0-9a-f]{6})$/i;

function textProp(p: Record<string, unknown>, ...names: string[]): string | undefined {
  for (const n of names) {
    const v = p[n];
    if (typeof v === 'string' && v.trim() !== '') return v.trim();
    if (typeof v === 'number' && Number.isFinite(v)) return String(v);
  }
  return undefined;
}

function colourNormalised(c: string): string {
  const s = c.toLowerCase();
  return s.length === 4 ? `#${s[1]}${s[1]}${s[2]}${s[2]}${s[3]}${s[3]}` : s;
}

/**
 * Groups the polygon features of a strata file by a property into strata and their parts.
 * A stratum's label, code and colour come from the properties `label`, `code`, `colour`/`color`
 * of its features when present; otherwise the label is the key, the code three upper-case letters
 * derived from the key (unique across strata) and the colour the next of {@link STRATUM_PALETTE}.
 * Part ids are the feature's `id` (or `id` property) when unique, else `<code>-<n>`.
 * Throws InputError when the field exists on no feature (listing the fields that do), a feature
 * lacks a value, a feature is not a Polygon/MultiPolygon (naming its index), there are no
 * polygons, a colour is not #rrggbb, or two strata's features disagree or collide on a code.
 */
export function strataFromFeatures(
  fc: FeatureCollection,
  options: { field?: string; fileName: string },
): { strata: StratumInfo[]; parts: StratumPart[] } {
  const field = options.field ?? 'stratum';
  const file = options.fileName;
  if (fc.features.length === 0) throw new InputError(`${file}: no polygons (the file has no features)`);
  const hasField = fc.features.some((f) => f.properties && Object.hasOwn(f.properties, field));
  if (!hasField) {
    const fields = [...new Set(fc.features.flatMap((f) => Object.keys(f.properties ?? {})))];
    throw new InputError(
      `${file}: no feature has the field "${field}"; fields present: ${fields.length ? fields.join(', ') : '(none)'}`,
    );
  }
  const given = new Map<string, { label?: string; code?: string; colour?: string; first: number }>();
  const order: string[] = [];
  const parts: StratumPart[] = [];
  const idCount = new Map<string, number>();
  fc.features.forEach((f, i) => {
    const type = f.geometry?.type ?? 'no geometry';
    if (type !== 'Polygon' && type !== 'MultiPolygon') {
      throw new InputError(`${file}: feature ${i} is a ${type}; strata must be Polygon or MultiPolygon features`);
    }
    const p = (f.properties ?? {}) as Record<string, unknown>;
    const key = textProp(p, field);
    if (key === undefined) throw new InputError(`${file}: feature ${i} has no value in the field "${field}"`);
    limitText(key, MAX_NAME_LENGTH, `${file}: feature ${i}`, `its stratum name (field "${field}")`);
    const label = textProp(p, 'label');
    if (label !== undefined) limitText(label, MAX_NAME_LENGTH, `${file}: feature ${i}`, 'its label');
    const code = textProp(p, 'code')?.toUpperCase();
    const colourRaw = textProp(p, 'colour', 'color');
    if (colourRaw !== undefined && !COLOUR_RE.test(colourRaw)) {
      throw new InputError(`${file}: feature ${i}: colour ${limitShown(colourRaw)} is not a #rrggbb colour`);
    }
    if (code !== undefined && !/^[A-Z0-9]{1,6}$/.test(code)) {
      throw new InputError(`${file}: feature ${i}: code ${limitShown(code)} must be 1–6 letters or digits`);
    }
    const colour = colourRaw === undefined ? undefined : colourNormalised(colourRaw);
    let g = given.get(key);
    if (!g) {
      g = { first: i };
      given.set(key, g);
      order.push(key);
    }
    for (const [name, value] of [['label', label], ['code', code], ['colour', colour]] as const) {
      if (value === undefined) continue;
      if (g[name] !== undefined && g[name] !== value) {
        throw new InputError(
          `${file}: feature ${i} gives stratum "${key}" the ${name} "${value}" but an earlier feature gave "${g[name]}"`,
        );
      }
      g[name] = value;
    }
    const rawId = f.id ?? p.id;
    const id = typeof rawId === 'string' || typeof rawId === 'number' ? limitText(String(rawId), MAX_ID_LENGTH, `${file}: feature ${i}`, 'its id') : '';
    if (id) idCount.set(id, (idCount.get(id) ?? 0) + 1);
    parts.push({ id, stratum: key, geometry: f.geometry as StratumPart['geometry'], properties: { ...p } });
  });

  const taken = new Map<string, string>();
  for (const key of order) {
    const code = given.get(key)!.code;
    if (code === undefined) continue;
    const other = taken.get(code);
    if (other !== undefined) throw new InputError(`${file}: strata "${other}" and "${key}" both have the code "${code}"`);
    taken.set(code, key);
  }
  let paletteIndex = 0;
  const strata: StratumInfo[] = order.map((key) => {
    const g = given.get(key)!;
    let code = g.code;
    if (code === undefined) {
      code = stratumCodeDerive(key, new Set(taken.keys()));
      taken.set(code, key);
    }
    const colour = g.colour ?? STRATUM_PALETTE[paletteIndex++ % STRATUM_PALETTE.length];
    return { key, label: g.label ?? key, code, colour };
  });
  const codeOf = new Map(strata.map((s) => [s.key, s.code]));
  const serial = new Map<string, number>();
  for (const part of parts) {
    const n = (serial.get(part.stratum) ?? 0) + 1;
    serial.set(part.stratum, n);
    if (!part.id || idCount.get(part.id)! > 1) part.id = `${codeOf.get(part.stratum)}-${n}`;
  }
  return { strata, parts };
}
