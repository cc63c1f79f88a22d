/**
 * The catalogue of quantities that depend on redshift: a stable camelCase key, a label, the
 * unit, the formula's source, and how to compute it. `comove calc` prints these; the checker
 * looks claims up here by key.
 */

import type { Cosmology } from './cosmology.js';
import { checkRedshift } from './errors.js';
import {
  angularDiameterDistance,
  comovingDistance,
  comovingKpcPerArcsec,
  comovingVolume,
  comovingVolumePerSquareDegree,
  differentialComovingVolume,
  distanceModulus,
  lightTravelDistance,
  luminosityDistance,
  properKpcPerArcsec,
  transverseComovingDistance,
} from './distances.js';
import { growthFactor, growthRate } from './growth.js';
import {
  age,
  cmbTemperature,
  criticalDensityCgs,
  criticalDensitySolar,
  deceleration,
  expansionRate,
  hubbleParameter,
  lookbackTime,
  scaleFactor,
} from './times.js';

export interface QuantityDefinition {
  readonly key: string;
  readonly label: string;
  /** Unit text, parseable by units.ts ('' for pure numbers). */
  readonly unit: string;
  readonly source: string;
  readonly compute: (c: Cosmology, z: number) => number;
}

/** One density fraction ρ_i(z)/ρc(z), from the component's density relative to ρc0. */
function fraction(density: (c: Cosmology, zp1: number) => number) {
  return (c: Cosmology, z: number) => {
    checkRedshift(z);
    return density(c, 1 + z) / c.expansion.e2(1 + z);
  };
}

export const QUANTITIES: readonly QuantityDefinition[] = [
  { key: 'scaleFactor', label: 'scale factor a', unit: '', source: 'a = 1/(1+z)', compute: (_c, z) => scaleFactor(z) },
  { key: 'expansionFactor', label: 'expansion factor 1+z', unit: '', source: '1+z = a0/a', compute: (_c, z) => 1 + z },
  { key: 'hubbleParameter', label: 'H(z)', unit: 'km/s/Mpc', source: 'Hogg 1999, eq. 14', compute: hubbleParameter },
  { key: 'expansionRate', label: 'E(z) = H/H0', unit: '', source: 'Hogg 1999, eq. 14', compute: expansionRate },
  { key: 'comovingDistance', label: 'comoving distance (line of sight) D_C', unit: 'Mpc', source: 'Hogg 1999, eq. 15', compute: comovingDistance },
  { key: 'transverseComovingDistance', label: 'transverse comoving distance D_M', unit: 'Mpc', source: 'Hogg 1999, eq. 16', compute: transverseComovingDistance },
  { key: 'angularDiameterDistance', label: 'angular-diameter distance D_A', unit: 'Mpc', source: 'Hogg 1999, eq. 18', compute: angularDiameterDistance },
  { key: 'luminosityDistance', label: 'luminosity distance D_L', unit: 'Mpc', source: 'Hogg 1999, eq. 21', compute: luminosityDistance },
  { key: 'distanceModulus', label: 'distance modulus', unit: 'mag', source: 'Hogg 1999, eq. 25', compute: distanceModulus },
  { key: 'lightTravelDistance', label: 'light-travel distance c·t_L', unit: 'Mpc', source: 'Hogg 1999, eq. 30 × c', compute: lightTravelDistance },
  { key: 'lookbackTime', label: 'lookback time', unit: 'Gyr', source: 'Hogg 1999, eq. 30', compute: lookbackTime },
  { key: 'age', label: 'age of the universe at z', unit: 'Gyr', source: 'Hogg 1999, eq. 30 (to z = ∞)', compute: age },
  { key: 'properKpcPerArcsec', label: 'proper scale', unit: 'kpc/arcsec', source: 'Hogg 1999, eq. 18', compute: properKpcPerArcsec },
  { key: 'comovingKpcPerArcsec', label: 'comoving scale', unit: 'kpc/arcsec', source: 'Hogg 1999, eq. 16', compute: comovingKpcPerArcsec },
  { key: 'properKpcPerArcmin', label: 'proper scale', unit: 'kpc/arcmin', source: 'Hogg 1999, eq. 18', compute: (c, z) => 60 * properKpcPerArcsec(c, z) },
  { key: 'comovingKpcPerArcmin', label: 'comoving scale', unit: 'kpc/arcmin', source: 'Hogg 1999, eq. 16', compute: (c, z) => 60 * comovingKpcPerArcsec(c, z) },
  { key: 'comovingVolume', label: 'comoving volume within z (all sky)', unit: 'Gpc^3', source: 'Hogg 1999, eq. 29', compute: (c, z) => comovingVolume(c, z) * 1e-9 },
  { key: 'comovingVolumePerSquareDegree', label: 'comoving volume within z per deg²', unit: 'Mpc^3 deg^-2', source: 'Hogg 1999, eq. 29', compute: comovingVolumePerSquareDegree },
  { key: 'differentialComovingVolume', label: 'dV_C/dz/dΩ', unit: 'Mpc^3 sr^-1', source: 'Hogg 1999, eq. 28', compute: differentialComovingVolume },
  { key: 'cmbTemperature', label: 'CMB temperature', unit: 'K', source: 'T = T0 (1+z); T0 from the parameter set, else Fixsen 2009', compute: cmbTemperature },
  { key: 'criticalDensity', label: 'critical density', unit: 'g cm^-3', source: 'ρc = 3H²/(8πG)', compute: criticalDensityCgs },
  { key: 'criticalDensitySolar', label: 'critical density', unit: 'Msun Mpc^-3', source: 'ρc = 3H²/(8πG)', compute: criticalDensitySolar },
  { key: 'omegaMatter', label: 'Ωm(z)', unit: '', source: 'ρm(z)/ρc(z)', compute: fraction((c, zp1) => c.expansion.matterDensity(zp1)) },
  { key: 'omegaRadiation', label: 'Ωr(z)', unit: '', source: 'ρr(z)/ρc(z)', compute: fraction((c, zp1) => c.expansion.radiationDensity(zp1)) },
  { key: 'omegaDarkEnergy', label: 'Ωde(z)', unit: '', source: 'ρde(z)/ρc(z)', compute: fraction((c, zp1) => c.expansion.darkEnergyDensity(zp1)) },
  { key: 'omegaCurvature', label: 'Ωk(z)', unit: '', source: 'Ωk(1+z)²/E²', compute: fraction((c, zp1) => c.params.Omega_k * zp1 * zp1) },
  { key: 'deceleration', label: 'deceleration parameter q', unit: '', source: 'q = (1/2) d ln E²/d ln(1+z) − 1', compute: deceleration },
  { key: 'growthFactor', label: 'linear growth factor D (D(0) = 1)', unit: '', source: 'growth ODE (Linder 2005, eq. 1)', compute: growthFactor },
  { key: 'growthRate', label: 'growth rate f = d ln D/d ln a', unit: '', source: 'growth ODE (Linder 2005, eq. 1)', compute: growthRate },
];

