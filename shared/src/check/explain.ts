/**
 * The explanation of a verdict, in Markdown, for hovers and reports: the stated value and what
 * it admits, the recomputed value to one more digit than stated, the formula and its source,
 * the parameter set with a link to where it was declared, the slip found, and for fitted epoch
 * formulas the method's known accuracy.
 */

import type { ClaimKind } from '../claims/claimKinds.js';
import type { ClaimCheck } from './checker.js';

const KIND_TITLE: Record<ClaimKind, string> = {
  luminosityDistance: 'Luminosity distance',
  angularDiameterDistance: 'Angular-diameter distance',
  comovingDistance: 'Comoving distance (line of sight)',
  transverseComovingDistance: 'Transverse comoving distance',
  lightTravelDistance: 'Light-travel distance',
  hubbleLawDistance: 'Hubble-law distance',
  distanceModulus: 'Distance modulus',
  lookbackTime: 'Lookback time',
  age: 'Age of the universe',
  ageToday: 'Age of the universe today',
  properScale: 'Proper scale',
  comovingScale: 'Comoving scale',
  hubbleParameter: 'Hubble parameter H(z)',
  hubbleTime: 'Hubble time',
  hubbleDistance: 'Hubble distance',
  comovingVolume: 'Comoving volume',
  cmbTemperature: 'CMB temperature',
  expansionFactor: 'Expansion factor',
  densityParameter: 'Density parameter',
  compositionPercentage: 'Share of the energy budget',
  matterRadiationEquality: 'Matter–radiation equality',
  recombination: 'Redshift of recombination',
  dragEpoch: 'Redshift of the drag epoch',
  soundHorizonDrag: 'Sound horizon at the drag epoch',
  ageAtRecombination: 'Age at recombination',
  accelerationOnset: 'Onset of acceleration',
  growthRate: 'Growth rate f',
  growthFactor: 'Growth factor D',
};

export function kindTitle(kind: ClaimKind): string {
  return KIND_TITLE[kind];
}

/** A number to `digits` significant digits, without exponent noise for ordinary magnitudes. */
export function significant(value: number, digits: number): string {
  if (!Number.isFinite(value)) return String(value);
  const d = Math.min(15, Math.max(1, digits));
  const a = Math.abs(value);
  if (a !== 0 && (a >= 1e7 || a < 1e-4)) return value.toExponential(d - 1).replace('e+', 'e');
  // Trailing zeros are digits too (11.00 Gyr), unless toPrecision would switch to an exponent (12000).
  const s = value.toPrecision(d);
  return s.includes('e') ? String(Number(s)) : s;
}

function withUnit(v: string, unit: string): string {
  if (!unit) return v;
  return unit === '%' ? `${v} %` : `${v} ${unit}`;
}

function intervalText(low: number, high: number, unit: string, digits: number): string {
  if (low === -Infinity) return `up to ${withUnit(significant(high, digits), unit)}`;
  if (high === Infinity) return `at least ${withUnit(significant(low, digits), unit)}`;
  return `${significant(low, digits)} – ${withUnit(significant(high, digits), unit)}`;
}

/** Where the claim is about: "at z = 0.85", "between z = 1 and 2", "since recombination". */
export function whereText(check: ClaimCheck): string {
  const c = check.claim;
  if (c.zRange) return ` between z = ${c.zRange[0]} and ${c.zRange[1]}`;
  if (c.z !== null) return ` at z = ${c.z}`;
  if (c.sinceEpoch) return ` since ${c.sinceEpoch}`;
  if (c.parameter) return ` (${c.parameter})`;
  return '';
}

/** The first line of an explanation, plain: "Luminosity distance at z = 0.48 — consistent". */
export function headline(check: ClaimCheck): string {
  return `${kindTitle(check.claim.kind)}${whereText(check)} — ${check.status}`;
}

/** The Markdown explanation of one verdict. `declaredAt` turns a parameter choice into a link text. */
export function explain(check: ClaimCheck, declaredAt: (uri: string, line: number) => string = (uri, line) => `${uri}, line ${line + 1}`): string {
  const c = check.claim;
  const n = c.value;
  const unit = check.unitText;
  const lines: string[] = [`**${kindTitle(c.kind)}**${whereText(check)} — **${check.status}**`, ''];
  lines.push(`- Stated: ${withUnit(n.text, unit)}${check.interval ? ` (admits ${intervalText(check.interval.low, check.interval.high, unit, n.significantDigits + 1)})` : ''}`);
  if (check.status === 'unchecked') {
    lines.push(`- Not checked: ${check.reason}`);
  } else if (check.computed !== null) {
    const digits = n.significantDigits + 1;
    let line = `- Recomputed: ${withUnit(significant(check.computed, digits), unit)}`;
    if (check.status === 'inconsistent' && check.relativeDifference !== null) {
      const pct = 100 * check.relativeDifference;
      line += ` — the stated value is ${significant(Math.abs(pct), 2)} % ${pct > 0 ? 'higher' : 'lower'}`;
      if (check.tolerancesAway !== null && Number.isFinite(check.tolerancesAway)) line += `, ${significant(check.tolerancesAway, 2)} tolerances away`;
    }
    lines.push(line);
    if (check.onlyByFloor) lines.push(`- Passes only within the relative floor or the method's accuracy (admitted ${intervalText(check.admitted!.low, check.admitted!.high, unit, digits + 1)})`);
    lines.push(`- Formula: ${check.formula} — ${check.source}`);
    if (check.accuracy) lines.push(`- Method accuracy: ${check.accuracy}`);
    if (check.note) lines.push(`- Note: ${check.note}`);
  }
  const p = check.parameters;
  if (p) {
    const where = p.origin === 'override' ? 'given on the command line or in the settings' : p.origin === 'default' ? 'the default set from the settings (the manuscript declares none)' : p.uri && p.line !== undefined && p.line !== null ? `declared in ${declaredAt(p.uri, p.line)}${p.origin === 'inherited' ? ' (the including file)' : p.origin === 'other-model' ? " (another model's set, scoped to its section)" : p.origin === 'local' ? ' (local override)' : ''}` : 'declared in the manuscript';
    lines.push(`- Parameters: \`${p.text || '(none usable)'}\`, ${where}`);
  }
  if (check.slip) lines.push(`- Likely slip: ${check.slip.description} (${withUnit(significant(check.slip.value, n.significantDigits + 1), unit)})`);
  if (check.fix) lines.push(`- Fix: write ${check.fix.newText} instead`);
  else if (check.fixUnavailable && check.status === 'inconsistent') lines.push(`- No automatic fix: ${check.fixUnavailable}`);
  return lines.join('\n');
}
