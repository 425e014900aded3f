import { useEffect, useId, useState } from 'react';
import { fieldValueCheck } from '../../core/results/fieldValueCheck';
import { plotIsActive } from '../../core/field/plotFieldState';
import type { PlotProperties } from '../../core/model/designTypes';
import type { FieldVariable, PositionFix } from '../../core/model/fieldTypes';
import { fieldEntrySave, fieldVisit, fieldVisitClear } from '../../state/fieldActions';
import { plotRestore } from '../../state/plotRestore';
import { RejectForm } from '../panels/RejectForm';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, notify } from '../usePlanner';
import { type FieldDraft, fieldDraftClear, fieldDraftRead, fieldDraftWrite } from './fieldDraft';
import { fieldWhenText } from './fieldText';

const INPUT_MODE: Record<FieldVariable['kind'], 'decimal' | 'numeric' | 'text'> = { number: 'decimal', percent: 'decimal', count: 'numeric', presence: 'text', text: 'text' };
const KIND_HINT: Record<FieldVariable['kind'], string> = { number: 'number', percent: '% 0–100', count: 'whole count', presence: 'present or absent', text: 'text' };

function kept(plot: PlotProperties): FieldDraft {
  return { values: { ...(plot.field_values ?? {}) }, note: plot.crew_note ?? '' };
}

/** One variable's input: a large field with its kind, or yes/no buttons for presence. */
function VariableInput(props: { variable: FieldVariable; value: string; onChange: (v: string) => void; onDone: () => void; problem: string | null }) {
  const id = useId();
  const { variable: v } = props;
  return (
    <div className="fv-input">
      <label htmlFor={id}>
        {v.name} <span className="fv-fine">({KIND_HINT[v.kind]})</span>
      </label>
      {v.kind === 'presence' ? (
        <select id={id} value={props.value} onChange={(e) => props.onChange(e.currentTarget.value)} onBlur={props.onDone}>
          <option value="">not recorded</option>
          <option value="present">present</option>
          <option value="absent">absent</option>
        </select>
      ) : (
        <input
          id={id}
          inputMode={INPUT_MODE[v.kind]}
          autoComplete="off"
          value={props.value}
          aria-invalid={props.problem ? true : undefined}
          onChange={(e) => props.onChange(e.currentTarget.value)}
          onBlur={props.onDone}
        />
      )}
      {props.problem ? (
        <span className="fv-problem" role="alert">
          {props.problem}
        </span>
      ) : null}
    </div>
  );
}

/**
 * What the crew does at the plot: record the visit (time, position, accuracy, crew), or reject the
 * plot with a reason (the next reserve is promoted), and type its measurements and a note. Every
 * keystroke is kept as a draft on the device; leaving a field or pressing Keep puts it on the plot.
 */
export function FieldPlotRecord(props: { plot: PlotProperties; variables: FieldVariable[]; fix: PositionFix | null }) {
  const { plot } = props;
  const noteId = useId();
  const [draft, setDraft] = useState<FieldDraft>(() => fieldDraftRead(plot) ?? kept(plot));
  const [rejecting, setRejecting] = useState(false);
  const [draftLost, setDraftLost] = useState(false);
  // Another plot chosen: show its draft, or what is kept on it.
  // biome-ignore lint/correctness/useExhaustiveDependencies: only a change of plot reloads the form
  useEffect(() => {
    setDraft(fieldDraftRead(plot) ?? kept(plot));
    setRejecting(false);
  }, [plot.plot_id, plot.lon, plot.lat]);

  const change = (next: FieldDraft) => {
    setDraft(next);
    setDraftLost(!fieldDraftWrite(plot, next));
  };
  const keep = () => {
    try {
      fieldEntrySave(plannerStore, plot.plot_id, draft.values, draft.note);
      fieldDraftClear(plot);
    } catch (e) {
      // The draft stays on the device; the message says what to shorten.
      notify('error', (e as Error).message);
    }
  };
  const active = plotIsActive(plot);
  const unsavedDraft = JSON.stringify(draft) !== JSON.stringify(kept(plot));

  return (
    <section className="fv-card fv-record" aria-label={`Record plot ${plot.plot_id}`}>
      <h2>Record {plot.plot_id}</h2>
      {plot.status === 'rejected' ? (
        <div className="fv-state fv-state-rejected">
          Rejected: {plot.reject_reason ?? 'no reason recorded'}. Do not visit.
          <button type="button" className="fv-big" onClick={() => attempt(() => plotRestore(plannerStore, plot.plot_id))}>
            Restore {plot.plot_id}
          </button>
        </div>
      ) : !active ? (
        <p className="fv-state">Reserve, waiting: it is visited only once it replaces a rejected plot of its stratum, in rank order.</p>
      ) : (
        <>
          <p className="fv-state" data-visited={plot.visited_at ? 'yes' : 'no'}>
            {plot.visited_at
              ? `Visited ${fieldWhenText(plot.visited_at)}${plot.visited_by ? ` by ${plot.visited_by}` : ''}${plot.visit_accuracy_m !== undefined ? `, position ±${Math.round(plot.visit_accuracy_m)} m` : ', no position'}.`
              : 'Not visited yet.'}
          </p>
          <div className="fv-actions">
            {plot.visited_at ? (
              <button type="button" className="fv-big" onClick={() => attempt(() => fieldVisitClear(plannerStore, plot.plot_id))}>
                Take back the visit
              </button>
            ) : (
              <button type="button" className="fv-big fv-primary" onClick={() => attempt(() => fieldVisit(plannerStore, plot.plot_id, props.fix))}>
                Mark {plot.plot_id} visited
              </button>
            )}
            {rejecting ? null : (
              <button type="button" className="fv-big warn" onClick={() => setRejecting(true)}>
                Cannot sample it…
              </button>
            )}
          </div>
          {rejecting ? <RejectForm plotId={plot.plot_id} onDone={() => setRejecting(false)} /> : null}
        </>
      )}
      {active ? (
        <div className="fv-entry">
          {props.variables.length === 0 ? <p className="fv-fine">The plan names no measurements yet: add them under “Crew, files and measurements”.</p> : null}
          {props.variables.map((v) => {
            const value = draft.values[v.name] ?? '';
            return (
              <VariableInput
                key={v.name}
                variable={v}
                value={value}
                problem={fieldValueCheck(v, value)}
                onChange={(text) => change({ ...draft, values: { ...draft.values, [v.name]: text } })}
                onDone={keep}
              />
            );
          })}
          <div className="fv-input">
            <label htmlFor={noteId}>Note</label>
            <textarea id={noteId} rows={3} value={draft.note} onChange={(e) => change({ ...draft, note: e.currentTarget.value })} onBlur={keep} />
          </div>
          <div className="fv-actions">
            <button type="button" className="fv-big" onClick={keep}>
              Keep entries
            </button>
            <span className="fv-fine" aria-live="polite">
              {draftLost ? 'This browser refused to keep a draft: press Keep entries often.' : unsavedDraft ? 'Draft kept on this device.' : 'Entries kept with the plan.'}
            </span>
          </div>
        </div>
      ) : null}
    </section>
  );
}
