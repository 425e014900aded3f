import type { ExclusionKind } from '../model/types';

/**
 * Colours of exclusion kinds after the Okabe–Ito palette (Okabe & Ito 2008, "Color Universal
 * Design"; private land and hazards darkened for contrast on imagery), chosen to stay apart under
 * colour-vision deficiency. The planner and the KML/KMZ styles use these; every kind also has its
 * own hatch or line style and a text label, so colour never carries meaning alone.
 */
export const EXCLUSION_COLOURS: Readonly<Record<ExclusionKind, string>> = {
  cliff: '#D55E00',
  water: '#0072B2',
  private: '#8C4F9F',
  hazard: '#B07800',
  other: '#555555',
};
