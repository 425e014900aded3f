import { useEffect, useId } from 'react';
import { footprintFormat } from '../../core/design/footprintParse';
import { PLOT_CHECK_SYMBOLS } from '../../core/plotCheck/plotCheckSymbols';
import { plotCheckCountsText, plotCheckSettingsText } from '../../core/plotCheck/plotCheckSettingsText';
import type { FeatureFileOptions } from '../../io/site/parseFeatureFile';
import { plotCheckClear, plotCheckFileRead, plotCheckSettingsSet } from '../../state/plotCheckStore';
import { ImportChoiceForm } from '../panels/ImportChoiceForm';
import { plannerStore } from '../plannerStoreInstance';
import { sqlJsBrowser } from '../sqlJsBrowser';
import { plotCheckSymbolDataUrl } from './plotCheckSymbolImages';
import { PlotCheckSettingsForm } from './PlotCheckSettingsForm';
import { plotCheckReportDownload } from './plotCheckReportDownload';
import { plotCheckRunInWorker, plotCheckStore, usePlotCheck } from './plotCheckStoreInstance';
import { PlotCheckTable } from './PlotCheckTable';
import './plotCheck.css';

const ACCEPT = '.geojson,.json,.zip,.kml,.kmz,.gpx,.gpkg,.csv';

async function read(fileName: string, bytes: Uint8Array, options: FeatureFileOptions, round = 0): Promise<void> {
  const s = plannerStore.getState();
  await plotCheckFileRead(plotCheckStore, fileName, bytes, { ...options, sqlJsInit: sqlJsBrowser }, s.site, plotCheckRunInWorker, round);
}

/**
 * "Check plots from a file": plots someone else made (a contractor's design, last season's plots,
 * GPS waypoints) read from any map format and checked against this plan's site with the
 * geometry the design uses; the map flags the failing ones, the table lists them most serious
 * first, and the report goes out as PDF or CSV.
 */
export function PlotCheckBox() {
  const id = useId();
  const fileName = usePlotCheck((s) => s.fileName);
  const pending = usePlotCheck((s) => s.pending);
  const report = usePlotCheck((s) => s.report);
  const error = usePlotCheck((s) => s.error);
  const busy = usePlotCheck((s) => s.busy);
  const warnings = usePlotCheck((s) => s.readWarnings);
  const showDesign = usePlotCheck((s) => s.showDesign);
  useEffect(() => {
    // Until a file is checked, the form starts from the design's own spacing, footprint and edge buffer.
    if (plotCheckStore.getState().plots) return;
    const d = plannerStore.getState().design;
    plotCheckSettingsSet(plotCheckStore, { spacingM: d.spacingM, footprintText: footprintFormat(d.footprint), edgeBufferM: d.edgeBufferM });
  }, []);
  return (
    <section className="import-box plot-check" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`}>Check plots from a file</h3>
      <p className="fine">
        Plots someone else made — a contractor’s design, last season’s permanent plots, waypoints from a GPS unit — are checked against this site with the same buffers,
        spacing and distances the design uses. GeoJSON, GPX, KML/KMZ, CSV, zipped shapefile or GeoPackage; the file stays on this computer.
      </p>
      <label htmlFor={`${id}-file`} className="file-label">
        {busy ? 'Checking…' : fileName ? 'Check another file' : 'Check plots from a file'}
      </label>
      <input
        id={`${id}-file`}
        className="file-input"
        type="file"
        accept={ACCEPT}
        data-import="plot-check"
        onChange={(e) => {
          const f = e.currentTarget.files?.[0];
          e.currentTarget.value = '';
          if (f) void f.arrayBuffer().then((b) => read(f.name, new Uint8Array(b), {}));
        }}
      />
      {fileName ? (
        <button type="button" className="link" onClick={() => plotCheckClear(plotCheckStore)}>
          Unload the checked plots
        </button>
      ) : null}
      <PlotCheckSettingsForm />
      {pending ? (
        <ImportChoiceForm
          key={pending.round}
          fileName={pending.fileName}
          needs={pending.needs}
          problem={pending.problem}
          onRead={(options) => void read(pending.fileName, pending.bytes, { ...pending.options, ...options }, pending.round)}
          onCancel={() => plotCheckStore.setState({ pending: null })}
        />
      ) : null}
      {error ? (
        <p className="problem" role="alert">
          {error}
        </p>
      ) : null}
      {report && fileName ? (
        <div className="check-report" data-failing={report.counts.failing}>
          <p className={report.counts.failing ? 'check-summary check-summary-fail' : 'check-summary'} role="status">
            <img src={plotCheckSymbolDataUrl(report.counts.failing ? 'fail' : 'pass')} alt="" width={20} height={20} /> {fileName}: {plotCheckCountsText(report)}
          </p>
          <p className="fine">Checked with {plotCheckSettingsText(report)}.</p>
          <ul className="symbol-key" aria-label="Checked plots">
            {(['fail', 'pass'] as const).map((k) => (
              <li key={k} data-check-symbol={k}>
                <img src={plotCheckSymbolDataUrl(k)} alt="" width={18} height={18} />
                {PLOT_CHECK_SYMBOLS[k].label}
              </li>
            ))}
          </ul>
          {[...warnings, ...report.warnings].map((w) => (
            <p key={w} className="fine">
              Note: {w}.
            </p>
          ))}
          <ul className="plain-list check-notes" aria-label="The set as a sample">
            {report.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
          <label className="check-toggle">
            <input type="checkbox" checked={showDesign} onChange={(e) => plotCheckStore.setState({ showDesign: e.currentTarget.checked })} /> Show the design’s own plots beside them
          </label>
          <PlotCheckTable />
          <div className="field">
            <button type="button" onClick={() => void plotCheckReportDownload('pdf')}>
              Report (PDF)
            </button>
            <button type="button" onClick={() => void plotCheckReportDownload('csv')}>
              Report (CSV)
            </button>
          </div>
          <p className="fine">The report is a record of a desk check, not a safety assessment: local rules, the landholder’s permission and your employer’s safety plan govern the work on the ground.</p>
        </div>
      ) : null}
    </section>
  );
}
