import { RECAPTURE_ASSUMPTIONS } from '../../core/results/recapture';
import { type RecaptureGridForm, recaptureGridAdd, recaptureGridRemove, recaptureGridSet } from '../../state/resultsStore';
import { recaptureFormResult } from './recaptureFormResult';
import { fmtInterval, fmtValue } from './resultsFormat';
import { resultsStore, useResults } from './resultsStoreInstance';

type TextField = 'marked' | 'caught' | 'recaptured' | 'stripM' | 'areaHa' | 'spacingM' | 'rows' | 'cols';

function Entry({ form, field, label, unit }: { form: RecaptureGridForm; field: TextField; label: string; unit?: string }) {
  return (
    <label className="results-entry">
      <span>{label}</span>
      <span className="field-input">
        <input
          className="num-input"
          inputMode="decimal"
          aria-label={`${label} for ${form.name}`}
          value={form[field]}
          onChange={(e) => recaptureGridSet(resultsStore, form.id, { [field]: e.currentTarget.value })}
        />
        {unit ? <span className="fine">{unit}</span> : null}
      </span>
    </label>
  );
}

function GridForm({ form }: { form: RecaptureGridForm }) {
  const r = recaptureFormResult(form);
  return (
    <fieldset className="results-grid" data-grid={form.id}>
      <legend>
        <input className="name-input" aria-label={`Name of ${form.name}`} value={form.name} onChange={(e) => recaptureGridSet(resultsStore, form.id, { name: e.currentTarget.value })} />
      </legend>
      <div className="results-entries">
        <Entry form={form} field="marked" label="Marked M" />
        <Entry form={form} field="caught" label="Caught n" />
        <Entry form={form} field="recaptured" label="Recaptured m" />
        <Entry form={form} field="stripM" label="Strip width" unit="m" />
      </div>
      <div className="results-entries">
        <label className="results-entry">
          <span>Grid given by</span>
          <select aria-label={`Grid extent of ${form.name} given by`} value={form.by} onChange={(e) => recaptureGridSet(resultsStore, form.id, { by: e.currentTarget.value as 'stations' | 'area' })}>
            <option value="stations">stations</option>
            <option value="area">area</option>
          </select>
        </label>
        {form.by === 'area' ? (
          <Entry form={form} field="areaHa" label="Grid area" unit="ha" />
        ) : (
          <>
            <Entry form={form} field="spacingM" label="Spacing" unit="m" />
            <Entry form={form} field="rows" label="Rows" />
            <Entry form={form} field="cols" label="Columns" />
          </>
        )}
      </div>
      {r.state === 'error' ? <p className="problem">{r.message}</p> : null}
      {r.state === 'ok' ? (
        <>
          <dl className="results-facts" aria-label={`Recapture estimate for ${form.name}`}>
            <dt>Petersen N̂ = Mn/m</dt>
            <dd data-fact="petersen">{r.estimate.petersen === null ? 'none (no recaptures)' : fmtValue(r.estimate.petersen)}</dd>
            <dt>Chapman N* = (M+1)(n+1)/(m+1) − 1</dt>
            <dd data-fact="chapman">{fmtValue(r.estimate.chapman)}</dd>
            <dt>SE (Seber), 95 % CI</dt>
            <dd data-fact="se">
              {fmtValue(r.estimate.se)}; {fmtInterval(r.estimate.ci95)} (normal approximation, at least the {r.estimate.knownMinimum} animals seen)
            </dd>
            {r.estimate.density ? (
              <>
                <dt>Density, effective area {r.estimate.density.effectiveAreaHa.toFixed(3)} ha</dt>
                <dd data-fact="density">
                  {fmtValue(r.estimate.density.perHa)} per ha, SE {fmtValue(r.estimate.density.sePerHa)}, 95 % CI {fmtInterval(r.estimate.density.ci95PerHa)}
                </dd>
              </>
            ) : null}
          </dl>
          {r.estimate.warnings.length ? (
            <ul className="caution" role="note">
              {r.estimate.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          ) : null}
        </>
      ) : null}
      <button type="button" className="link" onClick={() => recaptureGridRemove(resultsStore, form.id)}>
        Remove {form.name}
      </button>
    </fieldset>
  );
}

/** Mark–recapture forms, one per trapping grid, with the estimate worked out as the counts are typed. */
export function RecaptureBox() {
  const grids = useResults((s) => s.grids);
  return (
    <div className="results-recapture">
      {grids.map((g) => (
        <GridForm key={g.id} form={g} />
      ))}
      <button type="button" onClick={() => recaptureGridAdd(resultsStore)}>
        Add a grid
      </button>
      <p className="fine">Effective area = L1·L2 + 2W(L1 + L2) + πW², the grid plus a boundary strip of width W (Krebs 1989 ch. 2). The estimates assume:</p>
      <ul className="fine">
        {RECAPTURE_ASSUMPTIONS.map((a) => (
          <li key={a}>{a}</li>
        ))}
      </ul>
      <p className="fine">Trap, handle and mark animals only under the permits and animal-ethics approval your jurisdiction requires, and work to your employer’s safety plan.</p>
    </div>
  );
}