const BY_KEY = new Map(QUANTITIES.map((q) => [q.key, q]));

/** The quantity with this key, or undefined. */
export function findQuantity(key: string): QuantityDefinition | undefined {
  return BY_KEY.get(key);
}

/** One row of evaluated quantities: the redshift and each quantity's value (null where undefined). */
export type QuantityRow = Record<string, number | null>;

/** Evaluated quantities by column: one Float64Array per key, NaN where the model gives no value. */
export interface QuantityColumns {
  readonly redshifts: Float64Array;
  readonly columns: ReadonlyMap<string, Float64Array>;
}

/**
 * Evaluates the quantities `keys` at each redshift, column by column (fast for 10⁵ redshifts).
 * A value the model cannot give (an infinite age, the distance modulus at z = 0, the growth
 * factor beyond its table) is NaN.
 */
export function evaluateColumns(c: Cosmology, redshifts: readonly number[], keys: readonly string[]): QuantityColumns {
  const n = redshifts.length;
  const zs = Float64Array.from(redshifts);
  const columns = new Map<string, Float64Array>();
  for (const key of keys) {
    const def = findQuantity(key);
    if (!def) throw new Error(`unknown quantity '${key}'`);
    const out = new Float64Array(n);
    const compute = def.compute;
    for (let i = 0; i < n; i++) {
      let v: number;
      try {
        v = compute(c, zs[i]);
      } catch {
        v = NaN;
      }
      out[i] = Number.isFinite(v) ? v : NaN;
    }
    columns.set(key, out);
  }
  return { redshifts: zs, columns };
}

/** Evaluates the quantities `keys` at each redshift as row objects, with null where undefined. */
export function evaluateQuantities(c: Cosmology, redshifts: readonly number[], keys: readonly string[]): QuantityRow[] {
  const { columns } = evaluateColumns(c, redshifts, keys);
  return redshifts.map((z, i) => {
    const row: QuantityRow = { z };
    for (const key of keys) {
      const v = columns.get(key)![i];
      row[key] = Number.isNaN(v) ? null : v;
    }
    return row;
  });
}
