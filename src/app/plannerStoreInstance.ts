import { designSettingsDefault } from '../core/design/designSettingsDefault';
import { plannerStoreCreate } from '../state/plannerStore';

/** The one planner store of the page. */
export const plannerStore = plannerStoreCreate(designSettingsDefault());
