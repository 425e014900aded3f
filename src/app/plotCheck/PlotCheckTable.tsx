import type { PlotCheckRecord } from '../../core/plotCheck/plotCheckTypes';
import { plotCheckRecordsBySeverity } from '../../core/plotCheck/plotsCheck';
import { plannerStore } from '../plannerStoreInstance';
import { plotCheckStore, usePlotCheck } from './plotCheckStoreInstance';

function zoomTo(r: PlotCheckRecord): void {
  const d = 0.0012;
  plotCheckStore.setState({ selected: r.index });
  plannerStore.setState({ focus: { bbox: [r.lon - d, r.lat - d, r.lon + d, r.lat + d], at: Date.now() } });
}

/** The checked plots, most serious first: id, stratum, result and every reason in words; Show zooms to it and opens its reasons. */
export function PlotCheckTable() {
  const report = usePlotCheck((s) => s.report);
  const selected = usePlotCheck((s) => s.selected);
  if (!report) return null;
  return (
    <div className="table-wrap">
      <table className="ledger check-table" aria-label="Checked plots, most serious first">
        <thead>
          <tr>
            <th scope="col">Plot</th>
            <th scope="col">Stratum</th>
            <th scope="col">Result</th>
            <th scope="col">Why</th>
            <th scope="col">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {plotCheckRecordsBySeverity(report.plots).map((r) => (
            <tr key={r.index} data-check-plot={r.id} data-check={r.ok ? 'pass' : 'fail'} className={[r.ok ? '' : 'row-check-fail', selected === r.index ? 'row-on' : ''].join(' ').trim() || undefined}>
              <td className="mono" title={r.where}>
                {r.id}
              </td>
              <td title={r.stratum?.name ?? undefined}>{r.stratum?.code ?? (r.holeIn ? `hole in ${r.holeIn.code}` : 'none')}</td>
              <td className="check-result">{r.ok ? 'passes' : 'FAILS'}</td>
              <td className="check-why">{r.problems.length ? r.problems.map((p) => <div key={p.code + p.text}>{p.text}</div>) : '—'}</td>
              <td className="actions">
                <button type="button" aria-label={`Show checked plot ${r.id} (${r.where}) on the map`} onClick={() => zoomTo(r)}>
                  Show
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
