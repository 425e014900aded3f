import { RNG_VERSION_CURRENT } from '../../core/design/place/rng';
import { rngVersionOf, rngVersionText } from '../../core/design/place/rngStreams';
import { designSettingsSet } from '../../state/designActions';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, usePlanner } from '../usePlanner';

/** Which random generator turns the seed into plots; a plan saved with an earlier version keeps it, so its plots can be made again, until the planner moves it on. */
export function SeedGeneratorNote() {
  const version = usePlanner((s) => rngVersionOf(s.design));
  return (
    <p className="fine" data-fact="generator">
      {version === RNG_VERSION_CURRENT ? 'Made with ' : `This plan was saved when generator version ${version} was current and still uses `}
      {rngVersionText(version)}.{' '}
      {version !== RNG_VERSION_CURRENT ? (
        <button type="button" onClick={() => attempt(() => designSettingsSet(plannerStore, { rngVersion: RNG_VERSION_CURRENT }))}>
          Use version {RNG_VERSION_CURRENT} for the next design
        </button>
      ) : null}
    </p>
  );
}
