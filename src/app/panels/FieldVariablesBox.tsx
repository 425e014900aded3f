import { useId, useState } from 'react';
import { FIELD_VARIABLE_KINDS, type FieldVariableKind } from '../../core/model/fieldTypes';
import { fieldSetupSet } from '../../state/fieldActions';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, usePlanner } from '../usePlanner';

const KIND_LABEL: Record<FieldVariableKind, string> = {
  number: 'number (a measurement)',
  percent: 'percent 0–100 (cover)',
  count: 'count (whole number)',
  presence: 'present / absent',
  text: 'text (not estimated)',
};

/**
 * The measurements the plan asks for at every plot: the field view builds its plot form from them
 * and the results table has a column for each. Shared by the Design step and the field view.
 */
export function FieldVariablesBox() {
  const ids = { name: useId(), kind: useId() };
  const variables = usePlanner((s) => s.field.variables);
  const [name, setName] = useState('');
  const [kind, setKind] = useState<FieldVariableKind>('number');
  const set = (next: typeof variables) => attempt(() => fieldSetupSet(plannerStore, { variables: next }));
  return (
    <div className="field-variables">
      <h3>Measured at each plot</h3>
      {variables.length ? (
        <ul className="variable-list">
          {variables.map((v, i) => (
            <li key={v.name}>
              <span className="variable-name">{v.name}</span>
              <select aria-label={`Kind of ${v.name}`} value={v.kind} onChange={(e) => set(variables.map((w, j) => (j === i ? { ...w, kind: e.currentTarget.value as FieldVariableKind } : w)))}>
                {FIELD_VARIABLE_KINDS.map((k) => (
                  <option key={k} value={k}>
                    {KIND_LABEL[k]}
                  </option>
                ))}
              </select>
              <button type="button" aria-label={`Remove ${v.name}`} onClick={() => set(variables.filter((_, j) => j !== i))}>
                Remove
              </button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="fine">None yet. Each one becomes a field of the plot form in the field view and a column of its results table.</p>
      )}
      <form
        className="variable-add"
        onSubmit={(e) => {
          e.preventDefault();
          if (set([...variables, { name, kind }]) !== undefined || plannerStore.getState().field.variables.some((v) => v.name === name.trim())) setName('');
        }}
      >
        <label htmlFor={ids.name}>Measurement</label>
        <input id={ids.name} value={name} placeholder="e.g. grass_cover" onChange={(e) => setName(e.currentTarget.value)} />
        <label htmlFor={ids.kind}>Kind</label>
        <select id={ids.kind} value={kind} onChange={(e) => setKind(e.currentTarget.value as FieldVariableKind)}>
          {FIELD_VARIABLE_KINDS.map((k) => (
            <option key={k} value={k}>
              {KIND_LABEL[k]}
            </option>
          ))}
        </select>
        <button type="submit">Add measurement</button>
      </form>
    </div>
  );
}
