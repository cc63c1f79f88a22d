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
import { floorFor } from './checker.js';
import { questionOf, recompute } from './recompute.js';
import { DEFAULT_RELATIVE_FLOOR, statedInterval, type Interval } from './tolerance.js';

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

const GRID = {
  omegaMin: 0.05, omegaMax: 0.6, omegaStep: 0.005,
  h0Min: 50, h0Max: 90, h0Step: 0.1,
};

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
  prepared.forEach((p, i) => {
    const v = values[i];
    if (v === null) return;
    of++;
    const m = misfit(p, v);
    if (m === 0) agree++;
    sum += Math.min(m, 1e4);
  });
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
  const used = claims.filter(usable);
  if (used.length < (options.minimumClaims ?? 3)) return null;
  const cache = options.cache ?? new CosmologyCache(8);
  const floor = options.relativeFloor ?? DEFAULT_RELATIVE_FLOOR;
  const prepared: Prepared[] = used.map((claim) => ({ claim, interval: statedInterval(claim.value), floor: floorFor(claim, floor) }));
  const valuesUnder = (c: Cosmology) => prepared.map((p) => {
    const r = recompute(c, questionOf(p.claim));
    return r.ok ? r.value : null;
  });

  let best: SetScore | null = null;
  const nOmega = Math.round((GRID.omegaMax - GRID.omegaMin) / GRID.omegaStep);
  const nH0 = Math.round((GRID.h0Max - GRID.h0Min) / GRID.h0Step);
  for (let i = 0; i <= nOmega; i++) {
    const om = +(GRID.omegaMin + i * GRID.omegaStep).toFixed(4);
    // Reference values at H0 = 100; other H0 by scaling (no radiation, so exact).
    const made = cache.get({ H0: 100, Omega_m: om, flat: true });
    if (!made.ok) continue;
    const ref = valuesUnder(made.cosmology);
    const scaled: Array<number | null> = new Array(ref.length);
    for (let k = 0; k <= nH0; k++) {
      const h0 = +(GRID.h0Min + k * GRID.h0Step).toFixed(2);
      const ratio = h0 / 100;
      for (let j = 0; j < ref.length; j++) {
        const r = ref[j];
        const kind = prepared[j].claim.kind;
        scaled[j] = r === null ? null : kind === 'distanceModulus' ? r - 5 * Math.log10(ratio) : r * ratio ** H0_POWER[kind];
      }
      const s = score(prepared, scaled, `flat ΛCDM, H0 = ${h0}, Ωm = ${om}`, h0, om);
      if (better(s, best)) best = s;
    }
  }
  const presets: SetScore[] = [];
  for (const preset of PRESETS) {
    const made = cache.get(preset.input);
    if (made.ok) presets.push(score(prepared, valuesUnder(made.cosmology), preset.name, made.cosmology.params.H0, made.cosmology.params.Omega_m));
  }
  presets.sort((a, b) => (better(a, b) ? -1 : better(b, a) ? 1 : 0));
  const declared = options.declared ? score(prepared, valuesUnder(options.declared), 'declared', options.declared.params.H0, options.declared.params.Omega_m) : null;
  return { best: best!, presets, declared, used };
}
