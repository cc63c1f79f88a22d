/**
 * The model value of a claim: the quantity its kind names, at its redshift, under one parameter
 * set, in the unit the author wrote (h-scaled units use the set's h). Each value comes with the
 * formula, its source and — for fitted epoch formulas — the method's known relative accuracy,
 * which the checker adds to the tolerance.
 */

import type { Claim } from '../claims/claimExtractor.js';
import type { ClaimKind } from '../claims/claimKinds.js';
import { SPEED_OF_LIGHT_KM_S } from '../cosmology/constants.js';
import type { Cosmology } from '../cosmology/cosmology.js';
import { comovingVolumeBetween } from '../cosmology/distances.js';
import { ACCURACY, epochs, type EpochValue } from '../cosmology/epochs.js';
import { CosmologyRangeError } from '../cosmology/errors.js';
import { findQuantity, QUANTITIES, RedshiftPoint } from '../cosmology/quantities.js';
import { convert, parseUnit, sameDimension, type Unit } from '../cosmology/units.js';
import { SQUARE_DEGREE_SR } from '../cosmology/constants.js';

/** What a claim needs to be recomputed: its kind, redshift(s) and stated unit. */
export interface ClaimQuestion {
  readonly kind: ClaimKind;
  readonly z: number | null;
  readonly zRange: readonly [number, number] | null;
  readonly angleArcsec: number | null;
  readonly sinceEpoch: 'recombination' | null;
  readonly parameter: string | null;
  /** The stated unit, or null for a pure number. */
  readonly unit: Unit | null;
}

export type Recomputation =
  | {
      readonly ok: true;
      /** In the claim's unit. */
      readonly value: number;
      /** The unit the value is in, as text ('' for pure numbers). */
      readonly unitText: string;
      readonly formula: string;
      readonly source: string;
      /** Known relative inaccuracy of the method (0 for exact formulas). */
      readonly methodRelative: number;
      readonly accuracy: string | null;
      readonly note: string | null;
    }
  | { readonly ok: false; readonly reason: string };

/** Relative accuracy of the fitted epoch formulas, as documented in epochs.ts (ACCURACY). */
export const METHOD_RELATIVE = {
  huSugiyama: 0.003,
  eisensteinHu: 0.04,
  aubourg: 0.002,
  /** r_drag by integral to the fitted z_d: 2–3 % long (epochs.ts). */
  dragIntegral: 0.03,
} as const;

export function questionOf(c: Claim): ClaimQuestion {
  return { kind: c.kind, z: c.z, zRange: c.zRange, angleArcsec: c.angleArcsec, sinceEpoch: c.sinceEpoch, parameter: c.parameter, unit: c.value.unit?.unit ?? null };
}

/** Every unit a recomputed value comes in, parsed once at load (a constant table). */
const BASE_UNITS: ReadonlyMap<string, Unit> = new Map(
  [...new Set(['Mpc', 'Gyr', 'kyr', 'kpc', 'kpc/arcsec', 'Mpc^3', 'Mpc^3 deg^-2', ...QUANTITIES.map((q) => q.unit)])]
    .filter((text) => text !== '')
    .map((text) => {
      const parsed = parseUnit(text);
      if (!parsed.ok) throw new Error(`internal: unit ${text}`);
      return [text, parsed.unit] as const;
    }),
);
function unitOf(text: string): Unit {
  const u = BASE_UNITS.get(text);
  if (!u) throw new Error(`internal: unit ${text} is not in the table`);
  return u;
}

/** Per-redshift kinds and the catalogue quantity each is. */
const PER_REDSHIFT: Partial<Record<ClaimKind, string>> = {
  luminosityDistance: 'luminosityDistance',
  angularDiameterDistance: 'angularDiameterDistance',
  comovingDistance: 'comovingDistance',
  transverseComovingDistance: 'transverseComovingDistance',
  lightTravelDistance: 'lightTravelDistance',
  distanceModulus: 'distanceModulus',
  lookbackTime: 'lookbackTime',
  age: 'age',
  hubbleParameter: 'hubbleParameter',
  cmbTemperature: 'cmbTemperature',
  growthRate: 'growthRate',
  growthFactor: 'growthFactor',
};

