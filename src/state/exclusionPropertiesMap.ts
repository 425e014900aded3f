import type { FeatureCollection } from 'geojson';
import { InputError } from '../core/common/InputError';
import { EXCLUSION_KINDS, type ExclusionKind } from '../core/model/types';

/** Where an imported exclusion file's kind and safety buffer come from. */
export interface ExclusionMapping {
  /** The attribute holding each feature's kind (a kind or a synonym such as "river"), or one kind for the whole file. */
  kind: { attribute: string } | { every: ExclusionKind };
  /**
   * The attribute holding each buffer in metres (blank cells take the kind's default), one
   * number of metres for every feature, or the default of each kind (DEFAULT_BUFFER_M).
   */
  buffer: { attribute: string } | { everyM: number } | 'kind-default';
}

/**
 * The mapping that reads a file as exclusionsFromFeatures does on its own: `kind` and `buffer_m`
 * attributes when the features carry them; otherwise the first attribute whose name suggests a
 * kind, else one kind the user must still pick (null).
 */
export function exclusionMappingGuess(fields: readonly string[]): { kind: ExclusionMapping['kind'] | null; buffer: ExclusionMapping['buffer'] } {
  const lower = fields.map((f) => f.toLowerCase());
  const pick = (names: string[]) => {
    for (const n of names) {
      const i = lower.indexOf(n);
      if (i >= 0) return fields[i];
    }
    return undefined;
  };
  const kindField = pick(['kind', 'type', 'class', 'category', 'hazard']);
  const bufferField = pick(['buffer_m', 'buffer', 'setback_m', 'setback']);
  return { kind: kindField ? { attribute: kindField } : null, buffer: bufferField ? { attribute: bufferField } : 'kind-default' };
}

/**
 * Rewrites each feature's `kind` and `buffer_m` properties from `mapping`, so that
 * exclusionsFromFeatures reads the file as the user mapped it (its synonyms, defaults and
 * messages naming the feature still apply). Other properties are kept; the input is not changed.
 * Throws InputError naming the file for an attribute no feature carries, an unknown kind, or a
 * buffer that is not a number of metres of 0 or more.
 */
export function exclusionPropertiesMap(fc: FeatureCollection, mapping: ExclusionMapping, fileName: string): FeatureCollection {
  const fields = new Set(fc.features.flatMap((f) => Object.keys(f.properties ?? {})));
  for (const part of [mapping.kind, mapping.buffer]) {
    if (typeof part === 'object' && 'attribute' in part && !fields.has(part.attribute)) {
      throw new InputError(`${fileName}: no feature has the attribute "${part.attribute}"; attributes are: ${[...fields].join(', ') || '(none)'}`);
    }
  }
  if ('every' in mapping.kind && !EXCLUSION_KINDS.includes(mapping.kind.every)) {
    throw new InputError(`${fileName}: unknown kind "${mapping.kind.every}"; allowed kinds: ${EXCLUSION_KINDS.join(', ')}`);
  }
  const buffer = mapping.buffer;
  if (typeof buffer === 'object' && 'everyM' in buffer && !(Number.isFinite(buffer.everyM) && buffer.everyM >= 0)) {
    throw new InputError(`${fileName}: the buffer for every feature must be 0 or more metres, got ${buffer.everyM}`);
  }
  return {
    ...fc,
    features: fc.features.map((f) => {
      const source = (f.properties ?? {}) as Record<string, unknown>;
      const properties: Record<string, unknown> = { ...source };
      properties.kind = 'every' in mapping.kind ? mapping.kind.every : source[mapping.kind.attribute];
      if (buffer === 'kind-default') delete properties.buffer_m;
      else if ('everyM' in buffer) properties.buffer_m = buffer.everyM;
      else properties.buffer_m = source[buffer.attribute];
      return { ...f, properties };
    }),
  };
}
