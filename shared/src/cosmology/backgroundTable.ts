/**
 * Tabulate-then-interpolate for the background integrals of one parameter set.
 *
 * On a uniform grid in x = ln(1+z) from 0 to ln(1 + TABLE_Z_MAX), each panel is integrated
 * with an 8-point Gauss–Legendre rule (exact to double precision for panels this narrow),
 * and the cumulative values are interpolated with quintic Hermite polynomials that use the
 * exact first and second derivatives at the nodes ((1+z)/E and 1/E, and their derivatives
 * through dE²/dx). The interpolation error of a quintic Hermite panel scales as h⁶ max|f⁽⁶⁾|
 * / 46 080; with h ≈ 0.025 it stays near 1e-12 relative (measured in
 * test/engine/backgroundTable.test.ts against direct adaptive quadrature), and because the
 * error vanishes to third order at the nodes it stays small relative to tiny values near z = 0.
 * Beyond the table the direct integrals of integrals.ts take over.
 */

import type { Expansion } from './expansion.js';
import { ageIntegral, comovingIntegral, hasFiniteAge, lookbackIntegral } from './integrals.js';
import { GAUSS_LEGENDRE_8 } from './quadrature.js';

/** Highest redshift covered by the table; beyond it, direct quadrature. */
export const TABLE_Z_MAX = 2e4;
/** Number of panels of the uniform grid in ln(1+z). */
export const TABLE_PANELS = 400;

/** A tabulated function: values with first and second derivatives with respect to x at the nodes. */
interface Tabulated {
  readonly y: Float64Array;
  readonly d1: Float64Array;
  readonly d2: Float64Array;
}

function tabulated(n: number): Tabulated {
  return { y: new Float64Array(n + 1), d1: new Float64Array(n + 1), d2: new Float64Array(n + 1) };
}

/** Dimensionless cumulative integrals of one parameter set, with fast evaluation and inversion. */
export class BackgroundTable {
  readonly expansion: Expansion;
  /** Upper end of the grid in x = ln(1+z). */
  readonly xMax: number;
  private readonly step: number;
  private readonly invStep: number;
  /** C(x) = ∫_0^x (1+z)/E dx' (comoving distance / D_H). */
  private readonly comoving: Tabulated;
  /** L(x) = ∫_0^x dx'/E (lookback time / t_H). */
  private readonly lookback: Tabulated;
  /** A(x) = ∫_x^∞ dx'/E (age / t_H), summed from the top so that no precision is lost at high z. */
  private readonly age: Tabulated;
  /** Age today in units of the Hubble time (Infinity for a model without a beginning). */
  readonly ageToday: number;
  readonly finiteAge: boolean;

  constructor(expansion: Expansion) {
    this.expansion = expansion;
    const n = TABLE_PANELS;
    this.xMax = Math.log1p(TABLE_Z_MAX);
    this.step = this.xMax / n;
    this.invStep = 1 / this.step;
    const comoving = (this.comoving = tabulated(n));
    const lookback = (this.lookback = tabulated(n));
    const age = (this.age = tabulated(n));
    const panelTime = new Float64Array(n);

    const { nodes, weights } = GAUSS_LEGENDRE_8;
    const half = 0.5 * this.step;
    for (let i = 0; i <= n; i++) {
      const zp1 = Math.exp(i * this.step);
      const e2 = expansion.e2(zp1);
      if (!(e2 > 0 && Number.isFinite(e2))) throw new RangeError(`E²(z) is not positive and finite at z = ${zp1 - 1}`);
      const invE = 1 / Math.sqrt(e2);
      // d ln E / dx = (1/2) dE²/dx / E².
      const dlnE = (0.5 * expansion.de2dx(zp1)) / e2;
      lookback.d1[i] = invE;
      lookback.d2[i] = -invE * dlnE;
      age.d1[i] = -invE;
      age.d2[i] = invE * dlnE;
      comoving.d1[i] = zp1 * invE;
      comoving.d2[i] = zp1 * invE * (1 - dlnE);
      if (i === n) break;
      const mid = (i + 0.5) * this.step;
      let sumC = 0;
      let sumT = 0;
      for (let k = 0; k < nodes.length; k++) {
        const zp1k = Math.exp(mid + half * nodes[k]);
        const w = weights[k] / expansion.e(zp1k);
        sumT += w;
        sumC += w * zp1k;
      }
      panelTime[i] = sumT * half;
      lookback.y[i + 1] = lookback.y[i] + panelTime[i];
      comoving.y[i + 1] = comoving.y[i] + sumC * half;
    }

    this.finiteAge = hasFiniteAge(expansion);
    age.y[n] = this.finiteAge ? ageIntegral(expansion, this.xMax) : Infinity;
    for (let i = n - 1; i >= 0; i--) age.y[i] = age.y[i + 1] + panelTime[i];
    this.ageToday = age.y[0];
  }

