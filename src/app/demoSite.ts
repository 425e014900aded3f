import type { Geometry, LineString } from 'geojson';
import type { DesignSettings } from '../core/model/designTypes';
import { designSettingsDefault } from '../core/design/designSettingsDefault';
import type { AreaGeometry, Site } from '../core/model/types';
import { accessFromFeatures } from '../io/site/accessFromFeatures';
import { exclusionsFromFeatures } from '../io/site/exclusionsFromFeatures';
import { parseFeatureFile } from '../io/site/parseFeatureFile';
import { strataFromFeatures } from '../io/site/strataFromFeatures';
import accessText from '../../demo-maps/ochre-spit-access.geojson?raw';
import baselineText from '../../demo-maps/ochre-spit-baseline.geojson?raw';
import boundaryText from '../../demo-maps/ochre-spit-boundary.geojson?raw';
import exclusionsText from '../../demo-maps/ochre-spit-exclusions.geojson?raw';
import strataText from '../../demo-maps/ochre-spit-strata.geojson?raw';

/** Name shown for the demo site; the site, its habitats and its hazards are invented. */
export const DEMO_SITE_NAME = 'Ochre Spit Coastal Reserve (invented demo)';

const read = (name: string, text: string) => parseFeatureFile(name, new TextEncoder().encode(text));

/** The invented Ochre Spit demo site, read through the same readers as any user file. */
export async function demoSiteLoad(): Promise<{ site: Site; baseline: number[][] | null }> {
  const [strataFc, exclusionsFc, accessFc, boundaryFc, baselineFc] = await Promise.all([
    read('ochre-spit-strata.geojson', strataText),
    read('ochre-spit-exclusions.geojson', exclusionsText),
    read('ochre-spit-access.geojson', accessText),
    read('ochre-spit-boundary.geojson', boundaryText),
    read('ochre-spit-baseline.geojson', baselineText),
  ]);
  const { strata, parts } = strataFromFeatures(strataFc, { field: 'stratum', fileName: 'ochre-spit-strata.geojson' });
  const boundaryGeom = boundaryFc.features[0]?.geometry as Geometry | undefined;
  const boundary = boundaryGeom && (boundaryGeom.type === 'Polygon' || boundaryGeom.type === 'MultiPolygon') ? (boundaryGeom as AreaGeometry) : null;
  const line = baselineFc.features[0]?.geometry as LineString | undefined;
  return {
    site: {
      name: DEMO_SITE_NAME,
      strata,
      parts,
      exclusions: exclusionsFromFeatures(exclusionsFc, { fileName: 'ochre-spit-exclusions.geojson' }),
      access: accessFromFeatures(accessFc, { fileName: 'ochre-spit-access.geojson' }),
      boundary,
    },
    baseline: line?.type === 'LineString' ? line.coordinates : null,
  };
}

/** Design settings the demo opens with: 36 plots, 3 reserves per stratum, 20 m square quadrats 40 m apart. */
export function demoDesign(baseline: number[][] | null): DesignSettings {
  return designSettingsDefault({
    plots: 36,
    reservePerStratum: 3,
    spacingM: 40,
    footprint: { shape: 'square', sideM: 20, angleDeg: 0 },
    baseline,
    seed: 20261201,
  });
}
