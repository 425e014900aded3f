import { type LocalFrame, localFrameAt } from '../../core/geo/localFrame';
import type { PlotProperties } from '../../core/model/designTypes';
import type { PositionFix } from '../../core/model/fieldTypes';
import type { Exclusion, LonLat } from '../../core/model/types';
import { niceStepM } from '../../core/common/niceStepM';
import { fieldDistanceText } from './fieldText';

const R = 150;

function paths(e: Exclusion): { rings: LonLat[][]; lines: LonLat[][]; points: LonLat[] } {
  const g = e.geometry;
  switch (g.type) {
    case 'Point':
      return { rings: [], lines: [], points: [g.coordinates as LonLat] };
    case 'MultiPoint':
      return { rings: [], lines: [], points: g.coordinates as LonLat[] };
    case 'LineString':
      return { rings: [], lines: [g.coordinates as LonLat[]], points: [] };
    case 'MultiLineString':
      return { rings: [], lines: g.coordinates as LonLat[][], points: [] };
    case 'Polygon':
      return { rings: g.coordinates as LonLat[][], lines: [], points: [] };
    case 'MultiPolygon':
      return { rings: (g.coordinates as LonLat[][][]).flat(), lines: [], points: [] };
    default:
      return { rings: [], lines: [], points: [] };
  }
}

/**
 * A north-up sketch around the crew (a plain local scale, not a map): the accuracy circle, the
 * plot to walk to and its neighbours, and the exclusions drawn as wide as their buffers, so the
 * crew sees which side of a cliff or creek the plot lies. Works with no tiles and no network.
 */
export function FieldSketch(props: { fix: PositionFix | null; target: PlotProperties | null; plots: PlotProperties[]; exclusions: readonly Exclusion[]; distanceM: number | null; frame: LocalFrame | null }) {
  const { fix, target } = props;
  const centre = fix ?? (target ? { lon: target.lon, lat: target.lat, accuracyM: 0 } : null);
  if (!centre) return null;
  const span = Math.max(30, (props.distanceM ?? 0) * 1.25, fix ? fix.accuracyM * 1.4 : 0);
  const scale = R / span;
  // Drawn in the design's UTM frame (grid north up, a fraction of a degree from true north at site scale).
  const frame = props.frame ?? localFrameAt(centre.lon, centre.lat);
  const [cx, cy] = frame.toXY(centre.lon, centre.lat);
  const xy = ([lon, lat]: LonLat): [number, number] => {
    const [x, y] = frame.toXY(lon, lat);
    return [(x - cx) * scale, -(y - cy) * scale];
  };
  const d = (line: LonLat[], close: boolean) => `M${line.map((p) => xy(p).map((v) => v.toFixed(1)).join(',')).join('L')}${close ? 'Z' : ''}`;
  // The scale bar takes the nice step of the printed maps, about a third of the way to the edge.
  const bar = niceStepM(span / 3);
  return (
    <section className="fv-card fv-sketch-card" aria-label="Sketch around your position">
      <svg className="fv-sketch" viewBox={`${-R} ${-R} ${2 * R} ${2 * R}`} role="img" aria-label={`North-up sketch, ${fieldDistanceText(span)} from centre to edge`}>
        <defs>
          <clipPath id="fv-sketch-clip">
            <rect x={-R} y={-R} width={2 * R} height={2 * R} />
          </clipPath>
        </defs>
        <g clipPath="url(#fv-sketch-clip)">
          {props.exclusions.map((e) => {
            const p = paths(e);
            const w = Math.max(2, 2 * e.bufferM * scale);
            return (
              <g key={e.id} className={`fv-x fv-x-${e.kind}`}>
                {p.rings.map((ring, i) => (
                  // biome-ignore lint/suspicious/noArrayIndexKey: rings have no id of their own
                  <path key={`r${i}`} d={d(ring, true)} strokeWidth={w} className="fv-x-area" />
                ))}
                {p.lines.map((line, i) => (
                  // biome-ignore lint/suspicious/noArrayIndexKey: lines have no id of their own
                  <path key={`l${i}`} d={d(line, false)} strokeWidth={w} className="fv-x-line" />
                ))}
                {p.points.map((pt, i) => {
                  const [x, y] = xy(pt);
                  // biome-ignore lint/suspicious/noArrayIndexKey: points have no id of their own
                  return <circle key={`p${i}`} cx={x} cy={y} r={Math.max(3, e.bufferM * scale)} className="fv-x-area" />;
                })}
              </g>
            );
          })}
          {props.plots.map((p) => {
            const [x, y] = xy([p.lon, p.lat]);
            if (Math.abs(x) > R || Math.abs(y) > R) return null;
            return <circle key={p.plot_id} cx={x} cy={y} r={4} className={p.visited_at ? 'fv-dot fv-dot-done' : 'fv-dot'} />;
          })}
          {target ? (
            <g className="fv-target" transform={`translate(${xy([target.lon, target.lat]).map((v) => v.toFixed(1)).join(',')})`}>
              <circle r={10} />
              <line x1={-15} x2={15} y1={0} y2={0} />
              <line x1={0} x2={0} y1={-15} y2={15} />
            </g>
          ) : null}
          {fix ? (
            <g className="fv-me">
              <circle r={Math.max(3, fix.accuracyM * scale)} className="fv-accuracy" />
              <circle r={6} className="fv-me-dot" />
            </g>
          ) : null}
        </g>
        <text x={-R + 8} y={-R + 20} className="fv-sketch-n">
          N ↑
        </text>
        <g transform={`translate(${-R + 10},${R - 14})`} className="fv-bar">
          <line x1={0} x2={bar * scale} y1={0} y2={0} />
          <text x={0} y={-6}>
            {fieldDistanceText(bar)}
          </text>
        </g>
      </svg>
      {fix ? <p className="fv-fine">Blue: you, with the circle of the position's accuracy (±{Math.round(fix.accuracyM)} m). Shaded: exclusions as wide as their safety buffers.</p> : null}
    </section>
  );
}
