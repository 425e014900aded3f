import { useId, useState } from 'react';
import { downloadFile, fileSafeName } from '../downloadFile';
import { plannerStore } from '../plannerStoreInstance';
import { sqlJsBrowser } from '../sqlJsBrowser';
import { notify, usePlanner } from '../usePlanner';

const FORMATS: [string, string][] = [
  ['gpx', 'GPX for GPS units'],
  ['kmz', 'KMZ for phones and globes'],
  ['kml', 'KML (plain, for desktop GIS and globes)'],
  ['csv', 'CSV plot table'],
  ['geojson', 'GeoJSON plot file'],
  ['zip', 'Shapefiles (zip)'],
  ['gpkg', 'GeoPackage'],
  ['pdf:sheets', 'Field sheets (PDF)'],
  ['pdf:report', 'Design report (PDF)'],
];

/** Today in the browser's time zone as YYYY-MM-DD. */
function todayText(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

/**
 * Writes the plots (and, where the format holds layers, the site) to a file in the downloads, as
 * `stratplot export` does: the survey date sets the sheets' date and the magnetic declination, and
 * distances and bearings are measured from the chosen access point (or each plot's nearest).
 */
export function ExportBox() {
  const ids = { format: useId(), date: useId(), from: useId() };
  const access = usePlanner((s) => s.site.access);
  const [format, setFormat] = useState('gpx');
  const [surveyDay, setSurveyDay] = useState(todayText);
  const [from, setFrom] = useState('');
  const [busy, setBusy] = useState(false);
  const fromId = access.some((a) => a.id === from) ? from : '';
  const run = async () => {
    const s = plannerStore.getState();
    if (!s.result) return;
    if (!/^\d{4}-\d{2}-\d{2}$/.test(surveyDay) || Number.isNaN(Date.parse(`${surveyDay}T12:00:00Z`))) {
      notify('error', `survey date "${surveyDay}" is not a date: give it as YYYY-MM-DD`);
      return;
    }
    setBusy(true);
    try {
      const [ext, pdf] = format.split(':') as [string, 'sheets' | 'report' | undefined];
      // The writers (PDF, GeoPackage) are large: load them only when someone exports.
      const { designOutputBytes } = await import('../../io/plots/designOutput');
      const bytes = await designOutputBytes(`plots.${ext}`, s.result, s.site, {
        pdf,
        sqlJsInit: sqlJsBrowser,
        name: s.site.name,
        // Noon UTC keeps the day the same in every time zone (as the command line's --survey-date).
        surveyDate: new Date(`${surveyDay}T12:00:00Z`),
        annotate: { accessPointId: fromId || undefined },
      });
      const name = `${fileSafeName(s.site.name, 'design')}${pdf ? `-${pdf}` : '-plots'}.${ext}`;
      downloadFile(name, bytes);
      notify('info', `${name} written to your downloads.`);
    } catch (e) {
      notify('error', (e as Error).message);
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="export-box">
      <h3>Take it to the field</h3>
      <div className="field">
        <label htmlFor={ids.date}>Survey date</label>
        <input id={ids.date} type="date" className="date-input" value={surveyDay} required onChange={(e) => setSurveyDay(e.currentTarget.value)} />
      </div>
      <p className="fine">Printed on the field sheets; the magnetic bearings use the declination of that day (World Magnetic Model).</p>
      <div className="field">
        <label htmlFor={ids.from}>Distances and bearings from</label>
        <select id={ids.from} value={fromId} onChange={(e) => setFrom(e.currentTarget.value)}>
          <option value="">each plot’s nearest access point</option>
          {access.map((a) => (
            <option key={a.id} value={a.id}>
              {a.name}
            </option>
          ))}
        </select>
      </div>
      <div className="field">
        <label htmlFor={ids.format}>Export as</label>
        <select id={ids.format} value={format} onChange={(e) => setFormat(e.currentTarget.value)}>
          {FORMATS.map(([v, t]) => (
            <option key={v} value={v}>
              {t}
            </option>
          ))}
        </select>
        <button type="button" onClick={() => void run()} disabled={busy}>
          {busy ? 'Writing…' : 'Export'}
        </button>
      </div>
      <p className="fine">Check every plot on the ground against the cautions on the field sheets; local rules, landholder agreements and your employer’s safety plan come first.</p>
    </div>
  );
}
