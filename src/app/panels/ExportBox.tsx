import { useId, useState } from 'react';
import { downloadFile, fileSafeName } from '../downloadFile';
import { plannerStore } from '../plannerStoreInstance';
import { sqlJsBrowser } from '../sqlJsBrowser';
import { notify } from '../usePlanner';

const FORMATS: [string, string][] = [
  ['gpx', 'GPX for GPS units'],
  ['kmz', 'KMZ for phones and globes'],
  ['csv', 'CSV plot table'],
  ['geojson', 'GeoJSON plot file'],
  ['zip', 'Shapefiles (zip)'],
  ['gpkg', 'GeoPackage'],
  ['pdf:sheets', 'Field sheets (PDF)'],
  ['pdf:report', 'Design report (PDF)'],
];

/** Writes the plots (and, where the format holds layers, the site) to a file in the downloads. */
export function ExportBox() {
  const id = useId();
  const [format, setFormat] = useState('gpx');
  const [busy, setBusy] = useState(false);
  const run = async () => {
    const s = plannerStore.getState();
    if (!s.result) return;
    setBusy(true);
    try {
      const [ext, pdf] = format.split(':') as [string, 'sheets' | 'report' | undefined];
      // The writers (PDF, GeoPackage) are large: load them only when someone exports.
      const { designOutputBytes } = await import('../../io/designOutput');
      const bytes = await designOutputBytes(`plots.${ext}`, s.result, s.site, { pdf, sqlJsInit: sqlJsBrowser, name: s.site.name });
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
        <label htmlFor={id}>Export as</label>
        <select id={id} value={format} onChange={(e) => setFormat(e.currentTarget.value)}>
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
