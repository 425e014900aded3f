/**
 * The kinds of measurement a crew types into a plot form: a plain number, a percentage 0–100
 * (cover), a whole count, a presence/absence answer, or free text. Each but text maps to the
 * results kind whose range checks it shares (see fieldVariableResultKind).
 */
export const FIELD_VARIABLE_KINDS = ['number', 'percent', 'count', 'presence', 'text'] as const;
export type FieldVariableKind = (typeof FIELD_VARIABLE_KINDS)[number];

/** One measurement the plan asks for at every plot: its column name in the results CSV and its kind. */
export interface FieldVariable {
  name: string;
  kind: FieldVariableKind;
}

/** How the plan is walked: who the crew is, what is measured at each plot, and the arrival radius. */
export interface FieldSetup {
  /** The crew's name as recorded with every visit (blank until the crew gives it). */
  crew: string;
  variables: FieldVariable[];
  /** A plot counts as reached within this many metres (widened to the position's accuracy). */
  arrivalRadiusM: number;
}

/** Default arrival radius, metres: about the accuracy of a phone's GPS in the open (common practice, no source). */
export const FIELD_ARRIVAL_RADIUS_DEFAULT_M = 5;

/** A plan with nothing set up for the field yet. */
export const FIELD_SETUP_EMPTY: Readonly<FieldSetup> = { crew: '', variables: [], arrivalRadiusM: FIELD_ARRIVAL_RADIUS_DEFAULT_M };

/**
 * A position as a device reports it: WGS84 degrees, the horizontal accuracy radius in metres (95 %
 * confidence, W3C Geolocation API, "accuracy" attribute), and when.
 */
export interface PositionFix {
  lon: number;
  lat: number;
  accuracyM: number;
  atIso: string;
}
