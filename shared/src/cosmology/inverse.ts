/**
 * Inverse problems: the redshift at which a quantity reaches a given value. Lookback time,
 * age and line-of-sight comoving distance invert the tables directly (binary search and
 * Newton on the Hermite panel); the others reduce to those or use Brent's method on a
 * monotonic branch. Out-of-range targets raise a CosmologyRangeError that says the range.
 */

import type { Cosmology } from './cosmology.js';
import { angularDiameterDistance, luminosityDistance } from './distances.js';
import { CosmologyRangeError } from './errors.js';
import { ageIntegral, comovingIntegral } from './integrals.js';
import { brentRoot, goldenMaximum } from './rootFinding.js';
import { ageToday } from './times.js';

/** Highest redshift the inverses search (well past recombination). */
export const INVERSE_Z_MAX = 1e8;
const X_SEARCH_MAX = Math.log1p(INVERSE_Z_MAX);

function fmt(v: number): string {
  return Number(v.toPrecision(5)).toString();
}

/** Redshift at which the lookback time equals `tGyr` (inverse of Hogg 1999, eq. 30). */
export function redshiftAtLookbackTime(c: Cosmology, tGyr: number): number {
  if (!(tGyr >= 0) || !Number.isFinite(tGyr)) throw new CosmologyRangeError(`lookback time must be a finite number ≥ 0 Gyr, got ${tGyr}`);
  const target = tGyr / c.hubbleTimeGyr;
  const x = c.table.xForLookback(target);
  if (x !== null) return Math.expm1(x);
  if (c.table.finiteAge && target >= c.table.ageToday) {
    throw new CosmologyRangeError(`a lookback time of ${fmt(tGyr)} Gyr is not shorter than the age of the universe (${fmt(ageToday(c))} Gyr)`);
  }
  return solveBeyondTable(c, (xx) => c.table.lookbackAt(xx) - target, 'lookback time', tGyr, 'Gyr');
}

/** Redshift at which the age of the universe equals `tGyr` (inverse of Hogg 1999, eq. 30). */
export function redshiftAtAge(c: Cosmology, tGyr: number): number {
  if (!(tGyr > 0) || !Number.isFinite(tGyr)) throw new CosmologyRangeError(`age must be a finite number > 0 Gyr, got ${tGyr}`);
  if (!c.table.finiteAge) throw new CosmologyRangeError('this model has no beginning, so ages are undefined');
  const target = tGyr / c.hubbleTimeGyr;
  if (target > c.table.ageToday) {
    throw new CosmologyRangeError(`an age of ${fmt(tGyr)} Gyr exceeds the age of the universe today (${fmt(ageToday(c))} Gyr)`);
  }
  const x = c.table.xForAge(target);
  if (x !== null) return Math.expm1(x);
  return solveBeyondTable(c, (xx) => target - ageIntegral(c.expansion, xx), 'age', tGyr, 'Gyr');
}

/** Redshift at which the line-of-sight comoving distance equals `dMpc` (inverse of Hogg 1999, eq. 15). */
export function redshiftAtComovingDistance(c: Cosmology, dMpc: number): number {
  if (!(dMpc >= 0) || !Number.isFinite(dMpc)) throw new CosmologyRangeError(`distance must be a finite number ≥ 0 Mpc, got ${dMpc}`);
  const target = dMpc / c.hubbleDistanceMpc;
  const x = c.table.xForComoving(target);
  if (x !== null) return Math.expm1(x);
  const end = c.table.comovingAtTableEnd;
  return solveBeyondTable(c, (xx) => end + comovingIntegral(c.expansion, c.table.xMax, xx) - target, 'comoving distance', dMpc, 'Mpc');
}

/** Solves g(x) = 0 for x between the table's end and z = 10⁸, where g increases. */
function solveBeyondTable(c: Cosmology, g: (x: number) => number, what: string, value: number, unitText: string): number {
  const x = brentRoot(g, c.table.xMax, X_SEARCH_MAX, 1e-13);
  if (x === null) throw new CosmologyRangeError(`no redshift below ${INVERSE_Z_MAX.toExponential()} has a ${what} of ${fmt(value)} ${unitText}`);
  return Math.expm1(x);
}

/**
 * Redshift at which the transverse comoving distance equals `dMpc` (inverse of Hogg 1999,
 * eq. 16). In a closed model only the branch before the maximum of D_M is returned.
 */
