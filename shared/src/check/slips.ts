/**
 * Diagnosis of an inconsistent claim: the usual slips, each tried in turn, and the one whose
 * value the author's statement admits is named. The slips are the ones that happen in drafts
 * (common practice, no source): one distance quoted for another, proper and comoving scales
 * swapped, lookback time for age, h⁻¹ dropped or applied twice, a factor of 1000 (Mpc/Gpc,
 * kpc/Mpc, Myr/Gyr), the value of a neighbouring redshift in the same sentence, and a value
 * computed with a published parameter set other than the declared one.
 */

import type { ClaimKind } from '../claims/claimKinds.js';
import type { StatedNumber } from '../claims/numberParser.js';
import type { Cosmology, CosmologyCache } from '../cosmology/cosmology.js';
import { PRESETS, type Preset } from '../cosmology/presets.js';
import { recompute, type ClaimQuestion } from './recompute.js';
import { admits, type Interval } from './tolerance.js';

export type SlipId =
  | 'swapped-quantity'
  | 'h-dropped'
  | 'h-applied-twice'
  | 'factor-1000'
  | 'neighbouring-redshift'
  | 'other-parameter-set';

export interface Slip {
  readonly id: SlipId;
  /** One sentence for the author. */
  readonly description: string;
  /** What the slip gives, in the claim's unit. */
  readonly value: number;
  /** For a swapped quantity: the kind that reproduces the value. For another set: the preset's name. */
  readonly detail: string | null;
}

const LABEL: Partial<Record<ClaimKind, string>> = {
  luminosityDistance: 'luminosity distance',
  angularDiameterDistance: 'angular-diameter distance',
  comovingDistance: 'line-of-sight comoving distance',
  transverseComovingDistance: 'transverse comoving distance',
  lightTravelDistance: 'light-travel distance',
  hubbleLawDistance: 'Hubble-law distance cz/H0',
  lookbackTime: 'lookback time',
  age: 'age of the universe at that redshift',
  ageToday: 'age of the universe today',
  hubbleTime: 'Hubble time 1/H0',
  properScale: 'proper scale',
  comovingScale: 'comoving scale',
};

const DISTANCES: readonly ClaimKind[] = ['luminosityDistance', 'angularDiameterDistance', 'comovingDistance', 'transverseComovingDistance', 'lightTravelDistance', 'hubbleLawDistance'];

/** Quantities one may have been quoted for another. */
function swapsFor(kind: ClaimKind): readonly ClaimKind[] {
  if (DISTANCES.includes(kind)) return DISTANCES.filter((k) => k !== kind);
  switch (kind) {
    case 'lookbackTime':
      return ['age'];
    case 'age':
      return ['lookbackTime'];
    case 'ageToday':
      return ['hubbleTime'];
    case 'hubbleTime':
      return ['ageToday'];
    case 'properScale':
      return ['comovingScale'];
    case 'comovingScale':
      return ['properScale'];
    default:
      return [];
  }
}

export interface SlipContext {
  readonly cosmology: Cosmology;
  readonly question: ClaimQuestion;
  readonly stated: StatedNumber;
  readonly interval: Interval;
  readonly computed: number;
  /** Absolute floor for a value v in the claim's unit. */
  readonly floor: (v: number) => number;
  /** Other redshifts named in the claim's sentence. */
  readonly neighbouringRedshifts: readonly number[];
  /** The published sets to try, built once per document (presetSets). */
  readonly presets: ReadonlyArray<{ readonly preset: Preset; readonly cosmology: Cosmology }>;
}

/** The presets, built (through the caller's cache) for the slip search. */
export function presetSets(cache: CosmologyCache): Array<{ preset: Preset; cosmology: Cosmology }> {
  const out: Array<{ preset: Preset; cosmology: Cosmology }> = [];
  for (const preset of PRESETS) {
    const made = cache.get(preset.input);
    if (made.ok) out.push({ preset, cosmology: made.cosmology });
  }
  return out;
}

