import { useEffect, useMemo, useState } from 'react';
import { autosaveFlushNow } from '../autosaveFlush';
import { plannerStore } from '../plannerStoreInstance';
import { designFrame } from '../../core/field/designFrame';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { fieldArrival } from '../../core/field/fieldArrival';
import { fieldGuidance } from '../../core/field/fieldGuidance';
import { fieldHazardIndex } from '../../core/field/fieldHazards';
import { fieldNextPlot, fieldPlotOrder } from '../../core/field/fieldPlotOrder';
import { plannerPlotsNamed } from '../../state/plotsNamed';
import { usePlanner } from '../usePlanner';
import { FieldGuide } from './FieldGuide';
import { FieldHazardAlert } from './FieldHazardAlert';
import { FieldPlotList } from './FieldPlotList';
import { FieldPlotRecord } from './FieldPlotRecord';
import { FieldSetupBox } from './FieldSetupBox';
import { FieldSketch } from './FieldSketch';
import { decimalDegreesText } from '../../io/common/coordinateText';
import { useFieldPosition } from './useFieldPosition';
import { useScreenAwake } from './useScreenAwake';
import './fieldView.css';

/**
 * The field view for phones and tablets (address #field): the live position, the next plot in
 * walking order with distance, bearings and an arrow, safety warnings inside exclusion buffers, and
 * the plot form. It works on the planner's one plan, so every visit, rejection and value is the
 * plan's and is kept on the device as entered.
 */
export function FieldView() {
  const site = usePlanner((s) => s.site);
  const result = usePlanner((s) => s.result);
  const named = usePlanner(plannerPlotsNamed);
  const field = usePlanner((s) => s.field);
  const notice = usePlanner((s) => s.notice);
  const position = useFieldPosition();
  useScreenAwake();
  const [chosen, setChosen] = useState<string | null>(null);
  // biome-ignore lint/correctness/useExhaustiveDependencies: a change of the plots or the setup is what must be written at once
  useEffect(() => {
    if (result) autosaveFlushNow();
  }, [result, field]);
  // A message is read and gone: after a few seconds it stops covering the bottom of the screen.
  useEffect(() => {
    if (!notice) return;
    const t = setTimeout(() => plannerStore.getState().notice === notice && plannerStore.setState({ notice: null }), 8000);
    return () => clearTimeout(t);
  }, [notice]);

  const plots = useMemo(() => named?.features.map((f) => f.properties) ?? [], [named]);
  // The order changes only when a plot joins or leaves the plots to visit, not on every visit.
  const activeKey = plots.map((p) => `${p.plot_id}:${p.status ?? ''}`).join('|');
  // biome-ignore lint/correctness/useExhaustiveDependencies: activeKey stands for the plots to visit
  const order = useMemo(() => fieldPlotOrder(plots, site.access), [activeKey, site.access]);
  const frame = useMemo(() => designFrame(result, site), [result, site]);
  const hazards = useMemo(() => (frame ? fieldHazardIndex(site.exclusions, frame) : null), [frame, site.exclusions]);

  const next = fieldNextPlot(order, plots);
  const target = plots.find((p) => p.plot_id === (chosen ?? next)) ?? plots.find((p) => p.plot_id === next) ?? null;
  const fix = position.fix;
  const now = new Date();
  const guidance = fix && target ? fieldGuidance(fix, target, now, position.headingMagDeg) : null;
  const arrival = guidance && fix ? fieldArrival(guidance.distanceM, field.arrivalRadiusM, fix.accuracyM) : null;
  const here = fix && hazards ? hazards.at(fix.lon, fix.lat) : [];
  const onRoute = fix && hazards && target ? hazards.along(fix, target) : [];

  return (
    <div className="field-view">
      <header className="fv-top">
        <span className="brand-mark" aria-hidden="true" />
        <div className="fv-top-text">
          <div className="fv-title">In the field</div>
          <div className="fv-fine">{site.name}</div>
        </div>
        <a className="fv-to-planner" href="#plan">
          Planner
        </a>
      </header>
      <main className="fv-main">
        <FieldHazardAlert hazards={here} />
        <section className="fv-card fv-position" aria-label="Your position">
          {fix ? (
            <>
              <span data-figure="position">{decimalDegreesText(fix.lon, fix.lat)}</span>{' '}
              <span className="fv-accuracy-text" data-figure="accuracy">
                ±{Math.round(fix.accuracyM)} m
              </span>
            </>
          ) : (
            <span>{position.status === 'waiting for a position' ? 'Waiting for a position…' : `No position: ${position.status}.`}</span>
          )}
        </section>
        {!result ? (
          <section className="fv-card">
            <h2>No plots on this device yet</h2>
            <p>Open the plan file or the plot file made for this survey below, or make a design in the planner.</p>
          </section>
        ) : null}
        {position.compassAsk ? (
          <button type="button" className="fv-big" onClick={position.compassAsk}>
            Turn the arrow with the compass
          </button>
        ) : null}
        {target ? <FieldGuide plot={target} isNext={target.plot_id === next} guidance={guidance} arrival={arrival} onRoute={onRoute} positionStatus={position.status} /> : null}
        {result && !target ? <section className="fv-card">Every plot to visit is done. Hand the work back below.</section> : null}
        {result && !site.exclusions.length ? <p className="fv-card fv-fine">This plan carries no exclusions, so no safety warnings can be given here: use the field sheets and the briefing.</p> : null}
        <FieldSketch fix={fix} target={target} plots={plots} exclusions={site.exclusions} distanceM={guidance?.distanceM ?? null} frame={frame} />
        {target ? <FieldPlotRecord plot={target} variables={field.variables} fix={fix} /> : null}
        {result ? <FieldPlotList plots={plots} order={order} targetId={target?.plot_id ?? null} onChoose={setChosen} /> : null}
        <FieldSetupBox open={!result || !field.crew} />
        <p className="fv-caution">{FIELD_CAUTION}</p>
      </main>
      <output className={notice?.tone === 'error' ? 'fv-notice fv-notice-error' : 'fv-notice'} aria-live="polite">
        {notice?.text ?? ''}
      </output>
    </div>
  );
}
