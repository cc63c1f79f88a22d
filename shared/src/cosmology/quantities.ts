/**
 * The catalogue of quantities that depend on redshift: a stable camelCase key, a label, the
 * unit, the formula's source, and how to compute it. `comove calc` prints these; the checker
 * looks claims up here by key.
 *
 * Quantities are computed from a RedshiftPoint, which evaluates the shared intermediate values
 * (E, D_C, D_M, lookback time) once per redshift, so that a table of every quantity at 10⁵
 * redshifts costs little more than its distances.
 */

import { ARCSEC_RAD, SQUARE_DEGREE_SR } from './constants.js';
import type { Cosmology } from './cosmology.js';
import { comovingVolumeWithin, distanceModulusFromLuminosityDistance, transverseFromLineOfSight } from './distances.js';
import { checkRedshift } from './errors.js';
import { growthFactor, growthRate } from './growth.js';
import { cmbTemperature, criticalDensityForHubble, KG_M3_IN_G_CM3, KG_M3_IN_SOLAR_MPC3 } from './times.js';

/** One redshift of one parameter set, with its intermediate values computed on first use. */
export class RedshiftPoint {
  readonly zp1: number;
  readonly x: number;
  private e2Value = NaN;
  private dcValue = NaN;
  private dmValue = NaN;
  private lookbackValue = NaN;

  constructor(readonly cosmology: Cosmology, readonly z: number) {
    checkRedshift(z);
    this.zp1 = 1 + z;
    this.x = Math.log1p(z);
  }

  /** E²(z) (Hogg 1999, eq. 14). */
  get e2(): number {
    if (Number.isNaN(this.e2Value)) this.e2Value = this.cosmology.expansion.e2(this.zp1);
    return this.e2Value;
  }

  /** Line-of-sight comoving distance, Mpc (Hogg 1999, eq. 15). */
  get comovingDistance(): number {
    if (Number.isNaN(this.dcValue)) this.dcValue = this.cosmology.hubbleDistanceMpc * this.cosmology.table.comovingAt(this.x);
    return this.dcValue;
  }

  /** Transverse comoving distance, Mpc (Hogg 1999, eq. 16). */
  get transverseComovingDistance(): number {
    if (Number.isNaN(this.dmValue)) this.dmValue = transverseFromLineOfSight(this.cosmology, this.comovingDistance);
    return this.dmValue;
  }

  /** Lookback time in units of the Hubble time (Hogg 1999, eq. 30). */
  get lookbackUnitless(): number {
    if (Number.isNaN(this.lookbackValue)) this.lookbackValue = this.cosmology.table.lookbackAt(this.x);
    return this.lookbackValue;
  }

  /** Angular-diameter distance, Mpc (Hogg 1999, eq. 18). */
  get angularDiameterDistance(): number {
    return this.transverseComovingDistance / this.zp1;
  }

  /** Luminosity distance, Mpc (Hogg 1999, eq. 21). */
  get luminosityDistance(): number {
    return this.transverseComovingDistance * this.zp1;
  }

  /** H(z), km s⁻¹ Mpc⁻¹ (Hogg 1999, eq. 14). */
  get hubbleParameter(): number {
    return this.cosmology.params.H0 * Math.sqrt(this.e2);
  }

  /** ρ_i(z)/ρc(z) for a density relative to ρc0. */
  fraction(density: number): number {
    return density / this.e2;
  }
}

export interface QuantityDefinition {
  readonly key: string;
  readonly label: string;
  /** Unit text, parseable by units.ts ('' for pure numbers). */
  readonly unit: string;
  readonly source: string;
  readonly compute: (p: RedshiftPoint) => number;
}

const KPC_PER_ARCSEC = 1e3 * ARCSEC_RAD;

