import { countNoun } from '../../core/countNoun';
import { Fragment, useMemo, useState } from 'react';
import type { PlotProperties } from '../../core/designTypes';
import { plannerStore } from '../plannerStoreInstance';
import { usePlanner } from '../usePlanner';
import { ExportBox } from './ExportBox';
import { RejectForm } from './RejectForm';

type SortKey = 'plot_id' | 'stratum' | 'role' | 'rank' | 'status' | 'nearest_exclusion_m';
const COLUMNS: [SortKey, string][] = [
  ['plot_id', 'Plot'],
  ['stratum', 'Stratum'],
  ['role', 'Role'],
  ['rank', 'Rank'],
  ['status', 'Status'],
  ['nearest_exclusion_m', 'To excl. m'],
];

function statusOf(p: PlotProperties): string {
  return p.status === 'rejected' ? 'rejected' : p.status === 'promoted' ? `promoted ← ${p.replaces ?? '?'}` : 'planned';
}

function zoomTo(p: PlotProperties): void {
  const d = 0.0012;
  plannerStore.setState({ focus: { bbox: [p.lon - d, p.lat - d, p.lon + d, p.lat + d], at: Date.now() }, selection: { kind: 'plot', id: p.plot_id } });
}

/** Step 4: the plot roster — every plot with its role and status; zoom to it, reject it, export the lot. */
export function PlotsPanel() {
  const result = usePlanner((s) => s.result);
  const rejections = usePlanner((s) => s.rejections);
  const strata = usePlanner((s) => s.site.strata);
  const code = useMemo(() => new Map(strata.map((s) => [s.key, s.code])), [strata]);
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
      if (role === 'active' && !((p.role === 'primary' && p.status !== 'rejected') || p.status === 'promoted')) return false;
      return !q || p.plot_id.toLowerCase().includes(q) || p.stratum.toLowerCase().includes(q);
    });
    const k = sort.key;
    const val = (p: PlotProperties) => (k === 'status' ? statusOf(p) : (p[k] ?? Infinity));
    return kept.sort((a, b) => {
      const x = val(a);
      const y = val(b);
      const c = typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y), 'en', { numeric: true });
      return sort.up ? c : -c;
    });
  }, [result, filter, role, sort]);

  if (!result) {
    return (
      <section className="sheet" aria-labelledby="plots-title">
        <h2 id="plots-title">
          <span className="step-no">4</span> Plots
        </h2>
        <p className="lead">Make a design in step 3 first; its plots are listed here.</p>
      </section>
    );
  }
  return (
    <section className="sheet" aria-labelledby="plots-title">
      <h2 id="plots-title">
        <span className="step-no">4</span> Plots
      </h2>
      <p className="lead">
        {countNoun(result.features.filter((f) => f.properties.role === 'primary').length, 'primary', 'primaries')} and {countNoun(result.features.filter((f) => f.properties.role === 'reserve').length, 'reserve')}. Filled dots are primaries, rings are reserves; promoted reserves are gold, rejected plots grey.
      </p>
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
          {rows.map((p) => (
            <Fragment key={p.plot_id}>
              <tr data-plot={p.plot_id} data-status={p.status ?? 'planned'} className={selected === p.plot_id ? 'row-on' : undefined}>
                <td className="mono">{p.plot_id}</td>
                <td title={p.stratum}>{code.get(p.stratum) ?? p.stratum}</td>
                <td>{p.role}</td>
                <td className="num">{p.rank}</td>
                <td className="plot-status">{statusOf(p)}</td>
                <td className="num">{p.nearest_exclusion_m === null ? '–' : p.nearest_exclusion_m.toFixed(0)}</td>
                <td className="actions">
                  <button type="button" aria-label={`Zoom to plot ${p.plot_id}`} onClick={() => zoomTo(p)}>
                    Zoom
                  </button>
                  {(p.role === 'primary' && p.status !== 'rejected') || p.status === 'promoted' ? (
                    <button type="button" aria-label={`Reject plot ${p.plot_id}`} onClick={() => setRejecting(p.plot_id)}>
                      Reject…
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
          ))}
        </tbody>
      </table>
      </div>
      {rejections.length ? (
        <>
          <h3>Field decisions</h3>
          <ul className="plain-list decisions">
            {rejections.map((r) => (
              <li key={`${r.plot_id}-${r.at}`}>
                {r.plot_id} rejected: {r.reason} → {r.replacement ? `${r.replacement} promoted` : 'no reserve left'} <span className="fine">({r.at.slice(0, 16).replace('T', ' ')})</span>
              </li>
            ))}
          </ul>
        </>
      ) : null}
      <ExportBox />
    </section>
  );
}
