export { EXCLUSION_COLOURS } from '../../core/site/exclusionColours';

/** Ink of plots and access points (the primary plot colour of the shared symbol code). */
export { PLOT_INK as INK } from '../../core/field/plotSymbols';