  /**
   * Quintic Hermite interpolation on panel i at fraction t ∈ [0, 1], from the values and
   * first and second derivatives at both ends (e.g. Burden & Faires, Numerical Analysis, §3.4).
   */
  private hermite(f: Tabulated, i: number, t: number): number {
    const h = this.step;
    const t2 = t * t;
    const t3 = t2 * t;
    const t4 = t3 * t;
    const t5 = t4 * t;
    const h0 = 1 - 10 * t3 + 15 * t4 - 6 * t5;
    const h1 = t - 6 * t3 + 8 * t4 - 3 * t5;
    const h2 = 0.5 * (t2 - 3 * t3 + 3 * t4 - t5);
    const h3 = 10 * t3 - 15 * t4 + 6 * t5;
    const h4 = -4 * t3 + 7 * t4 - 3 * t5;
    const h5 = 0.5 * (t3 - 2 * t4 + t5);
    return f.y[i] * h0 + h * f.d1[i] * h1 + h * h * f.d2[i] * h2 + f.y[i + 1] * h3 + h * f.d1[i + 1] * h4 + h * h * f.d2[i + 1] * h5;
  }

  /** Derivative with respect to t of the quintic Hermite interpolant on panel i. */
  private hermiteSlope(f: Tabulated, i: number, t: number): number {
    const h = this.step;
    const t2 = t * t;
    const t3 = t2 * t;
    const t4 = t3 * t;
    const h0 = -30 * t2 + 60 * t3 - 30 * t4;
    const h1 = 1 - 18 * t2 + 32 * t3 - 15 * t4;
    const h2 = 0.5 * (2 * t - 9 * t2 + 12 * t3 - 5 * t4);
    const h3 = 30 * t2 - 60 * t3 + 30 * t4;
    const h4 = -12 * t2 + 28 * t3 - 15 * t4;
    const h5 = 0.5 * (3 * t2 - 8 * t3 + 5 * t4);
    return f.y[i] * h0 + h * f.d1[i] * h1 + h * h * f.d2[i] * h2 + f.y[i + 1] * h3 + h * f.d1[i + 1] * h4 + h * h * f.d2[i + 1] * h5;
  }

  /** Panel index and fraction for x within the table. */
  private locate(x: number): [number, number] {
    const u = x * this.invStep;
    let i = Math.floor(u);
    if (i >= TABLE_PANELS) i = TABLE_PANELS - 1;
    return [i, u - i];
  }

  /** Line-of-sight comoving distance to x = ln(1+z), in units of c/H0 (Hogg 1999, eq. 15). */
  comovingAt(x: number): number {
    if (x > this.xMax) return this.comoving.y[TABLE_PANELS] + comovingIntegral(this.expansion, this.xMax, x);
    const [i, t] = this.locate(x);
    return this.hermite(this.comoving, i, t);
  }

  /** Lookback time to x = ln(1+z), in units of 1/H0 (Hogg 1999, eq. 30). */
  lookbackAt(x: number): number {
    if (x > this.xMax) {
      return this.finiteAge ? this.ageToday - ageIntegral(this.expansion, x) : this.lookback.y[TABLE_PANELS] + lookbackIntegral(this.expansion, this.xMax, x);
    }
    const [i, t] = this.locate(x);
    return this.hermite(this.lookback, i, t);
  }

  /** Age at x = ln(1+z), in units of 1/H0 (Hogg 1999, eq. 30 to infinity). */
  ageAt(x: number): number {
    if (!this.finiteAge) return Infinity;
    if (x > this.xMax) return ageIntegral(this.expansion, x);
    const [i, t] = this.locate(x);
    return this.hermite(this.age, i, t);
  }

  /** Tabulated comoving distance at the top of the table (units of c/H0). */
  get comovingAtTableEnd(): number {
    return this.comoving.y[TABLE_PANELS];
  }

  /**
   * x = ln(1+z) at which the comoving distance (units of c/H0) reaches `target`, within the
   * table; null when it lies beyond the table.
   */
  xForComoving(target: number): number | null {
    return this.invert(this.comoving, 1, target);
  }

  /** x at which the lookback time (units of 1/H0) reaches `target`; null beyond the table. */
  xForLookback(target: number): number | null {
    return this.invert(this.lookback, 1, target);
  }

  /** x at which the age (units of 1/H0) equals `target`; null beyond the table. */
  xForAge(target: number): number | null {
    return this.invert(this.age, -1, target);
  }

  /**
   * Solves interpolant(x) = target on a monotonic table (sign +1 increasing, −1 decreasing):
   * binary search for the panel, then Newton on its Hermite polynomial, kept inside a
   * shrinking bracket (bisection when a Newton step would leave it).
   */
  private invert(f: Tabulated, sign: number, target: number): number | null {
    const n = TABLE_PANELS;
    const values = f.y;
    if (sign > 0 ? !(target >= values[0] && target <= values[n]) : !(target <= values[0] && target >= values[n])) return null;
    let lo = 0;
    let hi = n;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (sign > 0 ? values[mid] <= target : values[mid] >= target) lo = mid;
      else hi = mid;
    }
    const i = lo;
    const y0 = values[i];
    const y1 = values[i + 1];
    if (y1 === y0) return i * this.step;
    let tLo = 0;
    let tHi = 1;
    let t = (target - y0) / (y1 - y0);
    for (let iter = 0; iter < 40; iter++) {
      const r = this.hermite(f, i, t) - target;
      if (r === 0) break;
      if ((r < 0) === (sign > 0)) tLo = t;
      else tHi = t;
      let next = t - r / this.hermiteSlope(f, i, t);
      if (!(next > tLo && next < tHi)) next = 0.5 * (tLo + tHi);
      const done = Math.abs(next - t) < 4e-16;
      t = next;
      if (done) break;
    }
    return (i + t) * this.step;
  }
}
