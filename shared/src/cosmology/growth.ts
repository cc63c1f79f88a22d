/**
 * Linear growth of matter perturbations on sub-horizon scales, by solving the growth
 * equation for the declared model (not the Ωm(z)^0.55 approximation):
 *
 *   D'' + (2 + d ln H/d ln a) D' − (3/2) Ωm(a) D = 0,   ' = d/d ln a
 *
 * (Peebles 1980, §10; e.g. Linder 2005, eq. 1), with dark energy smooth and the clustering
 * matter made of cold dark matter, baryons and the non-relativistic excess of massive
 * neutrinos. It starts deep in the radiation era (z = 2×10⁴) on the growing mode of the
 * matter-plus-radiation universe, D ∝ 1 + 3a/(2a_eq) (Meszaros 1974), and is integrated with
 * fourth-order Runge–Kutta with GROWTH_STEPS uniform steps in ln a (step 0.0077; global
 * error below 1e-8), and interpolated with cubic Hermite polynomials. D is normalised to D(0) = 1; the growth rate is f = d ln D / d ln a.
 */

import type { Cosmology } from './cosmology.js';
import { TABLE_Z_MAX } from './backgroundTable.js';
import { checkRedshift, CosmologyRangeError } from './errors.js';

/** Number of Runge–Kutta steps from z = TABLE_Z_MAX to z = 0. */
export const GROWTH_STEPS = 1280;

interface GrowthTable {
  /** D at x_i = i·step, normalised to D(0) = 1. */
  readonly d: Float64Array;
  /** dD/d ln a at the nodes, same normalisation. */
  readonly dPrime: Float64Array;
  /** d²D/d(ln a)² at the nodes, same normalisation. */
  readonly dSecond: Float64Array;
  readonly step: number;
}

function buildGrowthTable(c: Cosmology): GrowthTable {
  const n = GROWTH_STEPS;
  const xMax = Math.log1p(TABLE_Z_MAX);
  const step = xMax / n;
  const e = c.expansion;

  // Right-hand side in s = ln a: y = [D, D'].
  const rhs = (s: number, d: number, dp: number): [number, number] => {
    const zp1 = Math.exp(-s);
    const e2 = e.e2(zp1);
    const dlnHds = (-0.5 * e.de2dx(zp1)) / e2;
    const omegaM = e.matterDensity(zp1) / e2;
    return [dp, -(2 + dlnHds) * dp + 1.5 * omegaM * d];
  };

  const d = new Float64Array(n + 1);
  const dPrime = new Float64Array(n + 1);
  const dSecond = new Float64Array(n + 1);
  const zp1Start = Math.exp(xMax);
  const aStart = 1 / zp1Start;
  const matter = e.matterDensity(zp1Start) * aStart ** 3;
  const radiation = e.radiationDensity(zp1Start) * aStart ** 4;
  const aEq = matter > 0 ? radiation / matter : 0;
  // Growing mode of matter + radiation (Meszaros 1974): D = a_eq + 3a/2, dD/d ln a = 3a/2.
  let y0 = aEq + 1.5 * aStart;
  let y1 = 1.5 * aStart;
  d[n] = y0;
  dPrime[n] = y1;
  dSecond[n] = rhs(-xMax, y0, y1)[1];
  for (let i = n; i > 0; i--) {
    const s = -i * step;
    const k1 = rhs(s, y0, y1);
    const k2 = rhs(s + step / 2, y0 + (step / 2) * k1[0], y1 + (step / 2) * k1[1]);
    const k3 = rhs(s + step / 2, y0 + (step / 2) * k2[0], y1 + (step / 2) * k2[1]);
    const k4 = rhs(s + step, y0 + step * k3[0], y1 + step * k3[1]);
    y0 += (step / 6) * (k1[0] + 2 * k2[0] + 2 * k3[0] + k4[0]);
    y1 += (step / 6) * (k1[1] + 2 * k2[1] + 2 * k3[1] + k4[1]);
    d[i - 1] = y0;
    dPrime[i - 1] = y1;
    dSecond[i - 1] = rhs(s + step, y0, y1)[1];
  }
  const norm = d[0];
  for (let i = 0; i <= n; i++) {
    d[i] /= norm;
    dPrime[i] /= norm;
    dSecond[i] /= norm;
  }
  return { d, dPrime, dSecond, step };
}

function checkGrowthRange(z: number): void {
  if (z > TABLE_Z_MAX) throw new CosmologyRangeError(`the growth factor is tabulated up to z = ${TABLE_Z_MAX}, not z = ${z}`);
}

function growthTable(c: Cosmology): GrowthTable {
  return c.memo('growth', () => buildGrowthTable(c));
}

/** Hermite interpolation in x = ln(1+z) = −ln a of a tabulated y with d y/d ln a = slope. */
function interpolate(t: GrowthTable, y: Float64Array, slope: Float64Array, x: number): number {
  const u = x / t.step;
  let i = Math.floor(u);
  if (i >= GROWTH_STEPS) i = GROWTH_STEPS - 1;
  const f = u - i;
  const f2 = f * f;
  const f3 = f2 * f;
  const h = -t.step; // dy/dx = −dy/d ln a
  return (2 * f3 - 3 * f2 + 1) * y[i] + (f3 - 2 * f2 + f) * h * slope[i] + (-2 * f3 + 3 * f2) * y[i + 1] + (f3 - f2) * h * slope[i + 1];
}

/** Linear growth factor D(z), normalised to D(0) = 1 (growth ODE, see above). Defined for z ≤ 2×10⁴. */
export function growthFactor(c: Cosmology, z: number): number {
  checkRedshift(z);
  checkGrowthRange(z);
  const t = growthTable(c);
  return interpolate(t, t.d, t.dPrime, Math.log1p(z));
}

/** Linear growth rate f(z) = d ln D / d ln a (growth ODE, see above). Defined for z ≤ 2×10⁴. */
export function growthRate(c: Cosmology, z: number): number {
  checkRedshift(z);
  checkGrowthRange(z);
  const t = growthTable(c);
  const x = Math.log1p(z);
  return interpolate(t, t.dPrime, t.dSecond, x) / interpolate(t, t.d, t.dPrime, x);
}

/** Linder 2005 approximation f ≈ Ωm(z)^γ with γ = 0.55 (for comparison, not the method). */
export function growthRateApproximation(c: Cosmology, z: number): number {
  const zp1 = 1 + z;
  return Math.pow(c.expansion.matterDensity(zp1) / c.expansion.e2(zp1), 0.55);
}