function fromBase(value: number, baseUnit: string, q: ClaimQuestion, c: Cosmology, formula: string, source: string, extra: Partial<{ methodRelative: number; accuracy: string | null; note: string | null }> = {}): Recomputation {
  const base = baseUnit ? unitOf(baseUnit) : null;
  let out = value;
  let unitText = baseUnit;
  if (base && q.unit) {
    if (!sameDimension(base, q.unit)) return { ok: false, reason: `the stated unit (${q.unit.text}) is not a unit of this quantity (${baseUnit})` };
    out = convert(value, base, q.unit, c.params.h);
    unitText = q.unit.text;
  } else if (!base && q.unit && !(q.kind === 'expansionFactor' || q.kind === 'growthRate' || q.kind === 'growthFactor')) {
    return { ok: false, reason: `a pure number was expected, not ${q.unit.text}` };
  } else if (base && !q.unit && baseUnit !== 'mag') {
    return { ok: false, reason: 'the number has no unit Comove knows' };
  }
  return { ok: true, value: out, unitText, formula, source, methodRelative: extra.methodRelative ?? 0, accuracy: extra.accuracy ?? null, note: extra.note ?? null };
}

function fromEpoch(e: EpochValue, q: ClaimQuestion, c: Cosmology, methodRelative: number): Recomputation {
  if (e.value === null) return { ok: false, reason: `not defined for this parameter set: ${e.note ?? e.method}` };
  return fromBase(e.value, e.unit, q, c, e.method, e.source, { methodRelative, accuracy: e.accuracy, note: e.note ?? null });
}

/**
 * Recomputes one claim under cosmology c. Never throws on user input. Results are kept per
 * parameter set (a manuscript states the same quantity at the same redshift many times, and the
 * slip search and the fit ask again).
 */
export function recompute(c: Cosmology, q: ClaimQuestion): Recomputation {
  const memo = c.memo('recompute', () => new RecomputeMemo());
  // The common question (a kind at one redshift, in a unit) is looked up without building a key:
  // a keystroke in the editor asks for every claim of the document again.
  const simple = q.zRange === null && q.angleArcsec === null && q.sinceEpoch === null && q.parameter === null;
  const byZ = simple ? memo.simpleFor(q.kind, q.unit ? q.unit.text : '') : null;
  const key = simple ? '' : `${q.kind}|${q.z}|${q.zRange}|${q.angleArcsec}|${q.sinceEpoch}|${q.parameter}|${q.unit ? q.unit.text : ''}`;
  let r = byZ ? byZ.get(q.z) : memo.other.get(key);
  if (!r) {
    try {
      r = recomputeUnchecked(c, q);
    } catch (e) {
      if (!(e instanceof CosmologyRangeError)) throw e;
      r = { ok: false, reason: e.message };
    }
    if (memo.size++ < 100_000) {
      if (byZ) byZ.set(q.z, r);
      else memo.other.set(key, r);
    }
  }
  return r;
}

/** Recomputations kept for one parameter set: simple questions by kind, unit and redshift; the rest by a key. */
class RecomputeMemo {
  readonly other = new Map<string, Recomputation>();
  private readonly simple = new Map<string, Map<string, Map<number | null, Recomputation>>>();
  size = 0;

  simpleFor(kind: string, unit: string): Map<number | null, Recomputation> {
    let byUnit = this.simple.get(kind);
    if (!byUnit) this.simple.set(kind, (byUnit = new Map()));
    let byZ = byUnit.get(unit);
    if (!byZ) byUnit.set(unit, (byZ = new Map()));
    return byZ;
  }
}

function needZ(q: ClaimQuestion): number | string {
  if (q.z === null) return 'no redshift is bound to this number';
  if (!(q.z >= 0)) return `the redshift ${q.z} is negative`;
  return q.z;
}

