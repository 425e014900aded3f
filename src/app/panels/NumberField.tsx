import { useId } from 'react';

/**
 * A labelled number input that commits on blur or Enter; the unit is printed after it. An empty
 * box commits null when `allowEmpty`, otherwise the value is restored.
 */
export function NumberField({ label, unit, value, min, step, onCommit, allowEmpty = false, hint }: {
  label: string;
  unit?: string;
  value: number | null;
  min?: number;
  step?: number;
  allowEmpty?: boolean;
  hint?: string;
  onCommit: (v: number | null) => void;
}) {
  const id = useId();
  const commit = (input: HTMLInputElement) => {
    const raw = input.value.trim();
    if (raw === '') {
      if (allowEmpty) onCommit(null);
      else input.value = value === null ? '' : String(value);
      return;
    }
    const v = Number(raw);
    if (v !== value) onCommit(v);
  };
  return (
    <div className="field">
      <label htmlFor={id}>{label}</label>
      <span className="field-input">
        <input
          id={id}
          type="number"
          className="num-input"
          min={min}
          step={step ?? 'any'}
          defaultValue={value ?? ''}
          key={String(value)}
          title={hint}
          onBlur={(e) => commit(e.currentTarget)}
          onKeyDown={(e) => e.key === 'Enter' && e.currentTarget.blur()}
        />
        {unit ? <span className="unit">{unit}</span> : null}
      </span>
    </div>
  );
}
