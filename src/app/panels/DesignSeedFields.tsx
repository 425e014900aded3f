import { designSeedFresh } from '../../state/designActions';
import { usePlanner } from '../usePlanner';
import { designSet } from './designSet';
import { NumberField } from './NumberField';
import { SeedGeneratorNote } from './SeedGeneratorNote';

/** The design sheet's seed: typed, or a fresh one drawn. */
export function DesignSeedFields() {
  const d = usePlanner((s) => s.design);
  const set = designSet;
  return (
    <fieldset>
      <legend>Seed</legend>
      <div className="field">
        <NumberField label="Seed" min={0} step={1} value={d.seed} onCommit={(v) => set({ seed: v ?? d.seed })} />
        <button type="button" onClick={() => set({ seed: designSeedFresh() })}>
          New seed
        </button>
      </div>
      <p className="fine">The same site, settings and seed always give the same plots.</p>
      <SeedGeneratorNote />
    </fieldset>
  );
}