function recomputeUnchecked(c: Cosmology, q: ClaimQuestion): Recomputation {
  const key = PER_REDSHIFT[q.kind];
  if (key) {
    const z = needZ(q);
    if (typeof z === 'string') return { ok: false, reason: z };
    const def = findQuantity(key)!;
    const note = q.kind === 'cmbTemperature' && c.params.T_CMB === 0 ? 'the parameter set states no T_CMB: T0 = 2.72548 K (Fixsen 2009) is used' : null;
    return fromBase(def.compute(new RedshiftPoint(c, z)), def.unit, q, c, def.label, def.source, { note });
  }
  switch (q.kind) {
    case 'properScale':
    case 'comovingScale': {
      const z = needZ(q);
      if (typeof z === 'string') return { ok: false, reason: z };
      const def = findQuantity(q.kind === 'properScale' ? 'properKpcPerArcsec' : 'comovingKpcPerArcsec')!;
      const perArcsec = def.compute(new RedshiftPoint(c, z));
      if (q.angleArcsec !== null) {
        return fromBase(perArcsec * q.angleArcsec, 'kpc', q, c, `${q.kind === 'properScale' ? 'proper' : 'comoving'} size of ${q.angleArcsec}″ (θ × D_${q.kind === 'properScale' ? 'A' : 'M'})`, def.source);
      }
      return fromBase(perArcsec, 'kpc/arcsec', q, c, def.label, def.source);
    }
    case 'comovingVolume': {
      const perSolidAngle = q.unit !== null && q.unit.dimensions.angle === -2;
      let mpc3: number;
      let formula: string;
      if (q.zRange) {
        mpc3 = comovingVolumeBetween(c, q.zRange[0], q.zRange[1]);
        formula = `comoving volume between z = ${q.zRange[0]} and ${q.zRange[1]}`;
      } else {
        const z = needZ(q);
        if (typeof z === 'string') return { ok: false, reason: z };
        mpc3 = findQuantity('comovingVolume')!.compute(new RedshiftPoint(c, z)) * 1e9;
        formula = 'comoving volume within z';
      }
      if (perSolidAngle) return fromBase((mpc3 * SQUARE_DEGREE_SR) / (4 * Math.PI), 'Mpc^3 deg^-2', q, c, `${formula}, per square degree`, 'Hogg 1999, eq. 29');
      return fromBase(mpc3, 'Mpc^3', q, c, `${formula}, all sky`, 'Hogg 1999, eq. 29');
    }
    case 'hubbleLawDistance': {
      const z = needZ(q);
      if (typeof z === 'string') return { ok: false, reason: z };
      return fromBase((SPEED_OF_LIGHT_KM_S * z) / c.params.H0, 'Mpc', q, c, 'Hubble-law distance cz/H0 (not a luminosity distance)', 'Hubble law, d = cz/H0 (Hogg 1999, eq. 5, valid for z ≪ 1)');
    }
    case 'expansionFactor': {
      if (q.sinceEpoch === 'recombination') {
        const e = epochs(c).recombination;
        if (e.value === null) return { ok: false, reason: `the redshift of recombination is not defined for this set: ${e.note}` };
        return { ok: true, value: 1 + e.value, unitText: '', formula: '1 + z* (expansion since recombination)', source: e.source, methodRelative: METHOD_RELATIVE.huSugiyama, accuracy: e.accuracy, note: e.note ?? null };
      }
      const z = needZ(q);
      if (typeof z === 'string') return { ok: false, reason: z };
      return { ok: true, value: 1 + z, unitText: '', formula: '1 + z = a0/a', source: 'definition of redshift (Hogg 1999, eq. 1)', methodRelative: 0, accuracy: null, note: null };
    }
    case 'ageToday':
      return fromEpoch(epochs(c).ageToday, q, c, 0);
    case 'hubbleTime':
      return fromEpoch(epochs(c).hubbleTime, q, c, 0);
    case 'hubbleDistance':
      return fromEpoch(epochs(c).hubbleDistance, q, c, 0);
    case 'matterRadiationEquality':
      return fromEpoch(epochs(c).matterRadiationEquality, q, c, 0);
    case 'recombination':
      return fromEpoch(epochs(c).recombination, q, c, METHOD_RELATIVE.huSugiyama);
    case 'ageAtRecombination':
      // t ∝ (1+z)^(-3/2) near z*: the fit's relative error in 1+z counts 1.5 times.
      return fromEpoch(epochs(c).ageAtRecombination, q, c, 1.5 * METHOD_RELATIVE.huSugiyama);
    case 'dragEpoch':
      return fromEpoch(epochs(c).dragEpoch, q, c, METHOD_RELATIVE.eisensteinHu);
    case 'soundHorizonDrag': {
      const e = epochs(c).soundHorizonDrag;
      return fromEpoch(e, q, c, e.accuracy === ACCURACY.aubourg ? METHOD_RELATIVE.aubourg : METHOD_RELATIVE.dragIntegral);
    }
    case 'accelerationOnset':
      return fromEpoch(epochs(c).accelerationOnset, q, c, 0);
    default:
      return { ok: false, reason: `claims of kind ${q.kind} are judged against the declaration, not recomputed` };
  }
}
