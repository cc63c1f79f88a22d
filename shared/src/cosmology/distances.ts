/**
 * Distances, angular scales and volumes at redshift z (Hogg 1999, "Distance measures in
 * cosmology", astro-ph/9905116). Distances in Mpc, volumes in Mpc³, scales in kpc per arcsec.
 */

import { ARCSEC_RAD, SQUARE_DEGREE_SR } from './constants.js';
import type { Cosmology } from './cosmology.js';
import { checkRedshift, CosmologyRangeError } from './errors.js';

/** Line-of-sight comoving distance D_C, Mpc (Hogg 1999, eq. 15). */
export function comovingDistance(c: Cosmology, z: number): number {
  checkRedshift(z);
  return c.hubbleDistanceMpc * c.table.comovingAt(Math.log1p(z));
}

/**
 * Transverse comoving distance D_M for a line-of-sight comoving distance D_C (both Mpc):
 * D_H/√Ωk sinh(√Ωk D_C/D_H) for Ωk > 0, D_C for Ωk = 0, D_H/√|Ωk| sin(√|Ωk| D_C/D_H) for Ωk < 0
 * (Hogg 1999, eq. 16).
 */
export function transverseFromLineOfSight(c: Cosmology, dcMpc: number): number {
  const ok = c.params.Omega_k;
  if (ok === 0) return dcMpc;
  const dh = c.hubbleDistanceMpc;
  const s = Math.sqrt(Math.abs(ok));
  return ok > 0 ? (dh / s) * Math.sinh((s * dcMpc) / dh) : (dh / s) * Math.sin((s * dcMpc) / dh);
}

/** Transverse comoving distance D_M, Mpc (Hogg 1999, eq. 16). */
export function transverseComovingDistance(c: Cosmology, z: number): number {
  return transverseFromLineOfSight(c, comovingDistance(c, z));
}

/** Angular-diameter distance D_A = D_M/(1+z), Mpc (Hogg 1999, eq. 18). */
export function angularDiameterDistance(c: Cosmology, z: number): number {
  return transverseComovingDistance(c, z) / (1 + z);
}

/** Luminosity distance D_L = (1+z) D_M, Mpc (Hogg 1999, eq. 21). */
export function luminosityDistance(c: Cosmology, z: number): number {
  return (1 + z) * transverseComovingDistance(c, z);
}

/** Distance modulus 5 log10(D_L / 10 pc), mag (Hogg 1999, eq. 25). Infinite at z = 0. */
export function distanceModulus(c: Cosmology, z: number): number {
  return 5 * Math.log10(luminosityDistance(c, z)) + 25;
}

/** Distance modulus for a luminosity distance in Mpc (Hogg 1999, eq. 25). */
export function distanceModulusFromLuminosityDistance(dlMpc: number): number {
  return 5 * Math.log10(dlMpc) + 25;
}

/**
 * Angular-diameter distance between z1 < z2, Mpc: the transverse comoving distance of the
 * comoving separation, over (1 + z2). Equals Hogg 1999 eq. 19 for Ωk ≥ 0 and holds for Ωk < 0 too.
 */
export function angularDiameterDistanceBetween(c: Cosmology, z1: number, z2: number): number {
  checkRedshift(z1, 'z1');
  checkRedshift(z2, 'z2');
  if (z2 < z1) throw new CosmologyRangeError(`the second redshift must not be below the first (z1 = ${z1}, z2 = ${z2})`);
  const separation = comovingDistance(c, z2) - comovingDistance(c, z1);
  return transverseFromLineOfSight(c, separation) / (1 + z2);
}

/** Light-travel distance c × lookback time, Mpc (Hogg 1999, eq. 30 times c). */
export function lightTravelDistance(c: Cosmology, z: number): number {
  checkRedshift(z);
  return c.hubbleDistanceMpc * c.table.lookbackAt(Math.log1p(z));
}

