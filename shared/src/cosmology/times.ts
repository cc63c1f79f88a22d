/**
 * Times and the local expansion at redshift z: lookback time and age (Hogg 1999, eq. 30),
 * H(z) (Hogg 1999, eq. 14), critical density, CMB temperature, scale factor.
 */

import {
  FIXSEN_2009_T_CMB_K,
  GRAVITATIONAL_CONSTANT_SI,
  KM_S_MPC_IN_PER_S,
  MPC_M,
  SOLAR_MASS_KG,
} from './constants.js';
import type { Cosmology } from './cosmology.js';
import { checkRedshift } from './errors.js';

/** Lookback time t_L = t_H ∫₀^z dz'/((1+z')E(z')), Gyr (Hogg 1999, eq. 30). */
export function lookbackTime(c: Cosmology, z: number): number {
  checkRedshift(z);
  return c.hubbleTimeGyr * c.table.lookbackAt(Math.log1p(z));
}

/** Age of the universe at z, t_H ∫_z^∞ dz'/((1+z')E(z')), Gyr (Hogg 1999, eq. 30). Infinity without a beginning. */
export function age(c: Cosmology, z: number): number {
  checkRedshift(z);
  return c.hubbleTimeGyr * c.table.ageAt(Math.log1p(z));
}

/** Age of the universe today, Gyr. */
export function ageToday(c: Cosmology): number {
  return c.hubbleTimeGyr * c.table.ageToday;
}

/** Hubble parameter H(z) = H0 E(z), km s⁻¹ Mpc⁻¹ (Hogg 1999, eq. 14). */
export function hubbleParameter(c: Cosmology, z: number): number {
  checkRedshift(z);
  return c.params.H0 * c.expansion.e(1 + z);
}

/** Dimensionless expansion rate E(z) = H(z)/H0 (Hogg 1999, eq. 14). */
export function expansionRate(c: Cosmology, z: number): number {
  checkRedshift(z);
  return c.expansion.e(1 + z);
}

/** Critical density 3H²/(8πG) in kg m⁻³ for H in km s⁻¹ Mpc⁻¹ (Peebles 1993, eq. 5.15). */
export function criticalDensityForHubble(hubbleKmSMpc: number): number {
  const h = hubbleKmSMpc * KM_S_MPC_IN_PER_S;
  return (3 * h * h) / (8 * Math.PI * GRAVITATIONAL_CONSTANT_SI);
}

/** kg m⁻³ in g cm⁻³. */
export const KG_M3_IN_G_CM3 = 1e-3;
/** kg m⁻³ in M☉ Mpc⁻³ (solar mass from IAU 2015 B3 and CODATA 2018 G). */
export const KG_M3_IN_SOLAR_MPC3 = MPC_M ** 3 / SOLAR_MASS_KG;

/** Critical density at z, g cm⁻³. */
export function criticalDensityCgs(c: Cosmology, z: number): number {
  return criticalDensityForHubble(hubbleParameter(c, z)) * KG_M3_IN_G_CM3;
}

/** Critical density at z, M☉ Mpc⁻³. */
export function criticalDensitySolar(c: Cosmology, z: number): number {
  return criticalDensityForHubble(hubbleParameter(c, z)) * KG_M3_IN_SOLAR_MPC3;
}

/**
 * CMB temperature T0 (1+z), K. When the parameter set has no radiation (T_CMB = 0) the
 * measured T0 of Fixsen 2009 is used, so that temperature statements remain checkable.
 */
export function cmbTemperature(c: Cosmology, z: number): number {
  checkRedshift(z);
  return (c.params.T_CMB > 0 ? c.params.T_CMB : FIXSEN_2009_T_CMB_K) * (1 + z);
}

/** Scale factor a = 1/(1+z) (Hogg 1999, eq. 1 and §2). */
export function scaleFactor(z: number): number {
  checkRedshift(z);
  return 1 / (1 + z);
}

/** Deceleration parameter q(z) (see Expansion.deceleration). */
export function deceleration(c: Cosmology, z: number): number {
  checkRedshift(z);
  return c.expansion.deceleration(1 + z);
}
