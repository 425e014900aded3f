import { useStore } from 'zustand';
import { historyNext, historyRedo, historyUndo } from '../state/historyActions';
import { plannerStore } from './plannerStoreInstance';
import { resultsStore } from './results/resultsStoreInstance';
import { usePlanner } from './usePlanner';

/**
 * Undo and redo of every change to the plan (map edits, settings, the design, field decisions,
 * another plan opened), with how many steps each way; the tooltip says what the next one is.
 */
export function HistoryButtons() {
  const past = useStore(plannerStore.temporal, (t) => t.pastStates.length);
  const future = useStore(plannerStore.temporal, (t) => t.futureStates.length);
  // Re-read the next changes whenever the plan moves.
  usePlanner((s) => s.revision);
  const undo = past ? historyNext(plannerStore, 'undo') : null;
  const redo = future ? historyNext(plannerStore, 'redo') : null;
  return (
    <fieldset className="history tools" aria-label="Edit history">
      <button type="button" disabled={past === 0} onClick={() => historyUndo(plannerStore, resultsStore)} title={undo ? `Undo: ${undo.text} (Ctrl+Z)` : 'Nothing to undo (Ctrl+Z)'}>
        <span aria-hidden="true">↶</span>
        <span className="history-word">Undo{past ? ` (${past})` : ''}</span>
      </button>
      <button type="button" disabled={future === 0} onClick={() => historyRedo(plannerStore, resultsStore)} title={redo ? `Redo: ${redo.text} (Ctrl+Y or Ctrl+Shift+Z)` : 'Nothing to redo (Ctrl+Y or Ctrl+Shift+Z)'}>
        <span aria-hidden="true">↷</span>
        <span className="history-word">Redo{future ? ` (${future})` : ''}</span>
      </button>
    </fieldset>
  );
}
