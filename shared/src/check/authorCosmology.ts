/**
 * Which cosmology did the author really use? Across the distance-like and time-like claims of a
 * document, the flat ΛCDM set (H0, Ωm; no radiation) that reproduces the most of them to their
 * stated precision, with the sum of squared misfits (in tolerances) to break ties, and the
 * published presets compared the same way.
 *
 * For flat ΛCDM without radiation every distance, time and scale at fixed z is (c/H0 or 1/H0)
 * times a function of Ωm, so one table per Ωm serves every H0 (Hogg 1999, eqs. 4, 15–30).
 */

import type { Claim } from '../claims/claimExtractor.js';
import { CosmologyCache, type Cosmology } from '../cosmology/cosmology.js';
import { PRESETS } from '../cosmology/presets.js';
import { questionOf, recompute } from './recompute.js';
import { DEFAULT_RELATIVE_FLOOR, floorFor, statedInterval, type Interval } from './tolerance.js';

export interface SetScore {
  readonly label: string;
  readonly H0: number | null;
  readonly Omega_m: number | null;
  /** Claims reproduced to their stated precision. */
  readonly agree: number;
  readonly of: number;
  /** Sum of squared misfits in tolerances (0 for agreeing claims). */
  readonly misfit: number;
}

export interface AuthorCosmology {
  readonly best: SetScore;
  readonly presets: readonly SetScore[];
  readonly declared: SetScore | null;
  /** The claims used (distance-, time- and scale-like, bound to a redshift, in plain units). */
  readonly used: readonly Claim[];
}

/** How H0 enters each kind: value ∝ H0^power at fixed Ωm (distance modulus: additive in log). */
const H0_POWER: Readonly<Record<string, number>> = {
  luminosityDistance: -1, angularDiameterDistance: -1, comovingDistance: -1, transverseComovingDistance: -1, lightTravelDistance: -1,
  lookbackTime: -1, age: -1, ageToday: -1, properScale: -1, comovingScale: -1, hubbleParameter: 1, comovingVolume: -3, hubbleTime: -1, hubbleDistance: -1,
  distanceModulus: 0,
};

/**
 * The search: a coarse grid (Ωm step 0.02, H0 step 1) over the plausible range, then a fine
 * grid (0.005, 0.1) around the best coarse point. The fine steps are below the precision of
 * three-digit statements.
 */
const SEARCH = {
  omega: { min: 0.05, max: 0.6, coarse: 0.02, fine: 0.005 },
  h0: { min: 50, max: 90, coarse: 1, fine: 0.1 },
};
/** At most this many claims enter the fit (evenly spaced through the document). */
export const MAX_FIT_CLAIMS = 200;

function usable(c: Claim): boolean {
  if (c.unchecked || !(c.kind in H0_POWER)) return false;
  const u = c.value.unit?.unit;
  if (u && (u.hPower !== 0 || u.h70Power !== 0)) return false; // h-scaled values do not depend on H0
  return c.kind === 'distanceModulus' || u !== null && u !== undefined;
}

interface Prepared {
  claim: Claim;
  interval: Interval;
  floor: (v: number) => number;
}

function misfit(p: Prepared, v: number): number {
  const f = p.floor(v);
  const low = p.interval.low - f;
  const high = p.interval.high + f;
  if (v >= low && v <= high) return 0;
  const centre = p.claim.value.value;
  const width = v > high ? high - centre : centre - low;
  const d = (v > high ? v - centre : centre - v) / Math.max(width, 1e-12);
  return d * d;
}

function score(prepared: readonly Prepared[], values: ReadonlyArray<number | null>, label: string, H0: number | null, Omega_m: number | null): SetScore {
  let agree = 0;
  let of = 0;
  let sum = 0;
  for (let i = 0; i < prepared.length; i++) {
    const v = values[i];
    if (v === null) continue;
    of++;
    const m = misfit(prepared[i], v);
    if (m === 0) agree++;
    sum += Math.min(m, 1e4);
  }
  return { label, H0, Omega_m, agree, of, misfit: sum };
}

function better(a: SetScore, b: SetScore | null): boolean {
  return !b || a.agree > b.agree || (a.agree === b.agree && a.misfit < b.misfit);
}

/**
 * Fits the set the claims agree with best. Returns null with fewer than `minimumClaims` usable
 * claims. `declared` is the document's own set, scored the same way for comparison.
 */
