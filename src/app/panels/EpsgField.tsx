import { useId } from 'react';
import { type EpsgChoice, epsgFromText, epsgName } from '../../state/epsgChoices';

/**
 * A text box for an EPSG code with the usual choices offered as suggestions (WGS84, the site's UTM
 * zone, the other codes stratplot carries); the name of the typed code is shown beside it, or a
 * note that stratplot cannot read coordinates in it.
 */
export function EpsgField({ text, choices, onText }: { text: string; choices: readonly EpsgChoice[]; onText: (text: string) => void }) {
  const id = useId();
  const listId = `${id}-codes`;
  const code = epsgFromText(text);
  const typed = text.trim() !== '';
  return (
    <div className="epsg-field">
      <label htmlFor={id}>Coordinate system (EPSG code)</label>{' '}
      <input
        id={id}
        className="epsg-input"
        inputMode="numeric"
        list={listId}
        value={text}
        size={8}
        aria-describedby={`${id}-name`}
        onChange={(e) => onText(e.currentTarget.value)}
      />
      <datalist id={listId}>
        {choices.map((c) => (
          <option key={c.epsg} value={String(c.epsg)}>
            {c.name}
          </option>
        ))}
      </datalist>{' '}
      <output id={`${id}-name`} className={code === null && typed ? 'epsg-name notice-error' : 'epsg-name'}>
        {code !== null ? epsgName(code) : typed ? 'not a code stratplot can read coordinates in' : ''}
      </output>
      <p className="fine">Suggested: {choices.slice(0, 2).map((c) => `${c.epsg} ${c.name}`).join('; ')}.</p>
    </div>
  );
}
