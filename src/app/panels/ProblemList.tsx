import { stratumNamesInText } from '../../core/field/stratumNamesInText';
import type { Problem } from '../../core/model/types';
import { plannerStore } from '../plannerStoreInstance';
import { usePlanner } from '../usePlanner';

/** Problems the checks found in the mapped strata; each names the feature and zooms there when clicked. */
const NONE: Problem[] = [];

export function ProblemList() {
  const problems = usePlanner((s) => s.analysis?.problems ?? NONE);
  const parts = usePlanner((s) => s.site.parts);
  const strata = usePlanner((s) => s.site.strata);
  if (problems.length === 0) return <p className="fine">Checks: no problems found in the mapped strata.</p>;
  return (
    <div className="problems">
      <h3>Checks found {problems.length} problem{problems.length === 1 ? '' : 's'}</h3>
      <ul className="plain-list">
        {problems.slice(0, 50).map((p, i) => {
          const at = p.where.lonLat;
          const part = parts[p.where.featureIndex];
          return (
            // biome-ignore lint/suspicious/noArrayIndexKey: problems have no id of their own and the list is rebuilt whole.
            <li key={i} className={p.severity === 'error' ? 'problem' : 'caution-text'}>
              <span className="sev">{p.severity === 'error' ? 'Error' : 'Warning'}:</span> {stratumNamesInText(p.message, strata)}
              {at ? (
                <button
                  type="button"
                  aria-label={`Show problem ${i + 1} on the map`}
                  onClick={() => {
                    const d = 0.0008;
                    plannerStore.setState({ focus: { bbox: [at[0] - d, at[1] - d, at[0] + d, at[1] + d], at: Date.now() }, selection: part ? { kind: 'part', id: part.id } : null });
                  }}
                >
                  Show
                </button>
              ) : null}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
