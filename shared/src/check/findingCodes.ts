/**
 * Stable codes for every kind of finding, shared by the command line (SARIF rules), the
 * language server (diagnostic codes) and the reports. The codes are ours; never renumber.
 */

import type { FindingCode } from './checker.js';

export type RuleName = 'inconsistent-value' | 'unchecked-claim' | 'reading-problem' | FindingCode;

export interface Rule {
  readonly id: string;
  readonly name: RuleName;
  readonly summary: string;
  readonly description: string;
}

export const RULES: readonly Rule[] = [
  { id: 'CMV101', name: 'inconsistent-value', summary: 'A number disagrees with the declared cosmology', description: 'The value recomputed under the declared parameter set lies outside what the stated digits, uncertainty or qualifier admit, plus the relative floor.' },
  { id: 'CMV102', name: 'unchecked-claim', summary: 'A cosmology-dependent number could not be checked', description: 'The number depends on the cosmology but its redshift, unit or parameter set is missing or ambiguous.' },
  { id: 'CMV201', name: 'no-declaration', summary: 'No parameter set is declared', description: 'The manuscript states cosmology-dependent numbers but declares no parameter set for them.' },
  { id: 'CMV202', name: 'declaration-unusable', summary: 'The declared parameter set cannot be used', description: 'The declaration is incomplete (an injected value, an unknown named set) or its parameters are not a valid set.' },
  { id: 'CMV203', name: 'declaration-conflict', summary: 'Declarations conflict', description: 'Two declarations in the manuscript give different values to the same parameter.' },
  { id: 'CMV204', name: 'composition-sum', summary: 'Energy-budget shares do not add up to 100 %', description: 'The composition percentages of one sentence do not sum to 100 % within their rounding.' },
  { id: 'CMV205', name: 'author-cosmology', summary: 'The numbers agree better with another parameter set', description: 'Fitting flat ΛCDM to the distance- and time-like numbers finds a parameter set that reproduces clearly more of them than the declared one.' },
  { id: 'CMV301', name: 'reading-problem', summary: 'The manuscript could not be read cleanly', description: 'Unbalanced braces or math, a missing included file, a binary or oversized file.' },
];

const BY_NAME = new Map(RULES.map((r) => [r.name, r]));

export function ruleFor(name: RuleName): Rule {
  return BY_NAME.get(name)!;
}
