import { useEffect, useState } from 'react';
import { COLLAPSE_RULE } from '../../core/results/collapseStrata';
import type { DesignSettings, PlotCollection } from '../../core/model/designTypes';
import type { EstimateReport } from '../../core/results/estimateFromResults';
import type { Site } from '../../core/model/types';
import { estimatesToCsv } from '../../io/results/estimatesToCsv';
import { resultsColouringSet, resultsOptionsSet } from '../../state/resultsStore';
import { ColourLegend } from './ColourLegend';
import { EstimatesTable } from './EstimatesTable';
import { MeansChart } from './MeansChart';
import { NextSeasonBox } from './NextSeasonBox';
import { RecaptureBox } from './RecaptureBox';
import { recaptureFormResult } from './recaptureFormResult';
import { ResultsLoadBox } from './ResultsLoadBox';
import { ResultsProblems } from './ResultsProblems';
import { resultsPlotColours, resultsValueRange } from './resultsPlotColours';
import { downloadFile, fileSafeName } from '../downloadFile';
import { resultsStore, useResults } from './resultsStoreInstance';
import { ShareChart } from './ShareChart';
import './results.css';

export interface ResultsPanelProps {
  collection: PlotCollection | null;
  onUseInDesign: (patch: Partial<DesignSettings>) => void;
  /** The site, for the design report's map (optional: the report prints without it). */
  site?: Site | null;
}

/** Writes the design report with the estimate, next-season and recapture tables added. */
async function reportDownload(collection: PlotCollection, site: Site | null): Promise<string> {
  const s = resultsStore.getState();
  if (!s.report) throw new Error('no estimate to print');
  const [{ designReportPdf }, { designReportEstimates }, { exportContext }] = await Promise.all([
    import('../../io/pdf/designReportPdf'),
    import('../../io/results/designReportEstimates'),
    import('../../core/field/exportContext'),
  ]);
  const grids = s.grids.flatMap((g) => {
    const r = recaptureFormResult(g);
    return r.state === 'ok' ? [{ name: g.name, estimate: r.estimate }] : [];
  });
  const bytes = designReportPdf(exportContext(collection, site, { annotate: false }), { paper: 'a4', estimates: designReportEstimates(s.report, s.next, grids) });
  const name = `${fileSafeName(site?.name ?? 'design', 'results')}-report-${fileSafeName(s.report.variable, 'results')}.pdf`;
  downloadFile(name, bytes, 'application/pdf');
  return name;
}

/** Step 5: field results → problems, stratified estimates and charts, next season's sizes, mark–recapture. */
export function ResultsPanel({ collection, onUseInDesign, site = null }: ResultsPanelProps) {
  const table = useResults((s) => s.table);
  const problems = useResults((s) => s.problems);
  const report = useResults((s) => s.report);
  const estimateError = useResults((s) => s.estimateError);
  const collapse = useResults((s) => s.collapse);
  const perHa = useResults((s) => s.perHa);
  const colourOn = useResults((s) => s.colourOn);
  const colouring = useResults((s) => s.colouring);
  const plotValues = useResults((s) => s.plotValues);
  const variable = useResults((s) => s.variable);
  // A message is shown only for the file and estimate it was about: once they change it would mislead.
  const [note, setNote] = useState<{ text: string; about: EstimateReport | null } | null>(null);
  const message = note && note.about === report ? note.text : null;
  const setMessage = (text: string) => setNote({ text, about: resultsStore.getState().report });

  // Results are matched to the current plots: re-check when a new design replaces them.
  useEffect(() => {
    resultsOptionsSet(resultsStore, {}, collection);
  }, [collection]);
  useEffect(() => {
    if (!colourOn || !collection || variable === null) return resultsColouringSet(resultsStore, null);
    const range = resultsValueRange(collection, plotValues, variable);
    resultsColouringSet(resultsStore, range ? { variable, colours: resultsPlotColours(collection, plotValues, variable), ...range } : null);
  }, [colourOn, collection, plotValues, variable]);

  const csv = () => {
    if (!report || !table) return;
    const semicolon = table.delimiter === ';' || table.decimal === ',';
    const name = `estimate-${fileSafeName(report.variable, 'results')}.csv`;
    downloadFile(name, estimatesToCsv(report, semicolon ? { delimiter: ';', decimal: table.decimal } : {}), 'text/csv');
    setMessage(`${name} written to your downloads.`);
  };
  const pdf = () => {
    if (!collection) return;
    reportDownload(collection, site).then(
      (name) => setMessage(`${name} written to your downloads.`),
      (e: unknown) => setMessage(`The report could not be written: ${e instanceof Error ? e.message : String(e)}`),
    );
  };

  return (
    <section className="sheet results-sheet" aria-labelledby="results-title">
      <h2 id="results-title">
        <span className="step-no">5</span> Results
      </h2>
      <p className="lead">Load what the crews measured, check it against the plots, and read the stratified estimates with their uncertainty.</p>
      {!collection ? <p className="fine">Make a design in step 3 (or open a plan that has plots) first: results are matched to its plots by id.</p> : null}
      <ResultsLoadBox collection={collection} />
      {table ? (
        <>
          <h3>Problems</h3>
          <ResultsProblems problems={problems} />
          <h3>Estimate</h3>
          <label className="inline">
            <input type="checkbox" checked={collapse} onChange={(e) => resultsOptionsSet(resultsStore, { collapse: e.currentTarget.checked }, collection)} />
            Collapse strata with one plot for the variance (the mean keeps every stratum)
          </label>
          <p className="fine">Rule: {COLLAPSE_RULE}.</p>
          {report && (report.kind === 'measure' || report.kind === 'count') ? (
            <label className="inline">
              <input type="checkbox" checked={perHa} onChange={(e) => resultsOptionsSet(resultsStore, { perHa: e.currentTarget.checked }, collection)} />
              Values are already densities per ha
            </label>
          ) : null}
          {estimateError ? <p className="problem" role="status">{estimateError}</p> : null}
          {report ? (
            <>
              <EstimatesTable report={report} />
              <div className="tools">
                <button type="button" onClick={csv}>
                  Download estimate (CSV)
                </button>
                {collection ? (
                  <button type="button" onClick={pdf}>
                    Design report with estimates (PDF)
                  </button>
                ) : null}
              </div>
              {message ? <p className="fine" role="status">{message}</p> : null}
              <h3>Charts</h3>
              <MeansChart report={report} />
            </>
          ) : null}
        </>
      ) : null}
      {collection ? <ShareChart rows={collection.design.allocation} basis={collection.design.settings.shareBasis === 'mapped' ? 'mapped' : 'usable'} /> : null}
      {report && collection ? (
        <>
          <label className="inline">
            <input type="checkbox" checked={colourOn} onChange={(e) => resultsOptionsSet(resultsStore, { colourOn: e.currentTarget.checked }, collection)} />
            Colour the measured plots on the map by {report.variable}
          </label>
          {colouring ? <ColourLegend variable={colouring.variable} min={colouring.min} max={colouring.max} /> : null}
          <h3>Next season</h3>
          <NextSeasonBox collection={collection} onUseInDesign={onUseInDesign} />
        </>
      ) : null}
      <h3>Mark–recapture</h3>
      <RecaptureBox />
    </section>
  );
}
