/**
 * The safety caution every exported file carries (our wording, plain ASCII so GPS units and phone
 * apps show it whole): in GPX and KML metadata, a column of the CSV plot table, a text file in each
 * shapefile zip, the GeoPackage's contents description, the field sheets and the design report.
 * Common practice, no source.
 */
export const FIELD_CAUTION =
  "Caution: plot positions and notes are a planning aid, not a safety assessment. Local regulations, " +
  "the landholder's permission and your employer's safety plan govern the work. Never enter ground that " +
  'is unsafe on the day: record the plot as rejected and use the next reserve of its stratum in rank order.';

/** The caution in one line, for the footer of every field-sheet page (a torn-off sheet goes out alone). */
export const FIELD_CAUTION_LINE =
  "Planning aid only: local regulations, landholder permission and your employer's safety plan govern. Never enter ground that is unsafe on the day.";
