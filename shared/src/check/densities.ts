/**
 * Density statements, judged algebraically against the resolved parameter set: a stated Ω or
 * ω = Ωh² against the declared one (after the declaration's own sums — Ωm + ΩΛ + Ωk = 1,
 * Ωm = Ωb + Ωc + Ων, ω = Ωh², H0 = 100 h — were checked when it was resolved), composition
 * percentages against 100 Ω, and the percentages of one sentence against 100 % in total.
 */

import type { Claim } from '../claims/claimExtractor.js';
import type { CosmologyParameters } from '../cosmology/parameters.js';
import { APPROXIMATE_RELATIVE } from './tolerance.js';

export interface DensityValue {
  readonly value: number;
  readonly formula: string;
}

/** The declared value of a parameter a density claim names, or a reason it is not known. */
export function declaredDensity(p: CosmologyParameters, parameter: string): DensityValue | string {
  const h2 = p.h * p.h;
  const omegaC = p.Omega_c ?? (p.Omega_b !== null ? p.Omega_cb - p.Omega_b : null);
  switch (parameter) {
    case 'Omega_m':
      return { value: p.Omega_m, formula: 'Ωm of the declared set' };
    case 'Omega_Lambda':
      return { value: p.Omega_Lambda, formula: 'ΩΛ of the declared set' };
    case 'Omega_k':
      return { value: p.Omega_k, formula: 'Ωk = 1 − Ωm − ΩΛ − Ωr of the declared set' };
    case 'Omega_b':
      return p.Omega_b === null ? 'the declared set does not state Ωb' : { value: p.Omega_b, formula: 'Ωb of the declared set' };
    case 'Omega_c':
      return omegaC === null ? 'the declared set does not state Ωc or Ωb' : { value: omegaC, formula: 'Ωc = Ωm − Ωb − Ων of the declared set' };
    case 'omega_b':
      return p.Omega_b === null ? 'the declared set does not state Ωb' : { value: p.Omega_b * h2, formula: 'ωb = Ωb h²' };
    case 'omega_c':
      return omegaC === null ? 'the declared set does not state Ωc or Ωb' : { value: omegaC * h2, formula: 'ωc = Ωc h²' };
    case 'omega_m_lower':
      return { value: p.Omega_m * h2, formula: 'ωm = Ωm h²' };
    case 'w0':
      return { value: p.w0, formula: 'w0 of the declared set' };
    case 'wa':
      return { value: p.wa, formula: 'wa of the declared set' };
    case 'T_CMB':
      return p.T_CMB > 0 ? { value: p.T_CMB, formula: 'T_CMB of the declared set' } : 'the declared set states no T_CMB';
    case 'N_eff':
      return { value: p.N_eff, formula: 'N_eff of the declared set' };
    case 'm_nu':
      return { value: p.m_nu, formula: 'Σmν of the declared set' };
    default:
      return `Comove does not know the parameter ${parameter}`;
  }
}

/** The declared share, in per cent, of a component named in a composition statement. */
export function declaredPercentage(p: CosmologyParameters, component: string): DensityValue | string {
  const c = component.toLowerCase();
  if (c.startsWith('baryon')) return p.Omega_b === null ? 'the declared set does not state Ωb' : { value: 100 * p.Omega_b, formula: '100 Ωb' };
  if (c === 'cold dark matter' || c === 'dark matter') {
    return p.Omega_b === null ? 'the declared set does not state Ωb, so dark matter cannot be told from matter' : { value: 100 * (p.Omega_m - p.Omega_b), formula: '100 (Ωm − Ωb)' };
  }
  if (c === 'dark energy') return { value: 100 * p.Omega_Lambda, formula: '100 ΩΛ' };
  if (c === 'matter') return { value: 100 * p.Omega_m, formula: '100 Ωm' };
  if (c === 'radiation') return { value: 100 * p.Omega_r, formula: '100 Ωr' };
  if (c.startsWith('neutrino')) return { value: 100 * p.Omega_nu, formula: '100 Ων' };
  return `Comove does not know the component "${component}"`;
}

export interface CompositionSum {
  readonly claims: readonly Claim[];
  readonly total: number;
  /** Largest total the rounding of the stated shares admits, and the smallest. */
  readonly low: number;
  readonly high: number;
}

/**
 * Composition statements of one sentence that split the whole budget (matter or baryons plus
 * dark matter, and dark energy) and do not add up to 100 % within their rounding.
 */
export function compositionSums(claims: readonly Claim[]): CompositionSum[] {
  const bySentence = new Map<number, Claim[]>();
  for (const c of claims) {
    if (c.kind !== 'compositionPercentage' || !c.parameter) continue;
    const list = bySentence.get(c.sentenceStart) ?? [];
    list.push(c);
    bySentence.set(c.sentenceStart, list);
  }
  const out: CompositionSum[] = [];
  for (const group of bySentence.values()) {
    const names = new Set(group.map((c) => c.parameter!));
    const hasDarkEnergy = names.has('dark energy');
    const hasMatter = names.has('matter') || (names.has('baryon') && (names.has('dark matter') || names.has('cold dark matter')));
    // "matter" together with its parts would count twice: no sum then.
    if (!hasDarkEnergy || !hasMatter || (names.has('matter') && names.has('baryon'))) continue;
    const total = group.reduce((s, c) => s + c.value.value, 0);
    const slack = group.reduce((s, c) => s + (c.value.qualifier === 'approximate' ? Math.max(c.value.resolution / 2, APPROXIMATE_RELATIVE * c.value.value) : c.value.resolution / 2), 0);
    // Radiation and neutrinos are a fraction of a per cent and often left out.
    const low = total - slack;
    const high = total + slack + (names.has('radiation') ? 0 : 0.5);
    if (100 < low || 100 > high) out.push({ claims: group, total, low, high });
  }
  return out;
}
