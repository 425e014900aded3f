import { type Rng, rngCreateLegacy, rngStream } from './rng';
import type { RngVersion } from '../../model/designTypes';

/** The random streams of one design: one per purpose (method) and stratum. */
export interface RngStreams {
  readonly version: RngVersion;
  readonly seed: number;
  /**
   * The stream for a purpose ("random", "balanced", "grid-origin", …) and a stratum index. Version 2
   * gives each (purpose, index) its own independent stream, the same every time it is asked for (and so does 3);
   * version 1 gives back the one shared generator, drawn from in the order the engine asks, which is
   * how designs were made before version 2.
   */
  stream(purpose: string, index?: number): Rng;
}

/**
 * The streams of a design made with `seed` under generator `version` (see {@link RngVersion}).
 * Throws a RangeError for a seed that is not a finite number or an unknown version.
 */
export function rngStreams(seed: number, version: RngVersion): RngStreams {
  if (version === 1) {
    const shared = rngCreateLegacy(seed);
    return { version, seed, stream: () => shared };
  }
  if (version !== 2 && version !== 3) throw new RangeError(`unknown random generator version ${String(version)}`);
  rngStream(seed, 'check');
  return { version, seed, stream: (purpose, index = 0) => rngStream(seed, purpose, index) };
}

/**
 * The generator version a design's settings record; settings saved before versions were recorded
 * have none and were made with version 1.
 */
export function rngVersionOf(settings: { rngVersion?: RngVersion }): RngVersion {
  return settings.rngVersion ?? 1;
}

/** The generator version in words, for seed lines and reports. */
export function rngVersionText(version: RngVersion): string {
  if (version === 1) return 'random generator version 1 (old streams, as before version 2: designs from neighbouring seeds are correlated)';
  // Version 2's words are as they were when it was current: files made with it read the same.
  if (version === 2) return 'random generator version 2 (seed expanded by splitmix64, one xoroshiro128+ stream per stratum and method)';
  return 'random generator version 3 (seed expanded by splitmix64, one xoroshiro128+ stream per stratum and method; points drawn from a grid of cells over each stratum)';
}
