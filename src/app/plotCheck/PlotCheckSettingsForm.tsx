import { useId } from 'react';
import { plotCheckRun, plotCheckSettingsSet } from '../../state/plotCheckStore';
import { NumberField } from '../panels/NumberField';
import { plannerStore } from '../plannerStoreInstance';
import { plotCheckRunInWorker, plotCheckStore, usePlotCheck } from './plotCheckStoreInstance';

/** The spacing, footprint, edge buffer and survey date the plots are checked with; Check again applies them. */
export function PlotCheckSettingsForm() {
  const id = useId();
  const settings = usePlotCheck((s) => s.settings);
  const busy = usePlotCheck((s) => s.busy);
  const loaded = usePlotCheck((s) => s.plots !== null);
  return (
    <fieldset className="check-settings">
      <legend>Check with</legend>
      <NumberField label="Minimum spacing" unit="m" min={0} value={settings.spacingM} onCommit={(v) => plotCheckSettingsSet(plotCheckStore, { spacingM: v ?? 0 })} />
      <div className="field">
        <label htmlFor={`${id}-fp`}>Plot footprint</label>
        <input
          id={`${id}-fp`}
          className="code-input"
          defaultValue={settings.footprintText}
          key={settings.footprintText}
          title="point, square:20, rect:20x5@30 or circle:5 (metres; @ angle clockwise from true north)"
          onBlur={(e) => plotCheckSettingsSet(plotCheckStore, { footprintText: e.currentTarget.value.trim() })}
        />
      </div>
      <NumberField label="Edge buffer" unit="m" min={0} value={settings.edgeBufferM} onCommit={(v) => plotCheckSettingsSet(plotCheckStore, { edgeBufferM: v ?? 0 })} />
      <div className="field">
        <label htmlFor={`${id}-date`}>Visit date (for magnetic bearings)</label>
        <input id={`${id}-date`} type="date" value={settings.surveyDate} onChange={(e) => plotCheckSettingsSet(plotCheckStore, { surveyDate: e.currentTarget.value })} />
      </div>
      {loaded ? (
        <button type="button" disabled={busy} onClick={() => void plotCheckRun(plotCheckStore, plannerStore.getState().site, plotCheckRunInWorker)}>
          {busy ? 'Checking…' : 'Check again'}
        </button>
      ) : null}
    </fieldset>
  );
}
