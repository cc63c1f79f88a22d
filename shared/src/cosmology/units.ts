/**
 * Units: parsing of unit text (plain, caret and Unicode-superscript exponents, h-scaled forms)
 * and conversion between units of one dimension, with h-scaled units converted using the
 * parameter set's h. Constants come from constants.ts (SI 2019, IAU 2012/2015, Julian year).
 *
 * A unit is a factor times h^hPower times h70^h70Power times a product of base units
 * raised to powers. Base units: Mpc (length), Gyr (time), rad (angle), K (temperature),
 * M☉ (mass), mag (magnitude, which does not combine).
 */

import {
  AU_M,
  GYR_S,
  LIGHT_YEAR_M,
  MPC_M,
  SOLAR_MASS_KG,
} from './constants.js';

export type BaseDimension = 'length' | 'time' | 'angle' | 'temperature' | 'mass' | 'magnitude';

/** Exponents of the base dimensions. */
export type DimensionVector = Readonly<Record<BaseDimension, number>>;

/** A parsed unit. */
export interface Unit {
  /** The text it was parsed from, or a canonical spelling. */
  readonly text: string;
  /** Multiply a value in this unit by `factor` (and the h powers) to get base units. */
  readonly factor: number;
  readonly dimensions: DimensionVector;
  /** Power of h = H0/100 in the unit (−1 for h⁻¹ Mpc). */
  readonly hPower: number;
  /** Power of h70 = H0/70 in the unit. */
  readonly h70Power: number;
}

interface Symbol_ {
  readonly factor: number;
  readonly dimension: BaseDimension;
}

const KM_IN_MPC = 1000 / MPC_M;

/** Base-unit symbols and their size in base units. */
const SYMBOLS: Readonly<Record<string, Symbol_>> = {
  Gpc: { factor: 1e3, dimension: 'length' },
  Mpc: { factor: 1, dimension: 'length' },
  kpc: { factor: 1e-3, dimension: 'length' },
  pc: { factor: 1e-6, dimension: 'length' },
  au: { factor: AU_M / MPC_M, dimension: 'length' },
  AU: { factor: AU_M / MPC_M, dimension: 'length' },
  km: { factor: KM_IN_MPC, dimension: 'length' },
  m: { factor: 1 / MPC_M, dimension: 'length' },
  cm: { factor: 0.01 / MPC_M, dimension: 'length' },
  ly: { factor: LIGHT_YEAR_M / MPC_M, dimension: 'length' },
  kly: { factor: (1e3 * LIGHT_YEAR_M) / MPC_M, dimension: 'length' },
  Mly: { factor: (1e6 * LIGHT_YEAR_M) / MPC_M, dimension: 'length' },
  Gly: { factor: (1e9 * LIGHT_YEAR_M) / MPC_M, dimension: 'length' },
  Gyr: { factor: 1, dimension: 'time' },
  Myr: { factor: 1e-3, dimension: 'time' },
  kyr: { factor: 1e-6, dimension: 'time' },
  yr: { factor: 1e-9, dimension: 'time' },
  s: { factor: 1 / GYR_S, dimension: 'time' },
  rad: { factor: 1, dimension: 'angle' },
  deg: { factor: Math.PI / 180, dimension: 'angle' },
  '°': { factor: Math.PI / 180, dimension: 'angle' },
  arcmin: { factor: Math.PI / 10_800, dimension: 'angle' },
  arcsec: { factor: Math.PI / 648_000, dimension: 'angle' },
  mas: { factor: Math.PI / 648_000_000, dimension: 'angle' },
  K: { factor: 1, dimension: 'temperature' },
  Msun: { factor: 1, dimension: 'mass' },
  'M☉': { factor: 1, dimension: 'mass' },
  M_sun: { factor: 1, dimension: 'mass' },
  kg: { factor: 1 / SOLAR_MASS_KG, dimension: 'mass' },
  g: { factor: 1e-3 / SOLAR_MASS_KG, dimension: 'mass' },
  mag: { factor: 1, dimension: 'magnitude' },
};

/** Solid-angle symbols: squared angles. */
const SOLID_ANGLES: Readonly<Record<string, number>> = {
  sr: 1,
  deg2: (Math.PI / 180) ** 2,
  sqdeg: (Math.PI / 180) ** 2,
  arcmin2: (Math.PI / 10_800) ** 2,
};

const ZERO: DimensionVector = { length: 0, time: 0, angle: 0, temperature: 0, mass: 0, magnitude: 0 };

const SUPERSCRIPTS: Readonly<Record<string, string>> = {
  '⁻': '-', '⁺': '+', '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
};

