import { useEffect, useId, useState } from 'react';
import type { PlanFile } from '../../state/planFileTypes';
import { planFileParse } from '../../state/planFile';
import { planFromPlotFile } from '../../state/planFromPlotFile';
import { fieldSetupSet } from '../../state/fieldActions';
import { plannerPlotsNamed } from '../../state/plotsNamed';
import { resultsLoad, resultsMappingSet, resultsOptionsSet } from '../../state/resultsStore';
import { fieldVariableResultKind } from '../../core/results/fieldValueCheck';
import type { ResultKind } from '../../core/model/designTypes';
import { downloadFile, fileSafeName } from '../downloadFile';
import { FieldVariablesBox } from '../panels/FieldVariablesBox';
import { planSaveDownload } from '../planSaveDownload';
import { usePlanOffer } from '../usePlanOffer';
import { plannerStore } from '../plannerStoreInstance';
import { resultsStore } from '../results/resultsStoreInstance';
import { attempt, notify, usePlanner } from '../usePlanner';

/**
 * Reads a plan file or a plot file written by `stratplot plan`, whichever the text is; `saved`
 * says whether the plan equals the file (a plot file becomes a plan not yet saved as one).
 */
async function planOfFile(file: File): Promise<{ plan: PlanFile; saved: boolean }> {
  const text = await file.text();
  if (/"format"\s*:\s*"stratplot-plan"/.test(text.slice(0, 4096))) return { plan: planFileParse(text, file.name), saved: true };
  const { parsePlotFile } = await import('../../io/plots/parsePlotFile');
  return { plan: planFromPlotFile(parsePlotFile(file.name, text), file.name), saved: false };
}

async function resultsCsv(): Promise<{ name: string; text: string } | null> {
  const s = plannerStore.getState();
  const named = plannerPlotsNamed(s);
  if (!named) {
    notify('error', 'this plan has no plots yet: nothing to hand back');
    return null;
  }
  const { fieldResultsToCsv } = await import('../../io/results/fieldResultsToCsv');
  return { name: `${fileSafeName(s.site.name, 'site')}-field-results.csv`, text: fieldResultsToCsv(named, s.field.variables) };
}

/**
 * The crew's setup and the files of the field view: the crew name recorded with each visit, the
 * arrival radius, the measurements, opening a plan or plot file, and handing the work back (the
 * results CSV for the Results step and `stratplot estimate`, the plan file with visits and
 * rejections, the plot file).
 */
export function FieldSetupBox({ open }: { open: boolean }) {
  const ids = { crew: useId(), radius: useId(), file: useId() };
  const field = usePlanner((s) => s.field);
  const hasPlots = usePlanner((s) => s.result !== null);
  const [crew, setCrew] = useState(field.crew);
  const [radius, setRadius] = useState(String(field.arrivalRadiusM));
  // Another plan opened (or Undo): the boxes show its setup.
  useEffect(() => setCrew(field.crew), [field.crew]);
  useEffect(() => setRadius(String(field.arrivalRadiusM)), [field.arrivalRadiusM]);
  const { offer, question } = usePlanOffer();

  const openFile = async (file: File | undefined) => {
    if (!file) return;
    try {
      const { plan, saved } = await planOfFile(file);
      offer(plan, `“${file.name}”`, saved);
    } catch (e) {
      notify('error', `${(e as Error).message}; the plan you had is unchanged`);
    }
  };
  const exportCsv = async () => {
    const csv = await resultsCsv();
    if (!csv) return;
    downloadFile(csv.name, csv.text, 'text/csv');
    notify('info', `${csv.name} written to your downloads.`);
  };
  const toResults = async () => {
    const csv = await resultsCsv();
    if (!csv) return;
    const s = plannerStore.getState();
    const named = plannerPlotsNamed(s);
    resultsLoad(resultsStore, csv.name, csv.text, named);
    // The plan says what each column is: no guessing from the column names.
    const kinds = Object.fromEntries(s.field.variables.flatMap((v) => (fieldVariableResultKind(v.kind) ? [[v.name, fieldVariableResultKind(v.kind) as ResultKind]] : [])));
    resultsMappingSet(resultsStore, { kinds }, named);
    const first = s.field.variables.find((v) => fieldVariableResultKind(v.kind));
    if (first) resultsOptionsSet(resultsStore, { variable: first.name }, named);
    plannerStore.setState({ step: 'results' });
    window.location.hash = 'plan';
  };
  const exportPlots = async () => {
    const s = plannerStore.getState();
    if (!s.result) return;
    const { designOutputBytes } = await import('../../io/plots/designOutput');
    const name = `${fileSafeName(s.site.name, 'design')}-plots.geojson`;
    downloadFile(name, await designOutputBytes('plots.geojson', s.result, s.site, { name: s.site.name, annotate: false }));
    notify('info', `${name} written to your downloads.`);
  };

  return (
    <details className="fv-card fv-setup" open={open}>
      <summary>Crew, files and measurements</summary>
      <div className="fv-input">
        <label htmlFor={ids.crew}>Crew name (recorded with every visit)</label>
        <input id={ids.crew} value={crew} autoComplete="name" onChange={(e) => setCrew(e.currentTarget.value)} onBlur={() => attempt(() => fieldSetupSet(plannerStore, { crew: crew.trim() }))} />
      </div>
      <div className="fv-input">
        <label htmlFor={ids.radius}>Arrival radius, m</label>
        <input
          id={ids.radius}
          inputMode="decimal"
          value={radius}
          onChange={(e) => setRadius(e.currentTarget.value)}
          onBlur={() => {
            if (attempt(() => fieldSetupSet(plannerStore, { arrivalRadiusM: Number(radius) })) === undefined && plannerStore.getState().notice?.tone === 'error') setRadius(String(plannerStore.getState().field.arrivalRadiusM));
          }}
        />
      </div>
      <FieldVariablesBox />
      <h3>Files</h3>
      <div className="fv-actions">
        <label htmlFor={ids.file} className="file-label fv-big">
          Open a plan or plot file
        </label>
        <input id={ids.file} className="file-input" type="file" accept=".json,.geojson,application/json,application/geo+json" data-open-field onChange={(e) => {
          void openFile(e.currentTarget.files?.[0]);
          e.currentTarget.value = '';
        }} />
      </div>
      <div className="fv-actions">
        <button type="button" className="fv-big" disabled={!hasPlots} onClick={() => void exportCsv()}>
          Results CSV
        </button>
        <button type="button" className="fv-big" disabled={!hasPlots} onClick={() => void toResults()}>
          Open in the Results step
        </button>
        <button type="button" className="fv-big" onClick={planSaveDownload}>
          Plan file
        </button>
        <button type="button" className="fv-big" disabled={!hasPlots} onClick={() => void exportPlots()}>
          Plot file (GeoJSON)
        </button>
      </div>
      <p className="fv-fine">Everything typed here is kept on this device as you go. Hand the work back with the plan file (visits and rejections) and the results CSV.</p>
      {question}
    </details>
  );
}
