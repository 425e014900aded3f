export const STEPS = [
  { id: 'strata', label: 'Map strata' },
  { id: 'exclusions', label: 'Mark exclusions' },
  { id: 'design', label: 'Design' },
  { id: 'plots', label: 'Plots' },
  { id: 'results', label: 'Results' },
] as const;
export type StepId = (typeof STEPS)[number]['id'];

/** The numbered path along the sheets, 1 → 4; each step says whether it is done yet in words. */
export function StepPath({ step, onStep, done }: { step: StepId; onStep: (s: StepId) => void; done: Partial<Record<StepId, boolean>> }) {
  return (
    <nav className="step-path" aria-label="Planning steps">
      <ol>
        {STEPS.map((s, i) => (
          <li key={s.id}>
            <button type="button" className={s.id === step ? 'step step-on' : 'step'} aria-current={s.id === step ? 'step' : undefined} onClick={() => onStep(s.id)}>
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
