import { countNoun } from '../../core/common/countNoun';
import { useId } from 'react';
import type { PlotCollection } from '../../core/model/designTypes';
import { RESULT_KINDS, type ResultKind } from '../../core/model/designTypes';
import { resultsClear, resultsLoad, resultsMappingSet, resultsOptionsSet } from '../../state/resultsStore';
import { resultsStore, useResults } from './resultsStoreInstance';

export const KIND_LABELS: Record<ResultKind, string> = { measure: 'numeric', cover: 'cover %', count: 'count', presence: 'presence/absence' };

/** Reads the chosen file's bytes into the results store. */
async function loadFile(file: File, collection: PlotCollection | null): Promise<void> {
  const bytes = new Uint8Array(await file.arrayBuffer());
  resultsLoad(resultsStore, file.name, bytes, collection);
}

/** File input, column mapping (id, status, replaced-by, kind of each variable) and the variable to estimate. */
export function ResultsLoadBox({ collection }: { collection: PlotCollection | null }) {
  const id = useId();
  const fileName = useResults((s) => s.fileName);
  const table = useResults((s) => s.table);
  const mapping = useResults((s) => s.mapping);
  const variable = useResults((s) => s.variable);
  const loadError = useResults((s) => s.loadError);
  const columns = table?.columns ?? [];
  const pick = (label: string, value: string | null, none: boolean, on: (v: string | null) => void) => (
    <div className="field">
      <label htmlFor={`${id}-${label}`}>{label}</label>
      <select id={`${id}-${label}`} value={value ?? ''} onChange={(e) => on(e.currentTarget.value === '' ? null : e.currentTarget.value)}>
        {none ? <option value="">(none)</option> : null}
        {columns.map((c) => (
          <option key={c} value={c}>
            {c}
          </option>
        ))}
      </select>
    </div>
  );
  return (
    <div className="import-box results-load">
      <div className="field">
        <label htmlFor={`${id}-file`}>Results file (CSV)</label>
        <input
          id={`${id}-file`}
          type="file"
          accept=".csv,.txt,text/csv"
          data-import="results"
          onChange={(e) => {
            const f = e.currentTarget.files?.[0];
            e.currentTarget.value = '';
            if (f) void loadFile(f, collection);
          }}
        />
        {fileName ? (
          <button type="button" className="link" onClick={() => resultsClear(resultsStore)}>
            Unload
          </button>
        ) : null}
      </div>
      <p className="fine">One row per plot, keyed by plot id; comma, semicolon or tab separated; decimal point or comma. Optional columns: a status (done or rejected) and the reserve that replaced a rejected plot.</p>
      {loadError ? (
        <p className="problem" role="alert">
          {loadError}
        </p>
      ) : null}
      {table && mapping ? (
        <>
          <p className="fine">
            {fileName}: {countNoun(table.rows.length, 'row')}, {countNoun(table.columns.length, 'column')}
            {table.decimal === ',' ? ', decimal commas' : ''}.
          </p>
          {pick('Plot id column', mapping.idColumn, false, (v) => v && resultsMappingSet(resultsStore, { idColumn: v }, collection))}
          {pick('Status column', mapping.statusColumn, true, (v) => resultsMappingSet(resultsStore, { statusColumn: v }, collection))}
          {pick('Replaced-by column', mapping.replacedByColumn, true, (v) => resultsMappingSet(resultsStore, { replacedByColumn: v }, collection))}
          <table className="ledger compact" aria-label="Measurement columns and their kinds">
            <thead>
              <tr>
                <th scope="col">Estimate</th>
                <th scope="col">Column</th>
                <th scope="col">Kind</th>
              </tr>
            </thead>
            <tbody>
              {Object.entries(mapping.kinds).map(([c, k]) => (
                <tr key={c}>
                  <td>
                    <input type="radio" name={`${id}-variable`} aria-label={`Estimate ${c}`} checked={variable === c} onChange={() => resultsOptionsSet(resultsStore, { variable: c }, collection)} />
                  </td>
                  <td>{c}</td>
                  <td>
                    <select aria-label={`Kind of ${c}`} value={k} onChange={(e) => resultsMappingSet(resultsStore, { kinds: { [c]: e.currentTarget.value as ResultKind } }, collection)}>
                      {RESULT_KINDS.map((r) => (
                        <option key={r} value={r}>
                          {KIND_LABELS[r]}
                        </option>
                      ))}
                    </select>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      ) : null}
    </div>
  );
}
