/**
 * How far a recomputed value may lie from the stated one, from what the author wrote:
 *
 * - the rounding interval of the stated digits: 6.6 Gpc stands for [6.55, 6.65];
 * - a stated uncertainty (± or asymmetric), added to the rounding interval;
 * - approximate statements (∼, ≈, "about", "roughly"): the rounding interval widened to at
 *   least ± APPROXIMATE_RELATIVE of the value — our rule, documented in the README;
 * - bounds are one-sided (< 7 Gyr admits anything up to 7.05), ranges admit both ends;
 * - then a small relative floor of the computed value on each side, for conventions that differ
 *   between careful calculators (radiation on or off, neutrino treatment), and the known
 *   accuracy of fitted formulas (epochs).
 *
 * Rounding intervals are a fact of the trade (common practice, no source).
 */

import type { StatedNumber } from '../claims/numberParser.js';

/** Half-width of an approximate statement, relative to its value. */
export const APPROXIMATE_RELATIVE = 0.05;
/** Default relative floor (0.5 %). */
export const DEFAULT_RELATIVE_FLOOR = 0.005;

export interface Interval {
  readonly low: number;
  readonly high: number;
}

export interface Judgement {
  /** What the author's statement admits, before the floor. */
  readonly stated: Interval;
  /** With the floor and the method's accuracy added. */
  readonly admitted: Interval;
  readonly consistent: boolean;
  /** True when the value is admitted only thanks to the floor or the method's accuracy. */
  readonly onlyByFloor: boolean;
  /** (stated − computed) / computed, signed. */
  readonly relativeDifference: number;
  /** How many tolerances (half-widths on the side the value falls) the computed value lies outside the stated value; 0 inside. */
  readonly tolerancesAway: number;
}

/** The interval a stated number admits (before any floor). */
export function statedInterval(n: StatedNumber): Interval {
  const half = n.resolution / 2;
  const v = n.value;
  switch (n.qualifier) {
    case 'upper-bound':
      return { low: -Infinity, high: (n.range ? n.range.high : v) + half };
    case 'lower-bound':
      return { low: (n.range ? n.range.low : v) - half, high: Infinity };
    case 'range':
      return n.range ? { low: n.range.low - half, high: n.range.high + half } : { low: v - half, high: v + half };
    case 'approximate': {
      const w = Math.max(half, APPROXIMATE_RELATIVE * Math.abs(v));
      return widenByUncertainty({ low: v - w, high: v + w }, n);
    }
    default:
      return widenByUncertainty({ low: v - half, high: v + half }, n);
  }
}

function widenByUncertainty(i: Interval, n: StatedNumber): Interval {
  if (!n.uncertainty) return i;
  return { low: i.low - n.uncertainty.minus, high: i.high + n.uncertainty.plus };
}

/**
 * Judges a computed value against a stated number. `floorAbsolute` is the floor in the claim's
 * unit (relative floor × |computed|, or its equivalent in magnitudes), `methodAbsolute` the
 * known inaccuracy of the formula used.
 */
export function judge(n: StatedNumber, stated: Interval, computed: number, floorAbsolute: number, methodAbsolute = 0): Judgement {
  const widen = floorAbsolute + methodAbsolute;
  const admitted = { low: stated.low - widen, high: stated.high + widen };
  const inStated = computed >= stated.low && computed <= stated.high;
  const consistent = computed >= admitted.low && computed <= admitted.high;
  const relativeDifference = computed === 0 ? (n.value === 0 ? 0 : Infinity) : (n.value - computed) / Math.abs(computed);
  let tolerancesAway = 0;
  if (!consistent) {
    const centre = n.value;
    const width = computed > admitted.high ? admitted.high - centre : centre - admitted.low;
    const gap = computed > admitted.high ? computed - centre : centre - computed;
    tolerancesAway = width > 0 && Number.isFinite(width) ? gap / width : Infinity;
  }
  return { stated, admitted, consistent, onlyByFloor: consistent && !inStated, relativeDifference, tolerancesAway };
}

/** Whether `value` lies in the interval widened by `floorAbsolute`. */
export function admits(stated: Interval, value: number, floorAbsolute: number): boolean {
  return value >= stated.low - floorAbsolute && value <= stated.high + floorAbsolute;
}

/** The absolute floor for a value in the claim's unit: relative for most, its magnitude equivalent for moduli. */
export function floorFor(claim: { readonly kind: string }, relativeFloor: number): (v: number) => number {
  if (claim.kind === 'distanceModulus') {
    const mag = 5 * Math.log10(1 + relativeFloor);
    return () => mag;
  }
  return (v) => relativeFloor * Math.abs(v);
}

