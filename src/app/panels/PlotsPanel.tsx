import { countNoun } from '../../core/common/countNoun';
import { Fragment, useMemo, useState } from 'react';
import type { PlotProperties } from '../../core/model/designTypes';
import { fieldTimeText, type PlotFieldState, plotFieldStates, plotFieldStateText, plotRejections } from '../../core/field/plotFieldState';
import { plotRestore } from '../../state/plotRestore';
import { PlotCheckBox } from '../plotCheck/PlotCheckBox';
import { PlotSymbolKey } from '../map/PlotSymbolKey';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, usePlanner } from '../usePlanner';
import { ExportBox } from './ExportBox';
import { RejectForm } from './RejectForm';
import { stratumLabel } from '../../core/field/stratumLabel';

type SortKey = 'plot_id' | 'stratum' | 'role' | 'rank' | 'status' | 'nearest_exclusion_m';
const COLUMNS: [SortKey, string][] = [
  ['plot_id', 'Plot'],
  ['stratum', 'Stratum'],
  ['role', 'Role'],
  ['rank', 'Rank'],
  ['status', 'Status'],
  ['nearest_exclusion_m', 'To excl. m'],
];

function statusOf(p: PlotProperties, s: PlotFieldState | undefined): string {
  if (!s) return 'planned';
  if (s.key === 'rejected') return `rejected: ${s.reason}`;
  const visit = p.visited_at ? `; visited ${fieldTimeText(p.visited_at)}${p.visited_by ? ` by ${p.visited_by}` : ''}` : '';
  return `${plotFieldStateText(p, s).short}${visit}`;
}

function zoomTo(p: PlotProperties): void {
  const d = 0.0012;
  plannerStore.setState({ focus: { bbox: [p.lon - d, p.lat - d, p.lon + d, p.lat + d], at: Date.now() }, selection: { kind: 'plot', id: p.plot_id } });
}

