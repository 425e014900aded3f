import { designJobCancel, designJobStart } from '../designJob';
import { usePlanner } from '../usePlanner';

/** Make the design, or its progress and a Cancel while the worker runs it. */
export function DesignRunRow() {
  const job = usePlanner((s) => s.job);
  return (
    <div className="run-row">
      {job ? (
        <>
          <progress max={1} value={job.fraction} aria-label="Design progress" />
          <span className="fine">
            {Math.round(job.fraction * 100)} % · {job.stage}
          </span>
          <button type="button" className="warn" onClick={designJobCancel}>
            Cancel
          </button>
        </>
      ) : (
        <button type="button" className="primary" onClick={() => void designJobStart()}>
          Make the design
        </button>
      )}
    </div>
  );
}