export function fitAuthorCosmology(claims: readonly Claim[], options: { declared?: Cosmology | null; cache?: CosmologyCache; relativeFloor?: number; minimumClaims?: number } = {}): AuthorCosmology | null {
  const all = claims.filter(usable);
  if (all.length < (options.minimumClaims ?? 3)) return null;
  const stride = Math.max(1, all.length / MAX_FIT_CLAIMS);
  const used = all.length <= MAX_FIT_CLAIMS ? all : Array.from({ length: MAX_FIT_CLAIMS }, (_, i) => all[Math.floor(i * stride)]);
  const cache = options.cache ?? new CosmologyCache(64);
  const floor = options.relativeFloor ?? DEFAULT_RELATIVE_FLOOR;
  const prepared: Prepared[] = used.map((claim) => ({ claim, interval: statedInterval(claim.value), floor: floorFor(claim, floor) }));
  const valuesUnder = (c: Cosmology) => prepared.map((p) => {
    const r = recompute(c, questionOf(p.claim));
    return r.ok ? r.value : null;
  });

  const scoreGrid = (omegas: readonly number[], h0s: readonly number[], best: SetScore | null): SetScore | null => {
    for (const om of omegas) {
      // Reference values at H0 = 100; other H0 by scaling (no radiation, so exact).
      const made = cache.get({ H0: 100, Omega_m: om, flat: true });
      if (!made.ok) continue;
      const ref = valuesUnder(made.cosmology);
      const scaled: Array<number | null> = new Array(ref.length);
      for (const h0 of h0s) {
        const ratio = h0 / 100;
        for (let j = 0; j < ref.length; j++) {
          const r = ref[j];
          const kind = prepared[j].claim.kind;
          scaled[j] = r === null ? null : kind === 'distanceModulus' ? r - 5 * Math.log10(ratio) : r * ratio ** H0_POWER[kind];
        }
        const s = score(prepared, scaled, '', h0, om);
        if (better(s, best)) best = { ...s, label: `flat ΛCDM, H0 = ${h0}, Ωm = ${om}` };
      }
    }
    return best;
  };
  const steps = (min: number, max: number, step: number) => Array.from({ length: Math.round((max - min) / step) + 1 }, (_, i) => +(min + i * step).toFixed(4));
  const coarse = scoreGrid(steps(SEARCH.omega.min, SEARCH.omega.max, SEARCH.omega.coarse), steps(SEARCH.h0.min, SEARCH.h0.max, SEARCH.h0.coarse), null)!;
  const best = scoreGrid(
    steps(Math.max(SEARCH.omega.min, coarse.Omega_m! - SEARCH.omega.coarse), Math.min(SEARCH.omega.max, coarse.Omega_m! + SEARCH.omega.coarse), SEARCH.omega.fine),
    steps(Math.max(SEARCH.h0.min, coarse.H0! - SEARCH.h0.coarse), Math.min(SEARCH.h0.max, coarse.H0! + SEARCH.h0.coarse), SEARCH.h0.fine),
    coarse,
  );
  const presets: SetScore[] = [];
  for (const preset of PRESETS) {
    const made = cache.get(preset.input);
    if (made.ok) presets.push(score(prepared, valuesUnder(made.cosmology), preset.name, made.cosmology.params.H0, made.cosmology.params.Omega_m));
  }
  presets.sort((a, b) => (better(a, b) ? -1 : better(b, a) ? 1 : 0));
  const declared = options.declared ? score(prepared, valuesUnder(options.declared), 'declared', options.declared.params.H0, options.declared.params.Omega_m) : null;
  return { best: best!, presets, declared, used };
}

/**
 * The document-level sentence about the fit, or null when the declared set already reproduces
 * the numbers about as well as anything else.
 */
export function describeAuthorCosmology(fit: AuthorCosmology, declaredText: string | null): string | null {
  const { best, declared } = fit;
  const bestText = `H0 = ${best.H0}, Ωm = ${best.Omega_m} (flat ΛCDM)`;
  const preset = fit.presets[0];
  const presetText = preset && preset.agree > 0 && preset.agree >= best.agree - 1 && (!declared || preset.agree > declared.agree)
    ? `; the ${preset.label} preset reproduces ${preset.agree} of ${preset.of}`
    : '';
  if (!declared || declaredText === null) {
    return `${best.agree} of ${best.of} distance- and time-like numbers agree with ${bestText} to their stated precision${presetText}; the manuscript declares no parameter set`;
  }
  if (best.agree - declared.agree < Math.max(2, 0.2 * best.of)) return null;
  return `${best.agree} of ${best.of} distance- and time-like numbers agree with ${bestText} to their stated precision${presetText}; the manuscript declares ${declaredText} (${declared.agree} of ${declared.of} agree)`;
}