/** Step 4: the plot roster — every plot with its role and status; zoom to it, reject it, export the lot. */
export function PlotsPanel() {
  const result = usePlanner((s) => s.result);
  const strata = usePlanner((s) => s.site.strata);
  const stratumOf = useMemo(() => new Map(strata.map((s) => [s.key, s])), [strata]);
  const states = useMemo(() => plotFieldStates(result?.features.map((f) => f.properties) ?? []), [result]);
  const rejections = useMemo(() => (result ? plotRejections(result) : []), [result]);
  const selected = usePlanner((s) => (s.selection?.kind === 'plot' ? s.selection.id : null));
  const [sort, setSort] = useState<{ key: SortKey; up: boolean }>({ key: 'plot_id', up: true });
  const [filter, setFilter] = useState('');
  const [role, setRole] = useState<'all' | 'primary' | 'reserve' | 'active'>('all');
  const [rejecting, setRejecting] = useState<string | null>(null);
  const rows = useMemo(() => {
    const all = result?.features.map((f) => f.properties) ?? [];
    const q = filter.trim().toLowerCase();
    const kept = all.filter((p) => {
      if (role === 'primary' && p.role !== 'primary') return false;
      if (role === 'reserve' && p.role !== 'reserve') return false;
      if (role === 'active' && !states.get(p.plot_id)?.active) return false;
      const s = stratumOf.get(p.stratum);
      return !q || p.plot_id.toLowerCase().includes(q) || (s?.label ?? p.stratum).toLowerCase().includes(q) || (s?.code ?? '').toLowerCase().includes(q);
    });
    const k = sort.key;
    const val = (p: PlotProperties) => (k === 'status' ? statusOf(p, states.get(p.plot_id)) : k === 'stratum' ? (stratumOf.get(p.stratum)?.label ?? p.stratum) : (p[k] ?? Infinity));
    return kept.sort((a, b) => {
      const x = val(a);
      const y = val(b);
      const c = typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y), 'en', { numeric: true });
      return sort.up ? c : -c;
    });
  }, [result, filter, role, sort, states, stratumOf]);

  if (!result) {
    return (
      <section className="sheet" aria-labelledby="plots-title">
        <h2 id="plots-title">
          <span className="step-no">4</span> Plots
        </h2>
        <p className="lead">Make a design in step 3 first; its plots are listed here. Plots made elsewhere can be checked against the site now.</p>
        <PlotCheckBox />
      </section>
    );
  }
  return (
    <section className="sheet" aria-labelledby="plots-title">
      <h2 id="plots-title">
        <span className="step-no">4</span> Plots
      </h2>
      <p className="lead">
        {countNoun(result.features.filter((f) => f.properties.role === 'primary').length, 'primary', 'primaries')} and {countNoun(result.features.filter((f) => f.properties.role === 'reserve').length, 'reserve')}
        {rejections.length ? `; ${rejections.length} rejected` : ''}. The map, the exports and the field sheets draw every plot by its field state:
      </p>
      <PlotSymbolKey />
      <div className="filter-row">
        <input type="search" aria-label="Filter plots by id or stratum" placeholder="Filter by id or stratum" value={filter} onChange={(e) => setFilter(e.currentTarget.value)} />
        <select aria-label="Which plots to list" value={role} onChange={(e) => setRole(e.currentTarget.value as typeof role)}>
          <option value="all">all plots</option>
          <option value="active">plots to visit</option>
          <option value="primary">primaries</option>
          <option value="reserve">reserves</option>
        </select>
      </div>
      <div className="table-wrap">
      <table className="ledger plots" aria-label="Plots">
        <thead>
          <tr>
            {COLUMNS.map(([k, t]) => (
              <th key={k} scope="col" aria-sort={sort.key === k ? (sort.up ? 'ascending' : 'descending') : 'none'} className={k === 'rank' || k === 'nearest_exclusion_m' ? 'num' : undefined}>
                <button type="button" className="sort" onClick={() => setSort({ key: k, up: sort.key === k ? !sort.up : true })}>
                  {t}
                  <span aria-hidden="true">{sort.key === k ? (sort.up ? ' ▲' : ' ▼') : ''}</span>
                </button>
              </th>
            ))}
            <th scope="col">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((p) => {
            const state = states.get(p.plot_id);
            const stratum = stratumOf.get(p.stratum);
            return (
            <Fragment key={p.plot_id}>
              <tr data-plot={p.plot_id} data-status={p.status ?? 'planned'} data-state={state?.key} className={[selected === p.plot_id ? 'row-on' : '', state?.key === 'rejected' ? 'row-rejected' : ''].join(' ').trim() || undefined}>
                <td className="mono">{p.plot_id}</td>
                <td title={stratum ? stratumLabel(stratum.label, stratum.code) : p.stratum}>{stratum?.code ?? p.stratum}</td>
                <td>{p.role}</td>
                <td className="num">{p.rank}</td>
                <td className="plot-status" title={state ? plotFieldStateText(p, state).note : undefined}>
                  {statusOf(p, state)}
                </td>
                <td className="num">{p.nearest_exclusion_m === null ? '–' : p.nearest_exclusion_m.toFixed(0)}</td>
                <td className="actions">
                  <button type="button" aria-label={`Zoom to plot ${p.plot_id}`} onClick={() => zoomTo(p)}>
                    Zoom
                  </button>
                  {state?.active ? (
                    <button type="button" aria-label={`Reject plot ${p.plot_id}`} onClick={() => setRejecting(p.plot_id)}>
                      Reject…
                    </button>
                  ) : null}
                  {state?.key === 'rejected' ? (
                    <button type="button" aria-label={`Restore plot ${p.plot_id}`} title="Undo this rejection: the plot is to be visited again and its replacement goes back to waiting" onClick={() => attempt(() => plotRestore(plannerStore, p.plot_id))}>
                      Restore
                    </button>
                  ) : null}
                </td>
              </tr>
              {rejecting === p.plot_id ? (
                <tr>
                  <td colSpan={7}>
                    <RejectForm plotId={p.plot_id} onDone={() => setRejecting(null)} />
                  </td>
                </tr>
              ) : null}
            </Fragment>
            );
          })}
        </tbody>
      </table>
      </div>
      {rejections.length ? (
        <>
          <h3>Field decisions</h3>
          <ul className="plain-list decisions">
            {rejections.map((r) => (
              <li key={`${r.plot_id}-${r.at}`}>
                {r.plot_id} rejected: {r.reason} → {r.replacement ? `${r.replacement} promoted` : 'no reserve left'}
                {r.at ? <span className="fine"> ({fieldTimeText(r.at)})</span> : null}{' '}
                <button type="button" className="link" aria-label={`Restore plot ${r.plot_id} from the field decisions`} onClick={() => attempt(() => plotRestore(plannerStore, r.plot_id))}>
                  Restore
                </button>
              </li>
            ))}
          </ul>
        </>
      ) : null}
      <ExportBox />
      <PlotCheckBox />
    </section>
  );
}