export const QUANTITIES: readonly QuantityDefinition[] = [
  { key: 'scaleFactor', label: 'scale factor a', unit: '', source: 'a = 1/(1+z)', compute: (p) => 1 / p.zp1 },
  { key: 'expansionFactor', label: 'expansion factor 1+z', unit: '', source: '1+z = a0/a', compute: (p) => p.zp1 },
  { key: 'hubbleParameter', label: 'H(z)', unit: 'km/s/Mpc', source: 'Hogg 1999, eq. 14', compute: (p) => p.hubbleParameter },
  { key: 'expansionRate', label: 'E(z) = H/H0', unit: '', source: 'Hogg 1999, eq. 14', compute: (p) => Math.sqrt(p.e2) },
  { key: 'comovingDistance', label: 'comoving distance (line of sight) D_C', unit: 'Mpc', source: 'Hogg 1999, eq. 15', compute: (p) => p.comovingDistance },
  { key: 'transverseComovingDistance', label: 'transverse comoving distance D_M', unit: 'Mpc', source: 'Hogg 1999, eq. 16', compute: (p) => p.transverseComovingDistance },
  { key: 'angularDiameterDistance', label: 'angular-diameter distance D_A', unit: 'Mpc', source: 'Hogg 1999, eq. 18', compute: (p) => p.angularDiameterDistance },
  { key: 'luminosityDistance', label: 'luminosity distance D_L', unit: 'Mpc', source: 'Hogg 1999, eq. 21', compute: (p) => p.luminosityDistance },
  { key: 'distanceModulus', label: 'distance modulus', unit: 'mag', source: 'Hogg 1999, eq. 25', compute: (p) => distanceModulusFromLuminosityDistance(p.luminosityDistance) },
  { key: 'lightTravelDistance', label: 'light-travel distance c·t_L', unit: 'Mpc', source: 'Hogg 1999, eq. 30 × c', compute: (p) => p.cosmology.hubbleDistanceMpc * p.lookbackUnitless },
  { key: 'lookbackTime', label: 'lookback time', unit: 'Gyr', source: 'Hogg 1999, eq. 30', compute: (p) => p.cosmology.hubbleTimeGyr * p.lookbackUnitless },
  { key: 'age', label: 'age of the universe at z', unit: 'Gyr', source: 'Hogg 1999, eq. 30 (to z = ∞)', compute: (p) => p.cosmology.hubbleTimeGyr * p.cosmology.table.ageAt(p.x) },
  { key: 'properKpcPerArcsec', label: 'proper scale', unit: 'kpc/arcsec', source: 'Hogg 1999, eq. 18', compute: (p) => p.angularDiameterDistance * KPC_PER_ARCSEC },
  { key: 'comovingKpcPerArcsec', label: 'comoving scale', unit: 'kpc/arcsec', source: 'Hogg 1999, eq. 16', compute: (p) => p.transverseComovingDistance * KPC_PER_ARCSEC },
  { key: 'properKpcPerArcmin', label: 'proper scale', unit: 'kpc/arcmin', source: 'Hogg 1999, eq. 18', compute: (p) => 60 * p.angularDiameterDistance * KPC_PER_ARCSEC },
  { key: 'comovingKpcPerArcmin', label: 'comoving scale', unit: 'kpc/arcmin', source: 'Hogg 1999, eq. 16', compute: (p) => 60 * p.transverseComovingDistance * KPC_PER_ARCSEC },
  { key: 'comovingVolume', label: 'comoving volume within z (all sky)', unit: 'Gpc^3', source: 'Hogg 1999, eq. 29', compute: (p) => comovingVolumeWithin(p.cosmology, p.comovingDistance) * 1e-9 },
  {
    key: 'comovingVolumePerSquareDegree', label: 'comoving volume within z per deg²', unit: 'Mpc^3 deg^-2', source: 'Hogg 1999, eq. 29',
    compute: (p) => (comovingVolumeWithin(p.cosmology, p.comovingDistance) * SQUARE_DEGREE_SR) / (4 * Math.PI),
  },
  {
    key: 'differentialComovingVolume', label: 'dV_C/dz/dΩ', unit: 'Mpc^3 sr^-1', source: 'Hogg 1999, eq. 28',
    compute: (p) => (p.cosmology.hubbleDistanceMpc * p.transverseComovingDistance ** 2) / Math.sqrt(p.e2),
  },
  {
    key: 'cmbTemperature', label: 'CMB temperature', unit: 'K', source: 'T = T0 (1+z); T0 from the parameter set, else Fixsen 2009',
    compute: (p) => cmbTemperature(p.cosmology, p.z),
  },
  { key: 'criticalDensity', label: 'critical density', unit: 'g cm^-3', source: 'ρc = 3H²/(8πG)', compute: (p) => criticalDensityForHubble(p.hubbleParameter) * KG_M3_IN_G_CM3 },
  { key: 'criticalDensitySolar', label: 'critical density', unit: 'Msun Mpc^-3', source: 'ρc = 3H²/(8πG)', compute: (p) => criticalDensityForHubble(p.hubbleParameter) * KG_M3_IN_SOLAR_MPC3 },
  { key: 'omegaMatter', label: 'Ωm(z)', unit: '', source: 'ρm(z)/ρc(z)', compute: (p) => p.fraction(p.cosmology.expansion.matterDensity(p.zp1)) },
  { key: 'omegaRadiation', label: 'Ωr(z)', unit: '', source: 'ρr(z)/ρc(z)', compute: (p) => p.fraction(p.cosmology.expansion.radiationDensity(p.zp1)) },
  { key: 'omegaDarkEnergy', label: 'Ωde(z)', unit: '', source: 'ρde(z)/ρc(z)', compute: (p) => p.fraction(p.cosmology.expansion.darkEnergyDensity(p.zp1)) },
  { key: 'omegaCurvature', label: 'Ωk(z)', unit: '', source: 'Ωk(1+z)²/E²', compute: (p) => p.fraction(p.cosmology.params.Omega_k * p.zp1 * p.zp1) },
  { key: 'deceleration', label: 'deceleration parameter q', unit: '', source: 'q = (1/2) d ln E²/d ln(1+z) − 1', compute: (p) => p.cosmology.expansion.deceleration(p.zp1) },
  { key: 'growthFactor', label: 'linear growth factor D (D(0) = 1)', unit: '', source: 'growth ODE (Linder 2005, eq. 1)', compute: (p) => growthFactor(p.cosmology, p.z) },
  { key: 'growthRate', label: 'growth rate f = d ln D/d ln a', unit: '', source: 'growth ODE (Linder 2005, eq. 1)', compute: (p) => growthRate(p.cosmology, p.z) },
];

