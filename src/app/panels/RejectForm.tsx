import { useId, useState } from 'react';
import { plotReject } from '../../state/plotReject';
import { plannerStore } from '../plannerStoreInstance';
import { attempt } from '../usePlanner';

const REASONS = ['Unsafe to reach', 'Under water', 'Entry refused by the landholder', 'Not the mapped habitat', 'Destroyed or disturbed'];

/** Asks why a plot cannot be sampled, then rejects it; the next reserve of its stratum takes its place. */
export function RejectForm({ plotId, onDone }: { plotId: string; onDone: () => void }) {
  const id = useId();
  const [reason, setReason] = useState(REASONS[0]);
  const [other, setOther] = useState('');
  const text = reason === 'other' ? other : reason;
  return (
    <form
      className="reject-form"
      aria-label={`Reject plot ${plotId}`}
      onSubmit={(e) => {
        e.preventDefault();
        if (attempt(() => plotReject(plannerStore, plotId, text)) !== undefined) onDone();
      }}
    >
      <label htmlFor={id}>Why can {plotId} not be sampled?</label>
      <select id={id} value={reason} onChange={(e) => setReason(e.currentTarget.value)}>
        {REASONS.map((r) => (
          <option key={r} value={r}>
            {r}
          </option>
        ))}
        <option value="other">Other…</option>
      </select>
      {reason === 'other' ? <input aria-label="Reason in your words" value={other} onChange={(e) => setOther(e.currentTarget.value)} /> : null}
      <button type="submit" className="warn">
        Reject and promote reserve
      </button>
      <button type="button" onClick={onDone}>
        Keep it
      </button>
    </form>
  );
}
