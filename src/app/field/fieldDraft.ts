/**
 * What the crew has typed into a plot's form and not yet kept on the plot: written to the
 * browser's localStorage on every keystroke (synchronous, so a reload, a closed tab or a dead
 * battery a moment later keeps it) and read back when the form opens again.
 */
export interface FieldDraft {
  values: Record<string, string>;
  note: string;
}

/** A plot's id with its position: the same plot of the same design after a reload, never another plan's plot of that id. */
export interface FieldDraftPlot {
  plot_id: string;
  lon: number;
  lat: number;
}

const key = (p: FieldDraftPlot) => `stratplot:field-draft:${p.plot_id}@${p.lon.toFixed(7)},${p.lat.toFixed(7)}`;

/** The draft kept for a plot, or null. */
export function fieldDraftRead(plot: FieldDraftPlot): FieldDraft | null {
  try {
    const text = localStorage.getItem(key(plot));
    if (!text) return null;
    const d = JSON.parse(text) as FieldDraft;
    return d && typeof d.note === 'string' && typeof d.values === 'object' ? d : null;
  } catch {
    return null;
  }
}

/** Keeps a draft; returns false when the browser refused (storage full or disabled). */
export function fieldDraftWrite(plot: FieldDraftPlot, draft: FieldDraft): boolean {
  try {
    localStorage.setItem(key(plot), JSON.stringify(draft));
    return true;
  } catch {
    return false;
  }
}

/** Forgets a draft once it is kept on the plot. */
export function fieldDraftClear(plot: FieldDraftPlot): void {
  try {
    localStorage.removeItem(key(plot));
  } catch {
    // Nothing to forget when storage is unavailable.
  }
}
