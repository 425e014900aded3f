import { strataMerge, stratumRecode, stratumRecolour, stratumRename } from '../../state/strataActions';
import { fmtHa, fmtPct } from '../format';
import { siteBounds } from '../map/siteBounds';
import { plannerStore } from '../plannerStoreInstance';
import { useAreaTable } from '../useAreaTable';
import { attempt, usePlanner } from '../usePlanner';
import { BackdropBox } from './BackdropBox';
import { ImportBox } from './ImportBox';
import { ProblemList } from './ProblemList';
import { ToolButton } from './ToolButton';

/** Step 1: the strata ledger — draw or import strata, name, code and colour them, see their areas. */
export function StrataPanel() {
  const { table, error, site, current } = useAreaTable();
  const target = usePlanner((s) => s.drawStratumKey);
  const rows = new Map(table?.rows.map((r) => [r.stratum, r]) ?? []);
  return (
    <section className="sheet" aria-labelledby="strata-title">
      <h2 id="strata-title">
        <span className="step-no">1</span> Map strata
      </h2>
      <p className="lead">Outline each habitat stratum over the imagery, or bring in a mapped layer. Areas are measured on the WGS84 ellipsoid.</p>
      <fieldset className="tools" aria-label="Stratum drawing tools">
        <ToolButton tool="stratum" label="Draw stratum" shortcut="S" hint="Click the outline, click the first point to close" />
        <ToolButton tool="stratum-beside" label="Draw beside neighbours" shortcut="B" hint="Overlaps with mapped strata are clipped away, so edges are shared" />
        <ToolButton tool="hole" label="Cut a hole" shortcut="H" hint="Draw a polygon to subtract it from the strata it overlaps" />
        <ToolButton tool="edit" label="Move vertices" shortcut="E" hint="Reshape the selected stratum feature" />
      </fieldset>
      <label className="inline">
        New outlines go into{' '}
        <select value={target ?? ''} onChange={(e) => plannerStore.setState({ drawStratumKey: e.currentTarget.value || null })}>
          <option value="">a new stratum</option>
          {site.strata.map((s) => (
            <option key={s.key} value={s.key}>
              {s.label}
            </option>
          ))}
        </select>
      </label>
      <ImportBox kind="strata" />
      {error ? <p className="problem">{error}</p> : null}
      <p className="fine measuring" aria-live="polite">
        {current ? '' : 'Measuring areas on the ellipsoid…'}
      </p>
      <div className="table-wrap">
      <table className="ledger" aria-label="Strata and their areas" data-measured={current && table ? 'yes' : 'no'}>
        <thead>
          <tr>
            <th scope="col">Stratum</th>
            <th scope="col">Code</th>
            <th scope="col" className="num">Mapped ha</th>
            <th scope="col" className="num">Share</th>
            <th scope="col" className="num">Usable ha</th>
            <th scope="col" className="num">
              <abbr title="mapped features">Feat.</abbr>
            </th>
            <th scope="col">Merge</th>
          </tr>
        </thead>
        <tbody>
          {site.strata.map((s) => {
            const r = rows.get(s.key);
            return (
              <tr key={s.key} data-stratum={s.key}>
                <td>
                  <span className="name-cell">
                    <input
                      type="color"
                      aria-label={`Colour of ${s.label}`}
                      value={s.colour.length === 7 ? s.colour : '#777777'}
                      onChange={(e) => attempt(() => stratumRecolour(plannerStore, s.key, e.currentTarget.value))}
                    />
                    <input
                      className="name-input"
                      aria-label={`Name of stratum ${s.key}`}
                      defaultValue={s.label}
                      key={s.label}
                      onBlur={(e) => e.currentTarget.value !== s.label && attempt(() => stratumRename(plannerStore, s.key, e.currentTarget.value))}
                    />
                  </span>
                </td>
                <td>
                  <input
                    className="code-input"
                    aria-label={`Code of ${s.label}`}
                    defaultValue={s.code}
                    key={s.code}
                    size={4}
                    onBlur={(e) => e.currentTarget.value.toUpperCase() !== s.code && attempt(() => stratumRecode(plannerStore, s.key, e.currentTarget.value))}
                  />
                </td>
                <td className="num area-ha">{r ? fmtHa(r.area_m2) : '–'}</td>
                <td className="num">{r ? fmtPct(r.share) : '–'}</td>
                <td className="num">{r ? fmtHa(r.usable_m2) : '–'}</td>
                <td className="num">
                  <button
                    type="button"
                    className="link"
                    aria-label={`Show ${s.label} on the map and select it`}
                    title="Show on the map"
                    onClick={() => {
                      const parts = site.parts.filter((p) => p.stratum === s.key);
                      const bbox = siteBounds({ ...site, parts, exclusions: [], access: [] });
                      if (bbox) plannerStore.setState({ focus: { bbox, at: Date.now() }, selection: { kind: 'part', id: parts[0].id } });
                    }}
                  >
                    {r?.features ?? 0}
                  </button>
                </td>
                <td>
                  <select
                    className="merge-select"
                    aria-label={`Merge ${s.label} into another stratum`}
                    value=""
                    onChange={(e) => e.currentTarget.value && attempt(() => strataMerge(plannerStore, s.key, e.currentTarget.value))}
                  >
                    <option value="">into…</option>
                    {site.strata
                      .filter((o) => o.key !== s.key)
                      .map((o) => (
                        <option key={o.key} value={o.key}>
                          {o.label}
                        </option>
                      ))}
                  </select>
                </td>
              </tr>
            );
          })}
        </tbody>
        {table ? (
          <tfoot>
            <tr>
              <th scope="row">All strata</th>
              <td />
              <td className="num">{fmtHa(table.total_m2)}</td>
              <td className="num">100.0 %</td>
              <td className="num">{fmtHa(table.rows.reduce((a, r) => a + r.usable_m2, 0))}</td>
              <td className="num">{table.rows.reduce((a, r) => a + r.features, 0)}</td>
              <td />
            </tr>
          </tfoot>
        ) : null}
      </table>
      </div>
      <ProblemList />
      {table ? (
        <p className="fine">
          Usable = mapped less buffered exclusions. Frame for buffers and plots: UTM {table.crs.utm_zone} (EPSG:{table.crs.epsg}).
        </p>
      ) : null}
      <BackdropBox />
    </section>
  );
}
