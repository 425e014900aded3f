import { useEffect } from 'react';
import type { DrawTool } from '../state/plannerStore';
import { historyRedo, historyUndo, selectionRemove } from '../state/historyActions';
import { plannerStore } from './plannerStoreInstance';
import { resultsStore } from './results/resultsStoreInstance';

/** Single keys that arm a tool; the same letters are printed on the tool buttons. */
export const TOOL_KEYS: Record<string, DrawTool> = {
  s: 'stratum',
  b: 'stratum-beside',
  h: 'hole',
  e: 'edit',
  c: 'cliff',
  k: 'creek',
  w: 'water',
  p: 'private',
  z: 'hazard',
  a: 'access',
  l: 'baseline',
};

function typing(target: EventTarget | null): boolean {
  const t = target as HTMLElement | null;
  return !!t && (t.tagName === 'INPUT' || t.tagName === 'SELECT' || t.tagName === 'TEXTAREA' || t.isContentEditable);
}

const TEXT_TYPES = new Set(['text', 'search', 'number', 'email', 'url', 'tel', '']);

/** Enter in a text or number box outside a form commits it, the same as leaving the box. */
function commitOnEnter(e: KeyboardEvent): boolean {
  const t = e.target as HTMLInputElement | null;
  if (e.key !== 'Enter' || e.isComposing || !t || t.tagName !== 'INPUT' || t.form || !TEXT_TYPES.has(t.type)) return false;
  if (document.activeElement === t) t.blur();
  return true;
}

/** Keyboard: Enter commits a text box; tool letters, Escape cancels the tool, Delete removes the selection, Ctrl+Z / Ctrl+Y undo and redo. */
export function useShortcuts(): void {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (commitOnEnter(e) || typing(e.target)) return;
      const mod = e.ctrlKey || e.metaKey;
      const key = e.key.toLowerCase();
      if (mod && key === 'z') {
        e.preventDefault();
        if (e.shiftKey) historyRedo(plannerStore, resultsStore);
        else historyUndo(plannerStore, resultsStore);
        return;
      }
      if (mod && key === 'y') {
        e.preventDefault();
        historyRedo(plannerStore, resultsStore);
        return;
      }
      if (mod || e.altKey) return;
      if (e.key === 'Escape') {
        plannerStore.setState({ tool: 'none' });
        return;
      }
      if (e.key === 'Delete' || e.key === 'Backspace') {
        if (plannerStore.getState().tool === 'none' && selectionRemove(plannerStore)) e.preventDefault();
        return;
      }
      const tool = TOOL_KEYS[key];
      if (tool) {
        const now = plannerStore.getState().tool;
        plannerStore.setState({ tool: now === tool ? 'none' : tool });
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);
}
