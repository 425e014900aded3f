import { useId, useState } from 'react';
import { type ImportPreview, importAccess, importExclusions, importFieldGuess, importRead, importStrata } from '../../state/importActions';
import { plannerStore } from '../plannerStoreInstance';
import { notify } from '../usePlanner';

const ACCEPT = '.geojson,.json,.zip,.kml,.kmz,.gpx,.gpkg,.csv';

/**
 * Reads a map file chosen by the user (nothing is uploaded: the bytes stay in the page) and adds
 * it as strata, exclusions or access points. For strata, the user picks the attribute that
 * defines them before anything is added.
 */
export function ImportBox({ kind: role }: { kind: 'strata' | 'exclusions' | 'access' }) {
  const inputId = useId();
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [field, setField] = useState<string>('');
  const [busy, setBusy] = useState(false);

  const finish = (p: ImportPreview, f: string) => {
    try {
      if (role === 'strata') importStrata(plannerStore, p, f);
      else if (role === 'exclusions') importExclusions(plannerStore, p);
      else importAccess(plannerStore, p);
      setPreview(null);
    } catch (e) {
      notify('error', (e as Error).message);
    }
  };

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setBusy(true);
    try {
      const p = await importRead(file.name, new Uint8Array(await file.arrayBuffer()));
      if (role === 'strata') {
        setField(importFieldGuess(p.polygonFields) ?? '');
        setPreview(p);
      } else finish(p, '');
    } catch (e) {
      notify('error', (e as Error).message);
    } finally {
      setBusy(false);
    }
  };

  const noun = role === 'strata' ? 'strata' : role === 'exclusions' ? 'exclusions' : 'access points';
  return (
    <div className="import-box">
      <label htmlFor={inputId} className="file-label">
        {busy ? 'Reading…' : `Add ${noun} from a file`}
      </label>
      <input
        id={inputId}
        className="file-input"
        type="file"
        accept={ACCEPT}
        data-import={role}
        onChange={(e) => {
          void onFile(e.currentTarget.files?.[0]);
          e.currentTarget.value = '';
        }}
      />
      <p className="fine">GeoJSON, zipped shapefile, KML/KMZ, GPX, GeoPackage or CSV. Files are read here and never leave this computer.</p>
      {preview ? (
        <form
          className="field-pick"
          onSubmit={(e) => {
            e.preventDefault();
            finish(preview, field);
          }}
        >
          <p>
            {preview.fileName}: {preview.polygons} polygons. Which attribute names the stratum?
          </p>
          <label>
            Stratum attribute{' '}
            <select value={field} onChange={(e) => setField(e.currentTarget.value)}>
              {preview.polygonFields.map((f) => (
                <option key={f} value={f}>
                  {f}
                </option>
              ))}
            </select>
          </label>
          <button type="submit" disabled={!field}>
            Add strata
          </button>
          <button type="button" onClick={() => setPreview(null)}>
            Cancel
          </button>
        </form>
      ) : null}
    </div>
  );
}