/** Proper (physical) kpc subtended by one arcsecond at z: D_A × 1″ (Hogg 1999, eq. 18). */
export function properKpcPerArcsec(c: Cosmology, z: number): number {
  return angularDiameterDistance(c, z) * 1e3 * ARCSEC_RAD;
}

/** Comoving kpc subtended by one arcsecond at z: D_M × 1″ (Hogg 1999, eq. 16). */
export function comovingKpcPerArcsec(c: Cosmology, z: number): number {
  return transverseComovingDistance(c, z) * 1e3 * ARCSEC_RAD;
}

/** Proper size in kpc of an object subtending `angleArcsec` at z (small-angle, Hogg 1999 eq. 18). */
export function properSizeKpc(c: Cosmology, z: number, angleArcsec: number): number {
  return properKpcPerArcsec(c, z) * angleArcsec;
}

/** Angle in arcsec subtended at z by a proper size in kpc (small-angle, Hogg 1999 eq. 18). */
export function angularSizeArcsec(c: Cosmology, z: number, sizeKpc: number): number {
  return sizeKpc / properKpcPerArcsec(c, z);
}

/**
 * (sinh 2u)/4 − u/2 for k = +1, u/2 − (sin 2u)/4 for k = −1 (2u³/3 · … for small u): the
 * integral ∫₀ᵘ sinh²/sin² that the comoving volume of a curved space needs, by its series
 * where the closed form would cancel.
 */
function curvedVolumeKernel(u: number, k: 1 | -1): number {
  if (Math.abs(u) > 0.5) return k > 0 ? Math.sinh(2 * u) / 4 - u / 2 : u / 2 - Math.sin(2 * u) / 4;
  // Σ_{n≥1} k^(n+1) (2u)^(2n+1) / (4 (2n+1)!)
  let term = (2 * u) ** 3 / (4 * 6);
  let sum = term;
  for (let n = 2; n < 30; n++) {
    term *= (k * (2 * u) * (2 * u)) / ((2 * n) * (2 * n + 1));
    sum += term;
    if (Math.abs(term) < 1e-17 * Math.abs(sum)) break;
  }
  return sum;
}

/**
 * All-sky comoving volume within redshift z, Mpc³: 4π ∫ D_M² dD_C, which is Hogg 1999 eq. 29
 * (written with R = D_H/√|Ωk| and u = D_C/R so that it also holds past the equator of a
 * closed universe).
 */
export function comovingVolume(c: Cosmology, z: number): number {
  return comovingVolumeWithin(c, comovingDistance(c, z));
}

/** All-sky comoving volume within a line-of-sight comoving distance `dc` (Mpc), Mpc³ (Hogg 1999, eq. 29). */
export function comovingVolumeWithin(c: Cosmology, dc: number): number {
  const ok = c.params.Omega_k;
  if (ok === 0) return ((4 * Math.PI) / 3) * dc ** 3;
  const r = c.hubbleDistanceMpc / Math.sqrt(Math.abs(ok));
  return 4 * Math.PI * r ** 3 * curvedVolumeKernel(dc / r, ok > 0 ? 1 : -1);
}

/** Comoving volume between z1 and z2 over the whole sky, Mpc³ (Hogg 1999, eq. 29 differenced). */
export function comovingVolumeBetween(c: Cosmology, z1: number, z2: number): number {
  return comovingVolume(c, z2) - comovingVolume(c, z1);
}

/** Comoving volume within z per square degree of sky, Mpc³ deg⁻² (Hogg 1999, eq. 29 × Ω/4π). */
export function comovingVolumePerSquareDegree(c: Cosmology, z: number): number {
  return (comovingVolume(c, z) * SQUARE_DEGREE_SR) / (4 * Math.PI);
}

/** Differential comoving volume dV_C/dz/dΩ = D_H D_M² / E(z), Mpc³ sr⁻¹ (Hogg 1999, eq. 28). */
export function differentialComovingVolume(c: Cosmology, z: number): number {
  const dm = transverseComovingDistance(c, z);
  return (c.hubbleDistanceMpc * dm * dm) / c.expansion.e(1 + z);
}
