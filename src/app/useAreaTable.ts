import type { StratumAreaTable } from '../core/design/stratumAreaTable';
import type { Site } from '../core/model/types';
import { usePlanner } from './usePlanner';

/** The site's area table from the latest analysis; `current` is false while a newer site is being measured. */
export function useAreaTable(): { table: StratumAreaTable | null; error: string | null; site: Site; current: boolean } {
  const site = usePlanner((s) => s.site);
  const analysis = usePlanner((s) => s.analysis);
  return { table: analysis?.table ?? null, error: analysis?.error ?? null, site, current: analysis?.site === site };
}
