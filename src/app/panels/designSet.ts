import type { DesignSettings } from '../../core/model/designTypes';
import { designSettingsSet } from '../../state/designActions';
import { plannerStore } from '../plannerStoreInstance';
import { attempt } from '../usePlanner';

/** Changes design settings from a form; a refused value is shown in the status line, not thrown. */
export function designSet(patch: Partial<DesignSettings>): void {
  attempt(() => designSettingsSet(plannerStore, patch));
}
