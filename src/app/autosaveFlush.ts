let flush: (() => Promise<void>) | null = null;

/** Keeps the running autosave's flush (set once the planner has booted). */
export function autosaveFlushSet(f: () => Promise<void>): void {
  flush = f;
}

/**
 * Writes a pending change to the browser copy now instead of after autosave's short delay: the
 * field view calls it after every visit, rejection and entry, so a reload or a dead battery a
 * moment later loses nothing.
 */
export function autosaveFlushNow(): void {
  void flush?.();
}
