import type { Site } from '../../core/model/types';
import type { Map as MapLibreMap } from 'maplibre-gl';
import type { Polygon } from 'geojson';
import {
  type SnapToCustom,
  TerraDraw,
  TerraDrawLineStringMode,
  TerraDrawPointMode,
  TerraDrawPolygonMode,
  TerraDrawSelectMode,
} from 'terra-draw';
import { TerraDrawMapLibreGLAdapter } from 'terra-draw-maplibre-gl-adapter';
import { drawFinish, TOOL_GEOMETRY } from '../../state/drawFinish';
import type { DrawTool, PlannerStore } from '../../state/plannerStore';
import { stratumPartReshape } from '../../state/strataActions';
import { type StrataSnapIndex, strataSnapIndexBuild, strataSnapNearest } from './strataSnap';

const SNAP_PX = 10;

/**
 * Puts terra-draw on the map and follows the store's drawing tool: polygons, lines and points
 * become site edits through drawFinish, snapping to the vertices (first) and edges of mapped strata
 * within 10 px so neighbours can share boundaries; the edit tool reshapes the selected stratum feature. terra-draw
 * keeps no history of its own: every finished shape is one step in the store's undo history.
 */
export function drawControlInstall(map: MapLibreMap, store: PlannerStore, say: (tone: 'info' | 'error', text: string) => void): () => void {
  // Built at the first snap after a change of the site, not at every change: on a million-vertex
  // map it takes a quarter of a second, and most changes (opening a plan, an import) draw nothing.
  let snapFor: Site | null = null;
  let snapIndex: StrataSnapIndex | null = null;
  const snapToStrata: SnapToCustom = (event) => {
    const site = store.getState().site;
    if (site !== snapFor) {
      snapFor = site;
      snapIndex = strataSnapIndexBuild(site);
    }
    if (!snapIndex) return undefined;
    const a = map.unproject([event.containerX - SNAP_PX, event.containerY + SNAP_PX]);
    const b = map.unproject([event.containerX + SNAP_PX, event.containerY - SNAP_PX]);
    return strataSnapNearest(
      snapIndex,
      { x: event.containerX, y: event.containerY },
      [a.lng, a.lat, b.lng, b.lat],
      (lon, lat) => map.project([lon, lat]),
      (x, y) => map.unproject([x, y]).toArray() as [number, number],
      SNAP_PX,
    );
  };
  const snapping = { toCustom: snapToStrata };
  const draw = new TerraDraw({
    adapter: new TerraDrawMapLibreGLAdapter({ map, renderBelowLayerId: 'sp-plots' }),
    modes: [
      new TerraDrawPolygonMode({ snapping, styles: { fillColor: '#f2b134', outlineColor: '#8a5a00', outlineWidth: 2, fillOpacity: 0.2 } }),
      new TerraDrawLineStringMode({ snapping, styles: { lineStringColor: '#8a5a00', lineStringWidth: 3 } }),
      new TerraDrawPointMode({ styles: { pointColor: '#f2b134', pointWidth: 6, pointOutlineColor: '#1d2a2e', pointOutlineWidth: 2 } }),
      new TerraDrawSelectMode({
        flags: { polygon: { feature: { draggable: false, coordinates: { draggable: true, midpoints: true, deletable: true, snappable: { toCustom: snapToStrata } } } } },
      }),
    ],
  });
  draw.start();
  let editing: { drawId: string; partId: string } | null = null;

  const modeFor = (tool: DrawTool) => (tool === 'none' ? 'static' : tool === 'edit' ? 'select' : { Polygon: 'polygon', LineString: 'linestring', Point: 'point' }[TOOL_GEOMETRY[tool]]);

  const editBegin = () => {
    const sel = store.getState().selection;
    const part = sel?.kind === 'part' ? store.getState().site.parts.find((p) => p.id === sel.id) : undefined;
    if (part?.geometry.type !== 'Polygon' || part.geometry.coordinates.length !== 1) {
      say('error', part ? 'Vertices can be moved on single polygons without holes; redraw or cut this feature instead.' : 'Select a stratum feature on the map first, then reshape it.');
      store.setState({ tool: 'none' });
      return;
    }
    const drawId = crypto.randomUUID();
    draw.addFeatures([{ id: drawId, type: 'Feature', geometry: part.geometry, properties: { mode: 'polygon' } }]);
    draw.selectFeature(drawId);
    editing = { drawId, partId: part.id };
    say('info', 'Drag a vertex to move it, drag a midpoint to add one; press Escape (or the tool button again) when finished.');
  };

  const applyTool = (tool: DrawTool) => {
    draw.clear();
    editing = null;
    draw.setMode(modeFor(tool));
    map.getCanvas().style.cursor = tool === 'none' ? '' : 'crosshair';
    if (tool === 'edit') editBegin();
  };

  draw.on('finish', (id, context) => {
    const tool = store.getState().tool;
    if (tool === 'edit') {
      if (!editing || context.action === 'draw') return;
      const f = draw.getSnapshotFeature(id);
      if (f && f.geometry.type === 'Polygon') {
        try {
          stratumPartReshape(store, editing.partId, { type: 'Polygon', coordinates: (f.geometry as Polygon).coordinates });
        } catch (e) {
          say('error', (e as Error).message);
        }
      }
      return;
    }
    const f = draw.getSnapshotFeature(id);
    draw.removeFeatures([id]);
    if (!f) return;
    try {
      say('info', drawFinish(store, tool, f.geometry));
    } catch (e) {
      say('error', (e as Error).message);
    }
  });

  const unsubscribe = store.subscribe((s, prev) => {
    if (s.tool !== prev.tool) applyTool(s.tool);
  });
  applyTool(store.getState().tool);
  return () => {
    unsubscribe();
    draw.stop();
  };
}
