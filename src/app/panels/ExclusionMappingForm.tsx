import { countNoun } from '../../core/common/countNoun';
import { useId, useState } from 'react';
import { DEFAULT_BUFFER_M, EXCLUSION_KINDS, type ExclusionKind } from '../../core/model/types';
import type { ImportPreview } from '../../state/importActions';
import { type ExclusionMapping, exclusionMappingGuess } from '../../state/exclusionPropertiesMap';

// Attribute choices are prefixed so that no attribute name can collide with the other choices.
const ATTR = 'attribute:';
const EVERY = 'every';
const KIND_DEFAULT = 'kind-default';
const NUMBER = 'number';

/**
 * Asks where an exclusion file's kinds and safety buffers come from: an attribute or one kind
 * for the whole file; an attribute, one number of metres, or each kind's default buffer.
 */
export function ExclusionMappingForm({ preview, onAdd, onCancel }: { preview: ImportPreview; onAdd: (mapping: ExclusionMapping) => void; onCancel: () => void }) {
  const id = useId();
  const guess = exclusionMappingGuess(preview.fields);
  const [kindFrom, setKindFrom] = useState(guess.kind && 'attribute' in guess.kind ? ATTR + guess.kind.attribute : EVERY);
  const [everyKind, setEveryKind] = useState<ExclusionKind | ''>('');
  const [bufferFrom, setBufferFrom] = useState(typeof guess.buffer === 'object' && 'attribute' in guess.buffer ? ATTR + guess.buffer.attribute : KIND_DEFAULT);
  const [metresText, setMetresText] = useState('');
  const metres = metresText.trim() === '' ? Number.NaN : Number(metresText);
  const metresOk = Number.isFinite(metres) && metres >= 0;
  const ready = (kindFrom !== EVERY || everyKind !== '') && (bufferFrom !== NUMBER || metresOk);

  const mapping = (): ExclusionMapping => ({
    kind: kindFrom === EVERY ? { every: everyKind as ExclusionKind } : { attribute: kindFrom.slice(ATTR.length) },
    buffer: bufferFrom === KIND_DEFAULT ? 'kind-default' : bufferFrom === NUMBER ? { everyM: metres } : { attribute: bufferFrom.slice(ATTR.length) },
  });

  const total = preview.polygons + preview.lines + preview.points;
  return (
    <form
      className="import-choice"
      aria-label={`Kinds and buffers of ${preview.fileName}`}
      onSubmit={(e) => {
        e.preventDefault();
        if (ready) onAdd(mapping());
      }}
    >
      <p>
        {preview.fileName}: {countNoun(total, 'feature')} ({countNoun(preview.polygons, 'area')}, {countNoun(preview.lines, 'line')}, {countNoun(preview.points, 'point')}).
      </p>
      <div>
        <label htmlFor={`${id}-kind`}>Kind of ground to keep clear of</label>{' '}
        <select id={`${id}-kind`} value={kindFrom} onChange={(e) => setKindFrom(e.currentTarget.value)}>
          {preview.fields.map((f) => (
            <option key={f} value={ATTR + f}>
              from the attribute {f}
            </option>
          ))}
          <option value={EVERY}>the same for every feature</option>
        </select>{' '}
        {kindFrom === EVERY ? (
          <select aria-label="Kind for every feature" value={everyKind} onChange={(e) => setEveryKind(e.currentTarget.value as ExclusionKind | '')}>
            <option value="">choose…</option>
            {EXCLUSION_KINDS.map((k) => (
              <option key={k} value={k}>
                {k}
              </option>
            ))}
          </select>
        ) : null}
      </div>
      <div>
        <label htmlFor={`${id}-buffer`}>Safety buffer</label>{' '}
        <select id={`${id}-buffer`} value={bufferFrom} onChange={(e) => setBufferFrom(e.currentTarget.value)}>
          <option value={KIND_DEFAULT}>the default of each kind</option>
          {preview.fields.map((f) => (
            <option key={f} value={ATTR + f}>
              metres from the attribute {f}
            </option>
          ))}
          <option value={NUMBER}>the same distance for every feature</option>
        </select>{' '}
        {bufferFrom === NUMBER ? (
          <span>
            <input aria-label="Buffer for every feature, metres" inputMode="decimal" size={5} value={metresText} onChange={(e) => setMetresText(e.currentTarget.value)} /> m
            {metresText.trim() !== '' && !metresOk ? <span className="notice-error"> Give 0 or more metres.</span> : null}
          </span>
        ) : null}
      </div>
      <p className="fine">
        Defaults: {EXCLUSION_KINDS.map((k) => `${k} ${DEFAULT_BUFFER_M[k]} m`).join(', ')}. Buffers are planning distances only: local rules,
        landholder permission and your employer’s safety plan decide how close anyone may go.
      </p>
      <div className="choice-buttons">
        <button type="submit" disabled={!ready}>
          Add exclusions
        </button>{' '}
        <button type="button" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}
