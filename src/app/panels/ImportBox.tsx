import { countNoun } from '../../core/common/countNoun';
import { useId, useState } from 'react';
import { limitBytes, limitExceeded, MAX_FILE_BYTES } from '../../core/common/inputLimits';
import type { FeatureFileOptions } from '../../io/site/parseFeatureFile';
import type { ExclusionMapping } from '../../state/exclusionPropertiesMap';
import { type ImportPreview, importAccess, importAttempt, importExclusions, importFieldGuess, importStrata } from '../../state/importActions';
import type { ImportNeeds } from '../../state/importNeeds';
import { plannerStore } from '../plannerStoreInstance';
import { sqlJsBrowser } from '../sqlJsBrowser';
import { notify } from '../usePlanner';
import { ExclusionMappingForm } from './ExclusionMappingForm';
import { ImportChoiceForm } from './ImportChoiceForm';

const ACCEPT = '.geojson,.json,.zip,.kml,.kmz,.gpx,.gpkg,.csv';

type Role = 'strata' | 'exclusions' | 'access';

/** Where an import stands: asking how to read the file, or what to add from it. */
type Step =
  | { at: 'choice'; fileName: string; bytes: Uint8Array; options: FeatureFileOptions; needs: ImportNeeds; problem: string | null; round: number }
  | { at: 'field'; preview: ImportPreview }
  | { at: 'mapping'; preview: ImportPreview };

/**
 * Reads a map file chosen by the user (nothing is uploaded: the bytes stay in the page) and adds
 * it as strata, exclusions or access points. A file that needs a choice first (a layer, an EPSG
 * code, an encoding, CSV columns) is asked about and read again; strata then need the attribute
 * that defines them, exclusions where their kinds and buffers come from.
 */
export function ImportBox({ kind: role }: { kind: Role }) {
  const inputId = useId();
  const [step, setStep] = useState<Step | null>(null);
  const [field, setField] = useState<string>('');
  const [busy, setBusy] = useState(false);
  // Why the last file was refused, shown beside this control as well as in the status line.
  const [problem, setProblem] = useState<string | null>(null);
  const refuse = (message: string) => {
    setProblem(message);
    notify('error', message);
  };

  const add = (action: () => void) => {
    try {
      action();
      setStep(null);
      setProblem(null);
    } catch (e) {
      refuse((e as Error).message);
    }
  };

  const read = async (fileName: string, bytes: Uint8Array, options: FeatureFileOptions, round: number) => {
    setBusy(true);
    try {
      const got = await importAttempt(fileName, bytes, { ...options, sqlJsInit: sqlJsBrowser });
      if ('needs' in got) {
        // Each need is explained in the form in the planner's words, so the reader's refusal is not repeated.
        setStep({ at: 'choice', fileName, bytes, options, needs: got.needs, problem: null, round: round + 1 });
      } else if (role === 'strata') {
        setField(importFieldGuess(got.preview.polygonFields) ?? '');
        setStep({ at: 'field', preview: got.preview });
      } else if (role === 'exclusions') setStep({ at: 'mapping', preview: got.preview });
      else add(() => importAccess(plannerStore, got.preview));
    } catch (e) {
      const message = (e as Error).message;
      // A refusal after a choice stays beside the choices, so the user can change them.
      if (round > 0) setStep((s) => (s && s.at === 'choice' ? { ...s, problem: message } : s));
      else refuse(message);
    } finally {
      setBusy(false);
    }
  };

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setStep(null);
    setProblem(null);
    if (file.size > MAX_FILE_BYTES) {
      refuse(limitExceeded(file.name, `the file is ${limitBytes(file.size)}`, `${limitBytes(MAX_FILE_BYTES)} per file`).message);
      return;
    }
    let bytes: Uint8Array;
    try {
      bytes = new Uint8Array(await file.arrayBuffer());
    } catch (e) {
      refuse(`${file.name}: the file cannot be read (${(e as Error).message})`);
      return;
    }
    await read(file.name, bytes, {}, 0);
  };

  const noun = role === 'strata' ? 'strata' : role === 'exclusions' ? 'exclusions' : 'access points';
  return (
    <div className="import-box" data-import-box={role}>
      <label
        htmlFor={inputId}
        className="file-label"
        onDragOver={(e) => {
          if (e.dataTransfer.types.includes('Files')) e.preventDefault();
        }}
        onDrop={(e) => {
          const file = e.dataTransfer.files[0];
          if (!file) return;
          e.preventDefault();
          void onFile(file);
        }}
      >
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
      <p className="fine">GeoJSON, zipped shapefile, KML/KMZ, GPX, GeoPackage or CSV (choose one, or drop it on the button). Files are read here and never leave this computer.</p>
      {problem ? (
        <p className="problem import-problem" role="alert">
          {problem}
        </p>
      ) : null}
      {step?.at === 'choice' ? (
        <ImportChoiceForm
          key={step.round}
          fileName={step.fileName}
          needs={step.needs}
          problem={step.problem}
          onRead={(options) => void read(step.fileName, step.bytes, { ...step.options, ...options }, step.round)}
          onCancel={() => setStep(null)}
        />
      ) : null}
      {step?.at === 'mapping' ? (
        <ExclusionMappingForm
          preview={step.preview}
          onAdd={(mapping: ExclusionMapping) => add(() => importExclusions(plannerStore, step.preview, mapping))}
          onCancel={() => setStep(null)}
        />
      ) : null}
      {step?.at === 'field' ? (
        <form
          className="field-pick"
          onSubmit={(e) => {
            e.preventDefault();
            add(() => importStrata(plannerStore, step.preview, field));
          }}
        >
          <p>
            {step.preview.fileName}: {countNoun(step.preview.polygons, 'polygon')}. Which attribute names the stratum?
          </p>
          <label>
            Stratum attribute{' '}
            <select value={field} onChange={(e) => setField(e.currentTarget.value)}>
              {step.preview.polygonFields.map((f) => (
                <option key={f} value={f}>
                  {f}
                </option>
              ))}
            </select>
          </label>
          <button type="submit" disabled={!field}>
            Add strata
          </button>
          <button type="button" onClick={() => setStep(null)}>
            Cancel
          </button>
        </form>
      ) : null}
    </div>
  );
}