export function redshiftAtTransverseComovingDistance(c: Cosmology, dMpc: number): number {
  if (!(dMpc >= 0) || !Number.isFinite(dMpc)) throw new CosmologyRangeError(`distance must be a finite number ≥ 0 Mpc, got ${dMpc}`);
  const ok = c.params.Omega_k;
  if (ok === 0) return redshiftAtComovingDistance(c, dMpc);
  const r = c.hubbleDistanceMpc / Math.sqrt(Math.abs(ok));
  if (ok > 0) return redshiftAtComovingDistance(c, r * Math.asinh(dMpc / r));
  if (dMpc > r) throw new CosmologyRangeError(`a closed model with Ωk = ${fmt(ok)} has no transverse comoving distance above ${fmt(r)} Mpc`);
  return redshiftAtComovingDistance(c, r * Math.asin(dMpc / r));
}

/** Redshift at which the luminosity distance equals `dMpc` (inverse of Hogg 1999, eq. 21). */
export function redshiftAtLuminosityDistance(c: Cosmology, dMpc: number): number {
  if (!(dMpc >= 0) || !Number.isFinite(dMpc)) throw new CosmologyRangeError(`distance must be a finite number ≥ 0 Mpc, got ${dMpc}`);
  if (dMpc === 0) return 0;
  // Bracket by doubling in x = ln(1+z) until D_L exceeds the target.
  const f = (x: number) => luminosityDistance(c, Math.expm1(x)) - dMpc;
  let hi = 0.5;
  while (f(hi) < 0) {
    if (hi >= X_SEARCH_MAX) throw new CosmologyRangeError(`no redshift below ${INVERSE_Z_MAX.toExponential()} has a luminosity distance of ${fmt(dMpc)} Mpc`);
    hi = Math.min(2 * hi, X_SEARCH_MAX);
  }
  const x = brentRoot(f, 0, hi, 1e-14);
  if (x === null) throw new CosmologyRangeError(`no redshift has a luminosity distance of ${fmt(dMpc)} Mpc`);
  return Math.expm1(x);
}

/** Redshift at which the distance modulus equals `mu` mag (inverse of Hogg 1999, eq. 25). */
export function redshiftAtDistanceModulus(c: Cosmology, mu: number): number {
  if (!Number.isFinite(mu)) throw new CosmologyRangeError(`distance modulus must be a finite number, got ${mu}`);
  return redshiftAtLuminosityDistance(c, 10 ** ((mu - 25) / 5));
}

/** Redshift at which the light-travel distance c·t_L equals `dMpc`. */
export function redshiftAtLightTravelDistance(c: Cosmology, dMpc: number): number {
  return redshiftAtLookbackTime(c, (dMpc / c.hubbleDistanceMpc) * c.hubbleTimeGyr);
}

/** The redshift of the maximum of the angular-diameter distance, and that maximum (Mpc). */
export function angularDiameterDistanceMaximum(c: Cosmology): { z: number; distanceMpc: number } {
  return c.memo('dAMax', () => {
    const x = goldenMaximum((xx) => angularDiameterDistance(c, Math.expm1(xx)), 0, c.table.xMax, 1e-12);
    const z = Math.expm1(x);
    return { z, distanceMpc: angularDiameterDistance(c, z) };
  });
}

/**
 * Both redshifts at which the angular-diameter distance equals `dMpc` (Hogg 1999, eq. 18 is
 * not monotonic: it rises to a maximum, then falls). Returns [near] or [near, far]; throws
 * when the distance exceeds the maximum.
 */
export function redshiftsAtAngularDiameterDistance(c: Cosmology, dMpc: number): number[] {
  if (!(dMpc >= 0) || !Number.isFinite(dMpc)) throw new CosmologyRangeError(`distance must be a finite number ≥ 0 Mpc, got ${dMpc}`);
  if (dMpc === 0) return [0];
  const peak = angularDiameterDistanceMaximum(c);
  if (dMpc > peak.distanceMpc) {
    throw new CosmologyRangeError(`the angular-diameter distance never exceeds ${fmt(peak.distanceMpc)} Mpc in this model (its maximum, at z = ${fmt(peak.z)})`);
  }
  const xPeak = Math.log1p(peak.z);
  const f = (x: number) => angularDiameterDistance(c, Math.expm1(x)) - dMpc;
  const roots: number[] = [];
  const near = brentRoot(f, 0, xPeak, 1e-14);
  if (near !== null) roots.push(Math.expm1(near));
  const far = brentRoot(f, xPeak, X_SEARCH_MAX, 1e-14);
  if (far !== null && (near === null || Math.abs(far - near) > 1e-9)) roots.push(Math.expm1(far));
  return roots;
}
