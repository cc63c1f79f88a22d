/** Re-exports for the growth tests (the adaptive integrator is internal to the engine). */
export { growthFactor, growthRate, growthRateApproximation } from '../../shared/src/index.js';
export { integrateAdaptive as integrateAdaptiveForTest } from '../../shared/src/cosmology/quadrature.js';
