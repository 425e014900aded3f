import { FieldVariablesBox } from './FieldVariablesBox';
import { AllocationTable } from './AllocationTable';
import { DesignPlacementFields } from './DesignPlacementFields';
import { DesignRunRow } from './DesignRunRow';
import { DesignSeedFields } from './DesignSeedFields';
import { DesignSizeFields } from './DesignSizeFields';

/** Step 3: the design sheet — how many plots, how they are shared among strata and placed, and the seed. */
export function DesignPanel() {
  return (
    <section className="sheet" aria-labelledby="design-title">
      <h2 id="design-title">
        <span className="step-no">3</span> Design
      </h2>
      <p className="lead">Every setting is stored in the plan with the seed, so the same plots can be made again.</p>
      <DesignPlacementFields />
      <DesignSizeFields />
      <DesignSeedFields />
      <DesignRunRow />
      <AllocationTable />
      <FieldVariablesBox />
    </section>
  );
}
