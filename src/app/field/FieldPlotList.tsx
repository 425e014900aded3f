import type { FieldPlotOrder } from '../../core/field/fieldPlotOrder';
import { plotFieldStates, plotFieldStateText } from '../../core/field/plotFieldState';
import type { PlotProperties } from '../../core/model/designTypes';
import { decimalDegreesText } from '../../io/common/coordinateText';
import { fieldWhenText } from './fieldText';

/**
 * Every plot of the plan: those to visit in walking order (done ones ticked), then the rejected
 * ones and the waiting reserves, each with its coordinates so the crew can work with no position.
 * Choosing one makes it the plot to walk to and record.
 */
export function FieldPlotList(props: { plots: PlotProperties[]; order: FieldPlotOrder; targetId: string | null; onChoose: (id: string) => void }) {
  const byId = new Map(props.plots.map((p) => [p.plot_id, p]));
  const states = plotFieldStates(props.plots);
  const inOrder = props.order.ids.map((id) => byId.get(id)).filter((p): p is PlotProperties => Boolean(p));
  const listed = new Set(props.order.ids);
  const others = props.plots.filter((p) => !listed.has(p.plot_id)).sort((a, b) => (a.status === 'rejected' ? 0 : 1) - (b.status === 'rejected' ? 0 : 1) || a.stratum.localeCompare(b.stratum) || a.rank - b.rank);
  const done = inOrder.filter((p) => p.visited_at).length;
  const row = (p: PlotProperties, k: number | null) => {
    const s = states.get(p.plot_id);
    const text = s ? plotFieldStateText(p, s).short : '';
    return (
      <li key={p.plot_id} data-plot={p.plot_id} data-state={p.visited_at ? 'visited' : (s?.key ?? '')} className={p.plot_id === props.targetId ? 'fv-row fv-row-on' : 'fv-row'}>
        <button type="button" className="fv-row-button" aria-pressed={p.plot_id === props.targetId} onClick={() => props.onChoose(p.plot_id)}>
          <span className="fv-row-no">{k === null ? '' : k}</span>
          <span className="fv-row-main">
            <span className="fv-row-id">
              {p.visited_at ? '✓ ' : ''}
              {p.plot_id}
            </span>{' '}
            <span className="fv-fine">
              {p.stratum} · {text}
              {p.visited_at ? ` · visited ${fieldWhenText(p.visited_at)}` : ''}
            </span>
            <span className="fv-row-coords">{decimalDegreesText(p.lon, p.lat)}</span>
          </span>
        </button>
      </li>
    );
  };
  return (
    <section className="fv-card" aria-label="Plots">
      <h2>
        Plots to visit: {done} of {inOrder.length} done
      </h2>
      <p className="fv-fine">Walking order {props.order.how}; straight legs are not routes.</p>
      <ol className="fv-list">{inOrder.map((p, i) => row(p, i + 1))}</ol>
      {others.length ? (
        <details className="fv-others">
          <summary>Rejected plots and waiting reserves ({others.length})</summary>
          <ul className="fv-list">{others.map((p) => row(p, null))}</ul>
        </details>
      ) : null}
    </section>
  );
}
