import { designSettingsDefault } from '../core/designSettingsDefault';
import { plannerStoreCreate } from '../state/plannerStore';

/** The one planner store of the page. */
export const plannerStore = plannerStoreCreate(designSettingsDefault());
