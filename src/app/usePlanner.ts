import { useStore } from 'zustand';
import type { PlannerState } from '../state/plannerStore';
import { plannerStore } from './plannerStoreInstance';

/** Reads a slice of the planner store in a component, re-rendering when it changes. */
export function usePlanner<T>(select: (s: PlannerState) => T): T {
  return useStore(plannerStore, select);
}

/** Shows a message in the notice line (errors worded for the user, never a stack trace). */
export function notify(tone: 'info' | 'error', text: string): void {
  plannerStore.setState({ notice: { tone, text } });
}

/** Runs an action and shows a user-facing error in the notice line instead of throwing. */
export function attempt<T>(action: () => T): T | undefined {
  try {
    return action();
  } catch (e) {
    notify('error', e instanceof Error ? e.message : String(e));
    return undefined;
  }
}
