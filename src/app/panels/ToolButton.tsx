import type { DrawTool } from '../../state/plannerStore';
import { plannerStore } from '../plannerStoreInstance';
import { usePlanner } from '../usePlanner';

/** A text button that arms a drawing tool (pressed while armed); its key is shown beside the name. */
export function ToolButton({ tool, label, hint, shortcut }: { tool: DrawTool; label: string; hint: string; shortcut?: string }) {
  const active = usePlanner((s) => s.tool === tool);
  return (
    <button
      type="button"
      className={active ? 'tool tool-on' : 'tool'}
      aria-pressed={active}
      title={hint}
      onClick={() => plannerStore.setState({ tool: active ? 'none' : tool })}
    >
      <span>{label}</span>
      {shortcut ? <kbd title={`key ${shortcut}`}>{shortcut}</kbd> : null}
    </button>
  );
}
