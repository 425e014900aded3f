import { usePlanner } from '../usePlanner';
import { designSet } from './designSet';

/** Pilot standard deviation and cost per stratum, for Neyman allocation, a target precision or a budget. */
export function DesignStratumInputs() {
  const d = usePlanner((s) => s.design);
  const strata = usePlanner((s) => s.site.strata);
  const set = designSet;
  return (
    <table className="ledger compact" aria-label="Pilot standard deviation and cost by stratum">
      <thead>
        <tr>
          <th scope="col">Stratum</th>
          <th scope="col" className="num">Pilot SD</th>
          <th scope="col" className="num">{d.budget ? 'Cost per plot' : 'Relative cost'}</th>
        </tr>
      </thead>
      <tbody>
        {strata.map((s) => (
          <tr key={s.key}>
            <td>{s.label}</td>
            <td className="num">
              <input type="number" className="num-input" min={0} step="any" aria-label={`Pilot SD of ${s.label}`} defaultValue={d.sd[s.key] ?? ''} key={`sd-${d.sd[s.key]}`} onBlur={(e) => e.currentTarget.value !== '' && set({ sd: { ...d.sd, [s.key]: Number(e.currentTarget.value) } })} />
            </td>
            <td className="num">
              <input type="number" className="num-input" min={0} step="any" aria-label={`Relative cost of ${s.label}`} defaultValue={d.cost[s.key] ?? 1} key={`c-${d.cost[s.key]}`} onBlur={(e) => set({ cost: { ...d.cost, [s.key]: Number(e.currentTarget.value || 1) } })} />
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
