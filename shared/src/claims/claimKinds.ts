/**
 * The kinds of cosmology-dependent claims, what each is computed as, and the words and symbols
 * that announce it in a sentence. (The cue words are facts of the trade: how papers name these
 * quantities; no source.)
 */

import type { BaseDimension } from '../cosmology/units.js';

export type ClaimKind =
  | 'luminosityDistance'
  | 'angularDiameterDistance'
  | 'comovingDistance'
  | 'transverseComovingDistance'
  | 'lightTravelDistance'
  | 'hubbleLawDistance'
  | 'distanceModulus'
  | 'lookbackTime'
  | 'age'
  | 'ageToday'
  | 'properScale'
  | 'comovingScale'
  | 'hubbleParameter'
  | 'hubbleTime'
  | 'hubbleDistance'
  | 'comovingVolume'
  | 'cmbTemperature'
  | 'expansionFactor'
  | 'densityParameter'
  | 'compositionPercentage'
  | 'matterRadiationEquality'
  | 'recombination'
  | 'dragEpoch'
  | 'soundHorizonDrag'
  | 'ageAtRecombination'
  | 'accelerationOnset'
  | 'growthRate'
  | 'growthFactor';

/** Whether a kind needs a redshift: per-z quantities do, epochs and today's values do not. */
export const NEEDS_REDSHIFT: ReadonlySet<ClaimKind> = new Set<ClaimKind>([
  'luminosityDistance', 'angularDiameterDistance', 'comovingDistance', 'transverseComovingDistance', 'lightTravelDistance',
  'hubbleLawDistance', 'distanceModulus', 'lookbackTime', 'age', 'properScale', 'comovingScale', 'hubbleParameter',
  'comovingVolume', 'cmbTemperature', 'expansionFactor', 'growthRate', 'growthFactor',
]);

/** Cues, tried in order: the first whose pattern matches the clause before (or just after) the number wins. */
export interface KindCue {
  readonly kind: ClaimKind;
  readonly pattern: RegExp;
  /** The dimension the stated unit must have (null: a pure number). */
  readonly dimension: Partial<Record<BaseDimension, number>> | null;
}

const LENGTH = { length: 1 };
const TIME = { time: 1 };

export const KIND_CUES: readonly KindCue[] = [
  { kind: 'hubbleTime', pattern: /Hubble time|\b1\s*\/\s*H_?0|H_?0\s*\^\s*-1|\bt_?H\b/i, dimension: TIME },
  { kind: 'hubbleDistance', pattern: /Hubble (?:distance|radius|length)|\bc\s*\/\s*H_?0(?!\s*=\s*[\d.]+\s*(?:Mpc|Gpc)?\s*(?:at|for) z)|\bD_?H\b/i, dimension: LENGTH },
  { kind: 'hubbleLawDistance', pattern: /Hubble[- ](?:flow|law) distance|cz\s*\/\s*H_?0|recession velocity/i, dimension: LENGTH },
  { kind: 'luminosityDistance', pattern: /luminosity distance|\bD_?L\b|\bd_?L\b|\bD_\{?L\}?|\bD_\{?lum/i, dimension: LENGTH },
  { kind: 'angularDiameterDistance', pattern: /angular[- ]diameter distance|\bD_?A\b|\bd_?A\b/i, dimension: LENGTH },
  { kind: 'transverseComovingDistance', pattern: /transverse comoving distance|\bD_?M\b/, dimension: LENGTH },
  { kind: 'lightTravelDistance', pattern: /light[- ]travel(?:\s*time)? distance|lookback distance/i, dimension: LENGTH },
  { kind: 'comovingDistance', pattern: /comoving (?:radial |line[- ]of[- ]sight )?distance|\bD_?C\b|\bχ\b/i, dimension: LENGTH },
  { kind: 'distanceModulus', pattern: /distance modul(?:us|i)|\bm\s*[-−]\s*M\b|\bμ\b|\bdm\b|\bDM\b/i, dimension: { magnitude: 1 } },
  { kind: 'ageAtRecombination', pattern: /recombination|decoupling|last[- ]scattering|CMB was (?:emitted|released)/i, dimension: TIME },
  { kind: 'lookbackTime', pattern: /look[- ]?back|light (?:left|was emitted|has travell?ed)|\bago\b|in the (?:last|past)|over the (?:last|past)|t_?lb|t_\{?lb|t_L\b/i, dimension: TIME },
  { kind: 'ageToday', pattern: /(?:present|current)(?:-day)? age|age of the universe (?:today|now)|universe is (?:now |today |currently )?(?:about |roughly |some |∼ ?|≈ ?)?$|\bt_?0\b|\bt_\{?0\}?/i, dimension: TIME },
  { kind: 'age', pattern: /\bage\b|universe was|years old|cosmic time|old\b|when the universe|t\(z/i, dimension: TIME },
  { kind: 'hubbleParameter', pattern: /H\s*\(\s*z|Hubble (?:parameter|rate|expansion rate)/i, dimension: { time: -1 } },
  { kind: 'comovingVolume', pattern: /volume/i, dimension: { length: 3 } },
  { kind: 'cmbTemperature', pattern: /CMB|microwave background|radiation temperature|T_?CMB|universe was|background temperature/i, dimension: { temperature: 1 } },
  { kind: 'soundHorizonDrag', pattern: /r_?d(?:rag)?\b|r_\{?d|r_s\s*\(?\s*z_d|sound horizon/i, dimension: LENGTH },
];

/** Cues for claims stated as pure numbers (no unit). */
export const PURE_NUMBER_CUES: ReadonlyArray<{ kind: ClaimKind; pattern: RegExp }> = [
  { kind: 'matterRadiationEquality', pattern: /z_?eq|z_\{?eq|matter[- ]radiation equality|equality/i },
  { kind: 'dragEpoch', pattern: /z_?d(?:rag)?\b|z_\{?d(?:rag)?|drag epoch/i },
  { kind: 'recombination', pattern: /z_?\*|z_\{?\*|z_?rec|z_?dec|recombination|decoupling|last[- ]scattering/i },
  { kind: 'accelerationOnset', pattern: /accelerat|z_?acc|q\s*=\s*0|transition redshift|z_?t\b/i },
  { kind: 'growthRate', pattern: /growth rate|f\s*\(\s*z|\bf\s*=/i },
  { kind: 'growthFactor', pattern: /growth factor|D\s*\(\s*z|\bD_?\+/i },
  { kind: 'expansionFactor', pattern: /expanded|expansion factor|factor of|fold|times (?:larger|bigger)|1\s*\+\s*z/i },
  { kind: 'distanceModulus', pattern: /\bdm\b|distance modul(?:us|i)|\bm\s*[-−]\s*M\b|\bμ\b|\bDM\b/i },
];