const BY_KEY = new Map(QUANTITIES.map((q) => [q.key, q]));

/** The quantity with this key, or undefined. */
export function findQuantity(key: string): QuantityDefinition | undefined {
  return BY_KEY.get(key);
}

/** The value of quantity `key` at redshift z (throws CosmologyRangeError where undefined). */
export function computeQuantity(c: Cosmology, key: string, z: number): number {
  const def = findQuantity(key);
  if (!def) throw new Error(`unknown quantity '${key}'`);
  return def.compute(new RedshiftPoint(c, z));
}

/** One row of evaluated quantities: the redshift and each quantity's value (null where undefined). */
export type QuantityRow = Record<string, number | null>;

/** Evaluated quantities by column: one Float64Array per key, NaN where the model gives no value. */
export interface QuantityColumns {
  readonly redshifts: Float64Array;
  readonly columns: ReadonlyMap<string, Float64Array>;
}

/** v if finite, else NaN (an undefined value). */
function finiteOrNaN(v: number): number {
  return v - v === 0 ? v : NaN;
}

/**
 * Evaluates the quantities `keys` at each redshift, into one column per key (fast for 10⁵
 * redshifts). A value the model cannot give (an infinite age, the distance modulus at z = 0,
 * the growth factor beyond its table) is NaN.
 */
export function evaluateColumns(c: Cosmology, redshifts: readonly number[], keys: readonly string[]): QuantityColumns {
  const n = redshifts.length;
  const defs = keys.map((key) => {
    const def = findQuantity(key);
    if (!def) throw new Error(`unknown quantity '${key}'`);
    return def;
  });
  const zs = Float64Array.from(redshifts);
  const outs = defs.map(() => new Float64Array(n));
  for (let i = 0; i < n; i++) {
    let point: RedshiftPoint | null = null;
    try {
      point = new RedshiftPoint(c, zs[i]);
    } catch {
      point = null;
    }
    for (let j = 0; j < defs.length; j++) {
      let v = NaN;
      try {
        if (point) v = defs[j].compute(point);
      } catch {
        v = NaN;
      }
      outs[j][i] = finiteOrNaN(v);
    }
  }
  return { redshifts: zs, columns: new Map(keys.map((k, j) => [k, outs[j]])) };
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
