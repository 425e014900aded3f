import { type LocalFrame, localFrameAt, localFrameOfEpsg } from '../geo/localFrame';
import { siteLocalFrame } from '../geo/siteLocalFrame';
import type { PlotCollection } from '../model/designTypes';
import type { Site } from '../model/types';

/**
 * The metric frame every writer of one export measures in: the UTM zone the design recorded
 * (`design.crs.epsg`), so sheets, cover maps and safety notes work in the frame the plots were
 * placed in; without a design, the site's frame, then the first plot's, then the first access
 * point's; null when there is nothing to place a frame on.
 */
export function designFrame(collection: PlotCollection | null, site: Site | null): LocalFrame | null {
  const recorded = collection?.design?.crs?.epsg;
  if (typeof recorded === 'number') {
    const frame = localFrameOfEpsg(recorded);
    if (frame) return frame;
  }
  if (site?.parts.length) return siteLocalFrame(site.parts);
  const first = collection?.features[0]?.properties;
  if (first) return localFrameAt(first.lon, first.lat);
  if (site?.access.length) return localFrameAt(site.access[0].lon, site.access[0].lat);
  return null;
}
