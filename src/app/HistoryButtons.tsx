import { useStore } from 'zustand';
import { historyRedo, historyUndo } from '../state/historyActions';
import { plannerStore } from './plannerStoreInstance';

/** Undo and redo of map edits (one history: the site), with how many steps each way. */
export function HistoryButtons() {
  const past = useStore(plannerStore.temporal, (t) => t.pastStates.length);
  const future = useStore(plannerStore.temporal, (t) => t.futureStates.length);
  return (
    <fieldset className="history tools" aria-label="Edit history">
      <button type="button" disabled={past === 0} onClick={() => historyUndo(plannerStore)} title="Ctrl+Z">
        Undo{past ? ` (${past})` : ''}
      </button>
      <button type="button" disabled={future === 0} onClick={() => historyRedo(plannerStore)} title="Ctrl+Y or Ctrl+Shift+Z">
        Redo{future ? ` (${future})` : ''}
      </button>
    </fieldset>
  );
}
