import { plannerPlotsNamed } from '../../state/plotsNamed';
import { rngVersionOf } from '../../core/design/place/rngStreams';
import { fmtHa, fmtPct } from '../format';
import { usePlanner } from '../usePlanner';

/**
 * The allocation of the last design: per stratum (by its current name) area, share, plots,
 * reserves and capacity, with its warnings.
 */
export function AllocationTable() {
  const result = usePlanner(plannerPlotsNamed);
  const stale = usePlanner((s) => s.resultStale);
  if (!result) return <p className="fine">No design yet: the allocation appears here once one is made.</p>;
  const rows = result.design.allocation;
  return (
    <div className="allocation">
      <h3>Allocation</h3>
      {stale ? <p className="problem">The map has changed since these plots were made: make the design again before going to the field.</p> : null}
      <table className="ledger" aria-label="Allocation of plots to strata">
        <thead>
          <tr>
            <th scope="col">Stratum</th>
            <th scope="col" className="num">Mapped ha</th>
            <th scope="col" className="num">Usable ha</th>
            <th scope="col" className="num">Share</th>
            <th scope="col" className="num">Plots</th>
            <th scope="col" className="num">Reserves</th>
            <th scope="col" className="num">Capacity</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => {
            const short = r.capacity !== null && r.capacity < r.plots + r.reserve;
            return (
              <tr key={r.stratum} className={short ? 'row-warn' : undefined}>
                <td>{r.stratum}</td>
                <td className="num">{fmtHa(r.mapped_m2)}</td>
                <td className="num">{fmtHa(r.usable_m2)}</td>
                <td className="num">{fmtPct(r.share)}</td>
                <td className="num alloc-plots">{r.plots}</td>
                <td className="num">{r.reserve}</td>
                <td className="num">{r.capacity === null ? '–' : `${r.capacity}${short ? ' (short)' : ''}`}</td>
              </tr>
            );
          })}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row">All strata</th>
            <td className="num">{fmtHa(rows.reduce((a, r) => a + r.mapped_m2, 0))}</td>
            <td className="num">{fmtHa(rows.reduce((a, r) => a + r.usable_m2, 0))}</td>
            <td className="num">100.0 %</td>
            <td className="num">{rows.reduce((a, r) => a + r.plots, 0)}</td>
            <td className="num">{rows.reduce((a, r) => a + r.reserve, 0)}</td>
            <td />
          </tr>
        </tfoot>
      </table>
      <p className="fine">
        Seed {result.design.seed}, random generator version {rngVersionOf(result.design.settings)} · UTM {result.design.crs.utm_zone} (EPSG:{result.design.crs.epsg})
      </p>
      {result.design.warnings.length ? (
        <ul className="warnings" aria-label="Design warnings">
          {result.design.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
      <ul className="statements">
        {result.design.statements.map((s) => (
          <li key={s}>{s}</li>
        ))}
      </ul>
    </div>
  );
}
