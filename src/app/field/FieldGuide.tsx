import type { FieldArrival } from '../../core/field/fieldArrival';
import type { FieldGuidance } from '../../core/field/fieldGuidance';
import type { FieldHazard } from '../../core/field/fieldHazards';
import type { PlotProperties } from '../../core/model/designTypes';
import { EXCLUSION_KIND_LABELS } from '../../core/site/exclusionKindNotes';
import { decimalDegreesText, declinationText, mgrsSpacedText, utmText } from '../../io/common/coordinateText';
import { fieldDegText, fieldDistanceText } from './fieldText';

/** Where the plot to walk to lies: its id, distance and bearings, an arrow, and whether the crew is there. */
export function FieldGuide(props: {
  plot: PlotProperties;
  isNext: boolean;
  guidance: FieldGuidance | null;
  arrival: FieldArrival | null;
  onRoute: FieldHazard[];
  positionStatus: string;
}) {
  const { plot, guidance, arrival } = props;
  const arrow = guidance ? (guidance.arrowDeg ?? guidance.bearingTrueDeg) : null;
  return (
    <section className="fv-card fv-guide" aria-label={`Way to plot ${plot.plot_id}`} data-arrived={arrival?.arrived ? 'yes' : 'no'}>
      <div className="fv-guide-head">
        <div>
          <div className="fv-kicker">{props.isNext ? 'Next plot' : 'Chosen plot'}</div>
          <div className="fv-plot-id">{plot.plot_id}</div>
          <div className="fv-fine">
            {plot.stratum} · rank {plot.rank}
            {plot.status === 'promoted' && plot.replaces ? ` · replaces ${plot.replaces}` : ''}
          </div>
        </div>
        {arrow !== null ? (
          <svg className="fv-arrow" viewBox="-50 -64 100 114" role="img" aria-label={guidance?.arrowDeg === null ? `Bearing on a north-up dial` : `Turn to the arrow`}>
            <circle r="46" className="fv-dial" />
            {guidance?.arrowDeg === null ? (
              <text x="0" y="-51" textAnchor="middle" className="fv-dial-n">
                N
              </text>
            ) : null}
            <g transform={`rotate(${arrow.toFixed(1)})`}>
              <path d="M0,-38 L14,8 L4,4 L4,30 L-4,30 L-4,4 L-14,8 Z" className="fv-arrow-body" />
            </g>
          </svg>
        ) : null}
      </div>
      {guidance ? (
        <dl className="fv-figures">
          <div>
            <dt>Distance</dt>
            <dd data-figure="distance">{fieldDistanceText(guidance.distanceM)}</dd>
          </div>
          <div>
            <dt>Bearing, true</dt>
            <dd data-figure="bearing-true">{fieldDegText(guidance.bearingTrueDeg)}</dd>
          </div>
          <div>
            <dt>Bearing, magnetic</dt>
            <dd data-figure="bearing-mag">{fieldDegText(guidance.bearingMagDeg)}</dd>
          </div>
        </dl>
      ) : (
        <p className="fv-fine">No live position ({props.positionStatus}). Navigate by the coordinates below.</p>
      )}
      {guidance ? (
        <p className="fv-fine">
          Declination {declinationText(guidance.declinationDeg)} ({guidance.magModel}, today, here).
          {guidance.arrowDeg === null ? ' No compass heading from this device: the arrow shows the bearing with north up.' : ' The arrow turns with the device.'}
          {guidance.magWarning ? ` ${guidance.magWarning}` : ''}
        </p>
      ) : null}
      {arrival ? (
        <p className={arrival.arrived ? 'fv-arrived' : 'fv-fine'} role={arrival.arrived ? 'status' : undefined}>
          {arrival.arrived ? `Arrived: within ${Math.round(arrival.radiusM)} m of ${plot.plot_id}.` : `Arrival within ${Math.round(arrival.radiusM)} m.`}
          {arrival.widened ? ` The radius was widened to the position's accuracy; find the centre by tape and compass.` : ''}
        </p>
      ) : null}
      {props.onRoute.length ? (
        <div className="fv-route-warn" role="alert">
          The straight line to {plot.plot_id} enters{' '}
          {props.onRoute.map((h, i) => (
            <span key={h.exclusion.id}>
              {i ? '; ' : ''}the {h.exclusion.bufferM} m buffer of {(EXCLUSION_KIND_LABELS[h.exclusion.kind] ?? h.exclusion.kind).toLowerCase()} “{h.exclusion.name?.trim() || h.exclusion.id}”
            </span>
          ))}
          . Do not follow the bearing through it: go around by a safe route.
        </div>
      ) : null}
      <p className="fv-coords">
        {decimalDegreesText(plot.lon, plot.lat)}
        <br />
        UTM {utmText(plot.utm_zone, plot.easting, plot.northing)}
        <br />
        MGRS {mgrsSpacedText(plot.mgrs)}
      </p>
    </section>
  );
}
