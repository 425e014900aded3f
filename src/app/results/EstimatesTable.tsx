import { COLLAPSE_RULE } from '../../core/results/collapseStrata';
import type { EstimateReport } from '../../core/results/estimateFromResults';
import { fmtInterval, fmtValue } from './resultsFormat';

const KIND_WORD = { measure: 'numeric', cover: 'cover %', count: 'count', presence: 'presence/absence' } as const;

/** The estimate: per-stratum lines, the stratified mean, CI, total, proportion and design effect. */
export function EstimatesTable({ report }: { report: EstimateReport }) {
  const n = report.strata.reduce((a, s) => a + s.n, 0);
  const presence = report.kind === 'presence';
  return (
    <>
      <table className="ledger results-table" aria-label={`Estimate of ${report.variable} by stratum`}>
        <thead>
          <tr>
            <th scope="col">Stratum</th>
            <th scope="col" className="num">n</th>
            <th scope="col" className="num">{presence ? 'Share present' : 'Mean'}</th>
            <th scope="col" className="num">SD</th>
            <th scope="col" className="num">SE</th>
            <th scope="col" className="num">Weight</th>
          </tr>
        </thead>
        <tbody>
          {report.strata.map((s) => (
            <tr key={s.stratum} data-stratum={s.stratum} className={s.n < 2 ? 'results-short' : undefined}>
              <th scope="row">
                {s.stratum}
                {s.n < 2 ? <span className="results-flag"> n &lt; 2</span> : null}
                {s.group ? <span className="results-flag"> collapsed</span> : null}
              </th>
              <td className="num">{s.n}</td>
              <td className="num">{fmtValue(s.mean)}</td>
              <td className="num">{fmtValue(s.sd)}</td>
              <td className="num">{fmtValue(s.se)}</td>
              <td className="num">{s.weight.toFixed(3)}</td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row">Stratified</th>
            <td className="num">{n}</td>
            <td className="num" data-cell="mean">{fmtValue(report.mean)}</td>
            <td className="num" />
            <td className="num" data-cell="se">{fmtValue(report.se)}</td>
            <td className="num">1.000</td>
          </tr>
        </tfoot>
      </table>
      <dl className="results-facts">
        <dt>{presence ? 'Proportion present, 95 % CI' : 'Mean, 95 % CI'}</dt>
        <dd data-fact="ci95">
          {presence && report.mean !== null ? `${(report.mean * 100).toFixed(1)} % (${report.ci95 ? `${(report.ci95[0] * 100).toFixed(1)} to ${(report.ci95[1] * 100).toFixed(1)} %` : 'no CI'})` : `${fmtValue(report.mean)} (${fmtInterval(report.ci95)})`}
          {report.df !== null ? `, t on ${report.df.toFixed(1)} Satterthwaite df` : ''}
        </dd>
        {report.total_unit !== null ? (
          <>
            <dt>Total, 95 % CI</dt>
            <dd data-fact="total">
              {fmtValue(report.total)} ({fmtInterval(report.total_ci95)}) — {report.total_unit}, over {report.area_ha.toFixed(2)} ha
            </dd>
          </>
        ) : null}
        <dt>Design effect</dt>
        <dd data-fact="deff">{report.deff === null ? '–' : `${report.deff.toFixed(3)} (${report.deff < 1 ? 'stratifying gained precision' : 'no gain over a simple random sample'})`}</dd>
        <dt>Variable</dt>
        <dd>
          {report.variable} ({KIND_WORD[report.kind]}), plot area {report.plot_area_m2 > 0 ? `${fmtValue(report.plot_area_m2)} m²` : 'none (point plots)'}
        </dd>
      </dl>
      <p className="results-population">{report.population}</p>
      {report.warnings.length ? (
        <div className="caution" role="note">
          <strong>Check before using these figures</strong>
          <ul>
            {report.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {report.collapsed_groups.length ? (
        <div className="results-collapsed" role="note" data-fact="collapsed">
          <strong>Collapsed strata (variance only)</strong>
          <ul>
            {report.collapsed_groups.map((g) => (
              <li key={g.strata.join('+')}>
                {g.strata.join(' + ')}: between-strata variance {fmtValue(g.variance)} on {g.df} df
              </li>
            ))}
          </ul>
          <p className="fine">
            The mean still weights every stratum by its own area; only these groups’ variance comes from the collapsed-strata estimator (Hansen, Hurwitz &amp; Madow 1953; Cochran 1977 §5A.12), which is conservative: differences between the grouped strata count as sampling error, so the SE and CI tend to be too wide rather than too narrow.
          </p>
        </div>
      ) : null}
      <details className="results-formulas">
        <summary>Formulas used (Cochran, Sampling Techniques, 3rd ed. 1977, ch. 5)</summary>
        <ul>
          {report.formulas.map((f) => (
            <li key={f}>{f}</li>
          ))}
          <li>collapsing strata for variance: {COLLAPSE_RULE}</li>
          <li>each stratum’s interval in the chart: ȳ_h ± t(0.975, n_h − 1) × SE_h</li>
        </ul>
      </details>
    </>
  );
}