/** The slip that reproduces the stated value, or null. Tried in order; the first that fits wins. */
export function diagnose(ctx: SlipContext): Slip | null {
  const { question: q, cosmology: c } = ctx;
  const fits = (v: number) => Number.isFinite(v) && admits(ctx.interval, v, ctx.floor(v));
  const valueOf = (question: ClaimQuestion, cosmo: Cosmology = c): number | null => {
    const r = recompute(cosmo, question);
    return r.ok ? r.value : null;
  };
  const kindLabel = LABEL[q.kind] ?? q.kind;

  // Distance moduli from the wrong distance.
  if (q.kind === 'distanceModulus' && q.z !== null) {
    // μ = 5 log10(D/10 pc): D_A = D_L/(1+z)², D_M = D_L/(1+z) (Hogg 1999, eqs. 18, 21, 25).
    for (const [other, factor] of [['angularDiameterDistance', 1 / (1 + q.z) ** 2], ['comovingDistance', 1 / (1 + q.z)]] as const) {
      const v = ctx.computed + 5 * Math.log10(factor);
      if (fits(v)) return { id: 'swapped-quantity', description: `the distance modulus was computed from the ${LABEL[other]} instead of the luminosity distance`, value: v, detail: other };
    }
  }

  for (const other of swapsFor(q.kind)) {
    const v = valueOf({ ...q, kind: other });
    if (v !== null && fits(v)) {
      return { id: 'swapped-quantity', description: `the stated value is the ${LABEL[other] ?? other}, not the ${kindLabel}`, value: v, detail: other };
    }
  }

  // h: a length to the power n carries h^n between "h⁻¹ Mpc" and "Mpc".
  const lengthPower = q.unit?.dimensions.length ?? 0;
  if (lengthPower !== 0) {
    const h = c.params.h;
    const scaled = ctx.computed * h ** lengthPower; // the value in h⁻ⁿ units, as if the unit said so
    const unscaled = ctx.computed / h ** lengthPower;
    const hInUnit = (q.unit?.hPower ?? 0) !== 0;
    if (fits(hInUnit ? unscaled : scaled)) {
      return hInUnit
        ? { id: 'h-applied-twice', description: 'the number is the value in plain units although the unit says h⁻¹: h⁻¹ is applied twice (or the number was not multiplied by h)', value: unscaled, detail: null }
        : { id: 'h-dropped', description: `the number is the value in h⁻¹ units (h = ${h.toPrecision(3)}), but the unit written has no h: the h⁻¹ was dropped`, value: scaled, detail: null };
    }
    if (fits(hInUnit ? scaled : unscaled)) {
      return { id: 'h-applied-twice', description: `the number is off by a factor of h = ${h.toPrecision(3)}: h was applied twice or in the wrong direction`, value: hInUnit ? scaled : unscaled, detail: null };
    }
  }

  for (const f of [1000, 1 / 1000]) {
    const v = ctx.computed * f;
    if (q.unit && fits(v)) {
      return { id: 'factor-1000', description: `the number is ${f > 1 ? 'a thousand times' : 'a thousandth of'} the recomputed value: a unit slip (Mpc/Gpc, kpc/Mpc or Myr/Gyr)`, value: v, detail: null };
    }
  }

  if (q.z !== null) {
    for (const z of ctx.neighbouringRedshifts) {
      if (z === q.z) continue;
      const v = valueOf({ ...q, z });
      if (v !== null && fits(v)) {
        return { id: 'neighbouring-redshift', description: `the stated value is the ${kindLabel} at z = ${z}, the other redshift in this sentence`, value: v, detail: String(z) };
      }
    }
  }

  for (const { preset, cosmology } of ctx.presets) {
    if (sameSet(cosmology, c)) continue;
    const v = valueOf(q, cosmology);
    if (v !== null && fits(v)) {
      return { id: 'other-parameter-set', description: `the stated value is what the ${preset.title} parameter set (${preset.name}) gives, not the declared set`, value: v, detail: preset.name };
    }
  }
  return null;
}

function sameSet(a: Cosmology, b: Cosmology): boolean {
  const p = a.params;
  const r = b.params;
  return p.H0 === r.H0 && p.Omega_m === r.Omega_m && p.Omega_Lambda === r.Omega_Lambda && p.T_CMB === r.T_CMB && p.w0 === r.w0 && p.wa === r.wa;
}
