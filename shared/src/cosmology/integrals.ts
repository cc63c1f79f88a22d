/**
 * Direct adaptive quadrature of the background integrals, in the variable x = ln(1+z).
 * These are the reference the tables are built from and checked against, and the fallback
 * beyond the tabulated range. All results are dimensionless: multiply by the Hubble
 * distance c/H0 or the Hubble time 1/H0.
 */

import type { Expansion } from './expansion.js';
import { integrateAdaptive } from './quadrature.js';

const REL_TOL = 1e-13;

/**
 * ∫ (1+z)/E dx from x1 to x2 = ∫ dz/E(z): the line-of-sight comoving distance in units of
 * the Hubble distance (Hogg 1999, eq. 15).
 */
export function comovingIntegral(expansion: Expansion, x1: number, x2: number): number {
  return integrateAdaptive((x) => {
    const zp1 = Math.exp(x);
    const ratio = zp1 / expansion.e(zp1);
    // Where 1+z or E overflows the integrand has long since fallen to nothing.
    return ratio === ratio ? ratio : 0;
  }, x1, x2, { relTol: REL_TOL });
}

/**
 * ∫ dx/E from x1 to x2 = ∫ dz/((1+z)E(z)): lookback time between two redshifts in units of
 * the Hubble time (Hogg 1999, eq. 30).
 */
export function lookbackIntegral(expansion: Expansion, x1: number, x2: number): number {
  return integrateAdaptive((x) => 1 / expansion.e(Math.exp(x)), x1, x2, { relTol: REL_TOL });
}

/**
 * Whether the age integral converges: E must grow at least as a positive power of (1+z)
 * as z → ∞ (a pure cosmological-constant universe, for one, has no beginning).
 */
export function hasFiniteAge(expansion: Expansion): boolean {
  const p = expansion.params;
  let leadingPower = 0;
  if (p.Omega_cb > 0 || p.Omega_nu > 0) leadingPower = Math.max(leadingPower, 1.5);
  if (p.Omega_gamma > 0) leadingPower = Math.max(leadingPower, 2);
  if (p.Omega_k > 0) leadingPower = Math.max(leadingPower, 1);
  if (p.Omega_Lambda > 0) leadingPower = Math.max(leadingPower, 1.5 * (1 + p.w0 + p.wa));
  return leadingPower > 0;
}

/**
 * Age of the universe at x = ln(1+z) in units of the Hubble time:
 * ∫_x^∞ dx'/E = ∫_0^{1/(1+z)} da/(a E)   (Hogg 1999, eq. 30 with the upper limit at infinity).
 * Integrated in s = √a, where the integrand 2/(s E) is smooth at the big bang whether
 * radiation or matter dominates there. Infinity when the model has no beginning.
 */
export function ageIntegral(expansion: Expansion, x: number): number {
  if (!hasFiniteAge(expansion)) return Infinity;
  const sMax = Math.exp(-0.5 * x);
  return integrateAdaptive((s) => {
    if (s === 0) return 0;
    const zp1 = 1 / (s * s);
    return 2 / (s * expansion.e(zp1));
  }, 0, sMax, { relTol: REL_TOL });
}
