import { countNoun } from '../../core/common/countNoun';
import { useId, useState } from 'react';
import type { FeatureFileOptions } from '../../io/site/parseFeatureFile';
import { epsgChoices, epsgFromText } from '../../state/epsgChoices';
import { type ImportNeeds, importEncodingChoices } from '../../state/importNeeds';
import { usePlanner } from '../usePlanner';
import { EpsgField } from './EpsgField';

const EVERY_FOLDER = '';

/** The columns to offer first for x and y: names that look like eastings/longitudes and northings/latitudes. */
function columnGuess(columns: readonly string[], pattern: RegExp): string {
  return columns.find((c) => pattern.test(c)) ?? columns[0] ?? '';
}

/**
 * Asks for what a map file needs before it can be read — a layer, an EPSG code, a text encoding,
 * the coordinate columns of a CSV — and hands back the reader options. The reader's refusal,
 * when there was one, is shown as text.
 */
export function ImportChoiceForm({ fileName, needs, problem, onRead, onCancel }: {
  fileName: string;
  needs: ImportNeeds;
  problem: string | null;
  onRead: (options: FeatureFileOptions) => void;
  onCancel: () => void;
}) {
  const id = useId();
  const parts = usePlanner((s) => s.site.parts);
  const choices = epsgChoices(parts);
  const columns = needs.csvColumns;
  const [layer, setLayer] = useState(needs.layerOptional ? EVERY_FOLDER : (needs.layers[0] ?? ''));
  // No code is filled in for the user: a wrong one would put every outline in the wrong place.
  const [epsgText, setEpsgText] = useState('');
  const [encoding, setEncoding] = useState('windows-1252');
  const [x, setX] = useState(columns ? columnGuess(columns, /^(e|x|east|lon)/i) : '');
  const [y, setY] = useState(columns ? columnGuess(columns, /^(n|y|north|lat)/i) : '');
  const wantsEpsg = needs.epsg || columns !== null;
  const epsg = epsgFromText(epsgText);
  const ready = (!wantsEpsg || epsg !== null) && (!columns || (x !== '' && y !== '' && x !== y));

  const submit = () => {
    const options: FeatureFileOptions = {};
    if (needs.layers.length > 0 && layer !== EVERY_FOLDER) options.layer = layer;
    if (needs.encoding) options.encoding = encoding;
    if (columns) options.csvColumns = { x, y, epsg: epsg ?? undefined };
    else if (wantsEpsg && epsg !== null) options.epsg = epsg;
    onRead(options);
  };

  return (
    <form
      className="import-choice"
      aria-label={`How to read ${fileName}`}
      onSubmit={(e) => {
        e.preventDefault();
        if (ready) submit();
      }}
    >
      {problem ? (
        <p className="notice-error" role="alert">
          {problem}
        </p>
      ) : null}
      {needs.layers.length > 0 ? (
        <p>
          <label>
            {fileName} holds {countNoun(needs.layers.length, 'layer')}. Layer to read{' '}
            <select value={layer} onChange={(e) => setLayer(e.currentTarget.value)}>
              {needs.layerOptional ? <option value={EVERY_FOLDER}>every folder together</option> : null}
              {needs.layers.map((l) => (
                <option key={l} value={l}>
                  {l}
                </option>
              ))}
            </select>
          </label>
        </p>
      ) : null}
      {columns ? (
        <fieldset>
          <legend>Which columns of {fileName} hold the coordinates?</legend>
          <label htmlFor={`${id}-x`}>Easting or longitude</label>{' '}
          <select id={`${id}-x`} value={x} onChange={(e) => setX(e.currentTarget.value)}>
            {columns.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>{' '}
          <label htmlFor={`${id}-y`}>Northing or latitude</label>{' '}
          <select id={`${id}-y`} value={y} onChange={(e) => setY(e.currentTarget.value)}>
            {columns.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
          {x !== '' && x === y ? <span className="notice-error"> Pick two different columns.</span> : null}
        </fieldset>
      ) : null}
      {wantsEpsg ? (
        <>
          {needs.epsg ? (
            <p>{fileName} does not say which coordinate system its coordinates are in. Its supplier or its metadata will name it; a wrong code puts the outlines in the wrong place.</p>
          ) : null}
          <EpsgField text={epsgText} choices={choices} onText={setEpsgText} />
        </>
      ) : null}
      {needs.encoding ? (
        <p>
          <label>
            The attribute table of {fileName} has no .cpg file and its text is not UTF-8. It was saved in{' '}
            <select value={encoding} onChange={(e) => setEncoding(e.currentTarget.value)}>
              {importEncodingChoices().map((label) => (
                <option key={label} value={label}>
                  {label}
                </option>
              ))}
            </select>
          </label>
        </p>
      ) : null}
      <div className="choice-buttons">
        <button type="submit" disabled={!ready}>
          Read the file
        </button>{' '}
        <button type="button" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}