/** Result of parsing unit text: the unit, or the reason it was not understood. */
export type UnitParseResult = { readonly ok: true; readonly unit: Unit } | { readonly ok: false; readonly message: string };

/**
 * Parses unit text such as `Mpc`, `h^-1 Mpc`, `Mpc/h`, `h⁻³ Gpc³`, `km s^-1 Mpc^-1`, `km/s/Mpc`,
 * `kpc/arcsec`, `h70^-1 kpc`, `Mpc^3 sr^-1`, `g cm^-3`. Never throws.
 */
export function parseUnit(text: string): UnitParseResult {
  let s = text.trim();
  for (const [sup, plain] of Object.entries(SUPERSCRIPTS)) s = s.split(sup).join(plain);
  s = s.replace(/−/g, '-').replace(/[·*]/g, ' ').replace(/\bper\b/g, '/');
  const dims: Record<BaseDimension, number> = { ...ZERO };
  let factor = 1;
  let hPower = 0;
  let h70Power = 0;
  let sign = 1;
  let pos = 0;
  let any = false;
  while (pos < s.length) {
    const ch = s[pos];
    if (ch === ' ') { pos++; continue; }
    if (ch === '/') { sign = -1; pos++; continue; }
    const m = /^([A-Za-z_☉°]+(?:70)?)(?:\^?\{?([+-]?\d+)\}?)?/.exec(s.slice(pos));
    if (!m || m[0].length === 0) return { ok: false, message: `unknown unit '${text}'` };
    pos += m[0].length;
    const name = m[1];
    const exponent = sign * (m[2] === undefined ? 1 : Number(m[2]));
    // A division applies to the next factor only (km/s/Mpc = km s⁻¹ Mpc⁻¹).
    sign = 1;
    any = true;
    if (name === 'h') { hPower += exponent; continue; }
    if (name === 'h70' || name === 'h_70') { h70Power += exponent; continue; }
    const sym = SYMBOLS[name];
    if (sym) {
      if (sym.dimension === 'magnitude' && exponent !== 1) return { ok: false, message: `magnitudes cannot be raised to a power in '${text}'` };
      factor *= sym.factor ** exponent;
      dims[sym.dimension] += exponent;
      continue;
    }
    const solid = SOLID_ANGLES[name];
    if (solid !== undefined) {
      factor *= solid ** exponent;
      dims.angle += 2 * exponent;
      continue;
    }
    return { ok: false, message: `unknown unit '${name}' in '${text}'` };
  }
  if (!any) return { ok: false, message: 'empty unit' };
  if (dims.magnitude !== 0 && Object.entries(dims).some(([k, v]) => k !== 'magnitude' && v !== 0)) {
    return { ok: false, message: `magnitudes do not combine with other units in '${text}'` };
  }
  return { ok: true, unit: { text: text.trim(), factor, dimensions: dims, hPower, h70Power } };
}

/** Parses unit text known to be valid (for the engine's own unit constants); throws otherwise. */
export function unit(text: string): Unit {
  const r = parseUnit(text);
  if (!r.ok) throw new Error(r.message);
  return r.unit;
}

/** Whether two units measure the same dimension. */
export function sameDimension(a: Unit, b: Unit): boolean {
  return (Object.keys(ZERO) as BaseDimension[]).every((k) => a.dimensions[k] === b.dimensions[k]);
}

/** Describes a dimension vector, e.g. "length^3". */
export function describeDimensions(d: DimensionVector): string {
  const parts = (Object.keys(ZERO) as BaseDimension[]).filter((k) => d[k] !== 0).map((k) => (d[k] === 1 ? k : `${k}^${d[k]}`));
  return parts.length ? parts.join(' ') : 'dimensionless';
}

/**
 * Converts `value` from one unit to another of the same dimension. h-scaled units use
 * h = H0/100 and h70 = H0/70 of the parameter set: 100 h⁻¹ Mpc = 100/h Mpc.
 * Throws when the dimensions differ (callers check sameDimension for user input).
 */
export function convert(value: number, from: Unit, to: Unit, h: number): number {
  if (!sameDimension(from, to)) {
    throw new Error(`cannot convert ${describeDimensions(from.dimensions)} (${from.text}) to ${describeDimensions(to.dimensions)} (${to.text})`);
  }
  const h70 = (100 * h) / 70;
  const inBase = value * from.factor * h ** from.hPower * h70 ** from.h70Power;
  return inBase / (to.factor * h ** to.hPower * h70 ** to.h70Power);
}
