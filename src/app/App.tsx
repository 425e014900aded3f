import { useEffect, useRef } from 'react';
import { FileBar } from './FileBar';
import { FirstSteps } from './FirstSteps';
import { HistoryButtons } from './HistoryButtons';
import { DrawHint } from './map/DrawHint';
import { MapLegend } from './map/MapLegend';
import { MapView } from './map/MapView';
import { DesignPanel } from './panels/DesignPanel';
import { ExclusionsPanel } from './panels/ExclusionsPanel';
import { PlotsPanel } from './panels/PlotsPanel';
import { StrataPanel } from './panels/StrataPanel';
import { ResultsStep } from './results/ResultsStep';
import { StatusLine } from './StatusLine';
import { type StepId, StepPath } from './StepPath';
import { plannerStore } from './plannerStoreInstance';
import { usePlanner } from './usePlanner';
import { useShortcuts } from './useShortcuts';

/** The planner: a map with the five-step sheet beside it (below it on a phone). */
export function App() {
  useShortcuts();
  const step = usePlanner((s) => s.step);
  const setStep = (next: StepId) => plannerStore.setState({ step: next });
  const sheet = useRef<HTMLDivElement>(null);
  // Each step's sheet starts at its top, however far down the previous one was read.
  useEffect(() => {
    if (step && sheet.current) sheet.current.scrollTop = 0;
  }, [step]);
  const done = {
    strata: usePlanner((s) => s.site.parts.length > 0),
    exclusions: usePlanner((s) => s.site.exclusions.length > 0),
    design: usePlanner((s) => s.result !== null),
    plots: usePlanner((s) => s.result?.features.some((f) => f.properties.status === 'rejected') ?? false),
  };
  return (
    <div className="planner">
      <header className="masthead">
        <div className="brand">
          <span className="brand-mark" aria-hidden="true" />
          <span className="brand-name">stratplot</span>
          <span className="brand-sub">survey planner</span>
        </div>
        <FileBar />
        <StepPath step={step} onStep={setStep} done={done} />
        <HistoryButtons />
        <a className="to-field" href="#field" aria-label="Field view" title="Walk the plan on a phone or tablet: live position, the next plot, safety warnings and the plot form">
          Field<span className="to-field-more">{'\u00a0'}view</span>
        </a>
      </header>
      <main className="workspace">
        <div className="map-pane">
          <MapView />
          <MapLegend />
          <DrawHint />
          <StatusLine />
        </div>
        <div className="sheet-pane" ref={sheet}>
          <FirstSteps />
          {step === 'strata' ? <StrataPanel /> : null}
          {step === 'exclusions' ? <ExclusionsPanel /> : null}
          {step === 'design' ? <DesignPanel /> : null}
          {step === 'plots' ? <PlotsPanel /> : null}
          {step === 'results' ? <ResultsStep /> : null}
          <div className="sheet-next">
            {step !== 'plots' && step !== 'results' ? (
              <button type="button" className="next" onClick={() => setStep(step === 'strata' ? 'exclusions' : step === 'exclusions' ? 'design' : 'plots')}>
                Next step →
              </button>
            ) : null}
          </div>
        </div>
      </main>
    </div>
  );
}
