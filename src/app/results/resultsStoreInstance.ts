import { useStore } from 'zustand';
import { type ResultsState, resultsStoreCreate } from '../../state/resultsStore';

/** The page's one results store (separate from the planner store: results are not part of the undo history). */
export const resultsStore = resultsStoreCreate();

/** Reads a slice of the results store in a component, re-rendering when it changes. */
export function useResults<T>(select: (s: ResultsState) => T): T {
  return useStore(resultsStore, select);
}
