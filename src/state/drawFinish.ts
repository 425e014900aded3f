import type { Geometry, LineString, Point, Polygon } from 'geojson';
import { InputError } from '../core/common/InputError';
import { accessAdd } from './accessActions';
import { designSettingsSet } from './designActions';
import { exclusionAdd } from './exclusionActions';
import type { DrawTool, PlannerStore } from './plannerStore';
import { stratumHoleCut, stratumPartAddBeside } from './strataClipActions';
import { stratumPartAdd } from './strataActions';

/** The geometry type each drawing tool makes. */
export const TOOL_GEOMETRY: Record<Exclude<DrawTool, 'none' | 'edit'>, 'Polygon' | 'LineString' | 'Point'> = {
  stratum: 'Polygon',
  'stratum-beside': 'Polygon',
  hole: 'Polygon',
  water: 'Polygon',
  private: 'Polygon',
  cliff: 'LineString',
  creek: 'LineString',
  baseline: 'LineString',
  hazard: 'Point',
  access: 'Point',
};

function newStratumName(store: PlannerStore): string {
  const keys = new Set(store.getState().site.strata.map((s) => s.key));
  let n = keys.size + 1;
  while (keys.has(`Stratum ${n}`)) n++;
  return `Stratum ${n}`;
}

/**
 * Turns a finished drawing into the site edit its tool stands for (one undo step) and returns a
 * sentence saying what was added. Throws InputError when the shape does not suit the tool.
 */
export function drawFinish(store: PlannerStore, tool: DrawTool, geometry: Geometry): string {
  if (tool === 'none' || tool === 'edit') throw new InputError('choose a drawing tool first');
  const want = TOOL_GEOMETRY[tool];
  if (geometry.type !== want) throw new InputError(`the ${tool} tool draws a ${want}, not a ${geometry.type}`);
  const target = store.getState().drawStratumKey ?? newStratumName(store);
  switch (tool) {
    case 'stratum':
      stratumPartAdd(store, target, geometry as Polygon);
      return `Added a feature to stratum "${target}".`;
    case 'stratum-beside':
      stratumPartAddBeside(store, target, geometry as Polygon);
      return `Added a feature to stratum "${target}", clipped to share edges with its neighbours.`;
    case 'hole': {
      const n = stratumHoleCut(store, geometry as Polygon);
      return `Cut a hole through ${n} stratum feature${n === 1 ? '' : 's'}.`;
    }
    case 'cliff':
      exclusionAdd(store, 'cliff', geometry as LineString, 'Cliff edge');
      return 'Added a cliff edge with the default buffer.';
    case 'creek':
      exclusionAdd(store, 'water', geometry as LineString, 'Creek');
      return 'Added a creek with the default buffer.';
    case 'water':
      exclusionAdd(store, 'water', geometry as Polygon, 'Water body');
      return 'Added a water body with the default buffer.';
    case 'private':
      exclusionAdd(store, 'private', geometry as Polygon, 'Private land');
      return 'Added private land: get the landholder’s permission before any entry.';
    case 'hazard':
      exclusionAdd(store, 'hazard', geometry as Point, 'Hazard');
      return 'Added a hazard point with the default buffer.';
    case 'access': {
      const [lon, lat] = (geometry as Point).coordinates;
      accessAdd(store, lon, lat);
      return 'Added an access point.';
    }
    case 'baseline':
      designSettingsSet(store, { baseline: (geometry as LineString).coordinates });
      return 'Set the transect baseline.';
  }
}
