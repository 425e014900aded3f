import type { Problem } from '../../core/model/types';

const SHOWN = 60;

/** The problems the checks found in the results file, errors first, each with its row and column. */
export function ResultsProblems({ problems }: { problems: readonly Problem[] }) {
  if (!problems.length) return <p className="fine results-clean">No problems found in the results file.</p>;
  const sorted = [...problems].sort((a, b) => (a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1));
  const errors = problems.filter((p) => p.severity === 'error').length;
  return (
    <>
      <p className={errors ? 'problem' : 'fine'}>
        {errors} error{errors === 1 ? '' : 's'}, {problems.length - errors} warning{problems.length - errors === 1 ? '' : 's'}.{errors ? ' Fix the errors in the file and load it again: no estimate is made while any remain.' : ''}
      </p>
      <table className="ledger compact results-problems" aria-label="Problems in the results file">
        <thead>
          <tr>
            <th scope="col">Kind</th>
            <th scope="col" className="num">Row</th>
            <th scope="col">Column</th>
            <th scope="col">What is wrong</th>
          </tr>
        </thead>
        <tbody>
          {sorted.slice(0, SHOWN).map((p) => (
            <tr key={`${p.code}|${p.where.row ?? ""}|${p.message}`} data-severity={p.severity}>
              <td className={p.severity === 'error' ? 'problem' : undefined}>{p.severity === 'error' ? '✕ error' : '! warning'}</td>
              <td className="num">{p.where.row ?? '–'}</td>
              <td>{p.where.column ?? '–'}</td>
              <td>{p.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {sorted.length > SHOWN ? <p className="fine">…and {sorted.length - SHOWN} more.</p> : null}
    </>
  );
}
