import type { FieldHazard } from '../../core/field/fieldHazards';
import { EXCLUSION_KIND_LABELS, EXCLUSION_KIND_NOTES } from '../../core/site/exclusionKindNotes';

/**
 * The warning shown while the live position lies within an exclusion's buffer: its kind, name,
 * notes and buffer, with the standing reminder of who decides what is safe.
 */
export function FieldHazardAlert({ hazards }: { hazards: FieldHazard[] }) {
  if (!hazards.length) return null;
  return (
    <section className="fv-hazard" role="alert" aria-label="Safety warning">
      <div className="fv-hazard-head">Stop: you are within a safety buffer</div>
      <ul>
        {hazards.map((h) => (
          <li key={h.exclusion.id} data-exclusion={h.exclusion.id}>
            <strong>
              {EXCLUSION_KIND_LABELS[h.exclusion.kind] ?? h.exclusion.kind} “{h.exclusion.name?.trim() || h.exclusion.id}”
            </strong>{' '}
            — {h.distanceM > 0 ? `${Math.round(h.distanceM)} m away, inside its ${h.exclusion.bufferM} m buffer` : h.exclusion.bufferM > 0 ? `you are on it (buffer ${h.exclusion.bufferM} m)` : 'you are on it'}.
            {h.exclusion.notes ? ` ${h.exclusion.notes}` : ''} {EXCLUSION_KIND_NOTES[h.exclusion.kind] ?? EXCLUSION_KIND_NOTES.other}
          </li>
        ))}
      </ul>
      <p>Move back out the way you came. Local rules, the landholder and your employer's safety plan govern; if the ground is unsafe, reject the plot with a reason.</p>
    </section>
  );
}
