import { TOOL_GEOMETRY } from '../../state/drawFinish';
import type { DrawTool } from '../../state/plannerStore';
import { plannerStore } from '../plannerStoreInstance';
import { usePlanner } from '../usePlanner';
import { mapHandle } from './mapHandle';

const DOING: Record<Exclude<DrawTool, 'none'>, string> = {
  stratum: 'Drawing a stratum',
  'stratum-beside': 'Drawing a stratum beside its neighbours (overlaps are clipped away)',
  hole: 'Cutting a hole through the strata it overlaps',
  water: 'Outlining a water body',
  private: 'Outlining private land',
  cliff: 'Drawing a cliff edge',
  creek: 'Drawing a creek',
  baseline: 'Drawing the transect baseline',
  hazard: 'Marking a hazard',
  access: 'Marking an access point',
  edit: 'Moving vertices of the selected stratum feature',
};

/** How to add points, finish and cancel with the armed tool, in words. */
export function drawHintText(tool: Exclude<DrawTool, 'none'>): string {
  if (tool === 'edit') return 'Drag a vertex to move it, drag a midpoint to add one. Finish: Esc or the tool button again.';
  const shape = TOOL_GEOMETRY[tool];
  if (shape === 'Point') return 'Click or tap the place on the map. Cancel: Esc.';
  if (shape === 'Polygon') return 'Click or tap each corner in turn. Finish: click the first corner again, press Enter or choose Finish. Cancel: Esc.';
  return 'Click or tap each point along it. Finish: click the last point again, press Enter or choose Finish. Cancel: Esc.';
}

/** Ends the shape being drawn as the Enter key does (terra-draw listens on the map canvas). */
function finishShape(): void {
  mapHandle()?.getCanvas().dispatchEvent(new KeyboardEvent('keyup', { key: 'Enter', bubbles: true }));
}

/** A banner over the map while a drawing tool is armed: what is being drawn, how to add, finish and cancel. */
export function DrawHint() {
  const tool = usePlanner((s) => s.tool);
  if (tool === 'none') return null;
  const shape = tool === 'edit' ? null : TOOL_GEOMETRY[tool];
  return (
    <div className="draw-hint" role="status" aria-live="polite">
      <p>
        <strong>{DOING[tool]}.</strong> {drawHintText(tool)}
      </p>
      <div className="draw-hint-buttons">
        {shape === 'Polygon' || shape === 'LineString' ? (
          <button type="button" onClick={finishShape}>
            Finish <kbd>Enter</kbd>
          </button>
        ) : null}
        <button type="button" onClick={() => plannerStore.setState({ tool: 'none' })}>
          {tool === 'edit' ? 'Done' : 'Cancel'} <kbd>Esc</kbd>
        </button>
      </div>
    </div>
  );
}
