/** The cosmology engine: parameters, background quantities, inverses, epochs, growth, units. */
export * from './constants.js';
export * from './parameters.js';
export * from './parameterText.js';
export * from './presets.js';
export * from './cosmology.js';
export * from './expansion.js';
export * from './distances.js';
export * from './times.js';
export * from './inverse.js';
export * from './epochs.js';
export * from './growth.js';
export * from './quantities.js';
export * from './units.js';
export * from './errors.js';
export { TABLE_Z_MAX, TABLE_PANELS } from './backgroundTable.js';
export { comovingIntegral, lookbackIntegral, ageIntegral } from './integrals.js';
