import { PLANNER_STEPS, type PlannerStep } from '../state/plannerStore';

export const STEPS = PLANNER_STEPS;
export type StepId = PlannerStep;

/**
 * The numbered path along the sheets, 1 → 5; each step says whether it is done yet in words. On a
 * narrow screen only the numbers and the current step's name show (every button keeps its name).
 */
export function StepPath({ step, onStep, done }: { step: StepId; onStep: (s: StepId) => void; done: Partial<Record<StepId, boolean>> }) {
  return (
    <nav className="step-path" aria-label="Planning steps">
      <ol>
        {STEPS.map((s, i) => (
          <li key={s.id}>
            <button type="button" className={`step${s.id === step ? ' step-on' : ''}${done[s.id] ? ' step-done' : ''}`} aria-current={s.id === step ? 'step' : undefined} onClick={() => onStep(s.id)}>
              <span className="step-no">{i + 1}</span>
              <span className="step-label">{s.label}</span>
              <span className="step-state">{done[s.id] ? 'done' : s.id === step ? 'now' : ''}</span>
            </button>
          </li>
        ))}
      </ol>
    </nav>
  );
}
