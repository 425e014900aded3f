import type { Feature, Point } from 'geojson';
import * as mgrsModule from 'mgrs';
import type { PlotProperties, PlotRole } from '../model/designTypes';
import type { PlacementConstraints } from './place/placementConstraints';
import { roundTo } from '../common/units';

/** What a plot is before its coordinates are written out. */
export interface PlotDraft {
  plotId: string;
  stratum: string;
  role: PlotRole;
  rank: number;
  x: number;
  y: number;
  /** Primary plots per hectare of the stratum's basis area. */
  densityPerHa: number;
  transect?: number;
  chainageM?: number;
}

// The package ships ESM (named exports) and a UMD build (default export) and bundlers pick either.
const mgrsForward: (ll: [number, number], accuracy?: number) => string =
  mgrsModule.forward ?? (mgrsModule as unknown as { default: typeof mgrsModule }).default.forward;

/**
 * A plot as a GeoJSON point with its file properties. The position is rounded once, to 7 decimals of
 * lon/lat (about 1 cm), and every coordinate column comes from that one rounded position, so a row
 * never disagrees with itself: UTM zone and easting/northing to 0.1 m (the rounded lon/lat projected
 * back into the site's frame), MGRS to 1 m (`mgrs` package, which truncates as MGRS requires), and
 * the nearest exclusion's distance (ground metres from the plot centre, 0.1 m) and kind, then the
 * design density. Source of the MGRS form: NGA.SIG.0012 (via the mgrs package).
 */
export function plotRecord(c: PlacementConstraints, d: PlotDraft): Feature<Point, PlotProperties> {
  const [lonRaw, latRaw] = c.frame.toLonLat(d.x, d.y);
  const lon = roundTo(lonRaw, 7);
  const lat = roundTo(latRaw, 7);
  const [x, y] = c.frame.toXY(lon, lat);
  const near = c.nearestExclusion(x, y);
  const props: PlotProperties = {
    plot_id: d.plotId,
    stratum: d.stratum,
    role: d.role,
    rank: d.rank,
    lon,
    lat,
    utm_zone: c.frame.utmZone,
    easting: roundTo(x, 1),
    northing: roundTo(y, 1),
    mgrs: mgrsForward([lon, lat], 5),
    nearest_exclusion_m: near ? roundTo(near.distanceM, 1) : null,
    nearest_exclusion_kind: near ? near.kind : null,
    design_density_per_ha: roundTo(d.densityPerHa, 6),
    status: 'planned',
  };
  if (d.transect !== undefined) props.transect = d.transect;
  if (d.chainageM !== undefined) props.chainage_m = d.chainageM;
  return { type: 'Feature', geometry: { type: 'Point', coordinates: [lon, lat] }, properties: props };
}
