/**
 * Cosmological parameter sets: what a manuscript (or a user) states, and the complete,
 * validated set the engine computes with.
 *
 * Conventions (stated in the README):
 * - Ωm counts all matter that is non-relativistic today, massive neutrinos included:
 *   Ωm = Ωc + Ωb + Ων with Ων h² = Σmν / 93.14 eV (Planck 2018 VI convention).
 * - Σmν sits in one massive eigenstate; the rest of N_eff is massless (neutrinos.ts).
 * - Without `flat`, Ωk or ΩΛ, the model is taken to be flat and that is recorded as assumed.
 * - Radiation is absent (T_CMB = 0) unless T_CMB is stated; with T_CMB stated, N_eff defaults to 3.046.
 */

import {
  NEUTRINO_MASS_PER_OMEGA_H2_EV,
  STANDARD_N_EFF,
  photonDensityParameter,
} from './constants.js';
import { Expansion } from './expansion.js';
import { createNeutrinoModel, masslessNeutrinoDensityToday, neutrinoDensity, type NeutrinoModel } from './neutrinos.js';

/** Keys of the declaration syntax, in the trade's symbols. */
export type ParameterKey =
  | 'H0'
  | 'h'
  | 'Omega_m'
  | 'Omega_b'
  | 'Omega_c'
  | 'omega_b'
  | 'omega_c'
  | 'Omega_Lambda'
  | 'Omega_k'
  | 'w0'
  | 'wa'
  | 'T_CMB'
  | 'N_eff'
  | 'm_nu';

/** What was stated: any subset of the parameters, plus the word `flat`. */
export type ParameterInput = Partial<Record<ParameterKey, number>> & { flat?: boolean };

/** A complete, validated parameter set. All densities are today's, relative to the critical density. */
export interface CosmologyParameters {
  /** Hubble constant, km s⁻¹ Mpc⁻¹. */
  readonly H0: number;
  /** H0 / (100 km s⁻¹ Mpc⁻¹). */
  readonly h: number;
  /** All matter non-relativistic today, massive neutrinos included (Planck convention). */
  readonly Omega_m: number;
  /** Baryons, if known. */
  readonly Omega_b: number | null;
  /** Cold dark matter, if known. */
  readonly Omega_c: number | null;
  /** Cold dark matter plus baryons: Ωm − Ων. */
  readonly Omega_cb: number;
  /** Massive-neutrino share of Ωm: Σmν / (93.14 eV h²). */
  readonly Omega_nu_mass: number;
  /** Photons, from T_CMB. */
  readonly Omega_gamma: number;
  /** All neutrinos today as the model evaluates them (Komatsu et al. 2011 fit). */
  readonly Omega_nu: number;
  /** Radiation today: photons plus massless neutrinos. */
  readonly Omega_r: number;
  /** Dark energy (a cosmological constant when w0 = −1, wa = 0). */
  readonly Omega_Lambda: number;
  /** Curvature, 1 − (sum of all others). */
  readonly Omega_k: number;
  readonly w0: number;
  readonly wa: number;
  /** CMB temperature today, K (0: no radiation). */
  readonly T_CMB: number;
  readonly N_eff: number;
  /** Sum of neutrino masses, eV. */
  readonly m_nu: number;
  /** Whether flatness was imposed (stated or assumed). */
  readonly flat: boolean;
  /** Keys that were stated. */
  readonly stated: readonly string[];
  /** Keys whose values were assumed (defaults), with the value used. */
  readonly assumed: readonly string[];
}

/** A problem with one parameter, naming it. */
export interface ParameterError {
  readonly parameter: string;
  readonly message: string;
}

export type ResolveResult =
  | { readonly ok: true; readonly params: CosmologyParameters; readonly neutrinos: NeutrinoModel }
  | { readonly ok: false; readonly errors: readonly ParameterError[] };

/** How far stated values that are also derivable may disagree before they conflict (density units). */
export const DENSITY_CONSISTENCY_TOLERANCE = 0.01;
/** Relative disagreement allowed between a stated H0 and a stated h. */
export const HUBBLE_CONSISTENCY_TOLERANCE = 0.005;

const ALL_KEYS: readonly ParameterKey[] = [
  'H0', 'h', 'Omega_m', 'Omega_b', 'Omega_c', 'omega_b', 'omega_c', 'Omega_Lambda', 'Omega_k', 'w0', 'wa', 'T_CMB', 'N_eff', 'm_nu',
];

/** Ων for Σmν (eV) and h, by the Planck convention Ων h² = Σmν / 93.14 eV. */
export function massiveNeutrinoDensityParameter(sumMassEv: number, h: number): number {
  return sumMassEv / NEUTRINO_MASS_PER_OMEGA_H2_EV / (h * h);
}

/**
 * Completes and validates a stated parameter set. Never throws: returns either the complete
 * set or one error per offending parameter.
 */
export function resolveParameters(input: ParameterInput): ResolveResult {
  const errors: ParameterError[] = [];
  const fail = (parameter: string, message: string) => errors.push({ parameter, message });
  const stated: string[] = [];
  const assumed: string[] = [];

  for (const key of ALL_KEYS) {
    const v = input[key];
    if (v === undefined) continue;
    stated.push(key);
    if (typeof v !== 'number' || !Number.isFinite(v)) fail(key, `${key} must be a finite number, got ${String(v)}`);
  }
  if (input.flat) stated.push('flat');
  if (errors.length) return { ok: false, errors };

  // Hubble constant.
  let H0 = input.H0;
  if (input.h !== undefined) {
    if (H0 !== undefined && Math.abs(H0 - 100 * input.h) > HUBBLE_CONSISTENCY_TOLERANCE * H0) {
      fail('h', `h = ${input.h} disagrees with H0 = ${H0} km/s/Mpc (h should be H0/100)`);
    }
    H0 ??= 100 * input.h;
  }
  if (H0 === undefined) return { ok: false, errors: [{ parameter: 'H0', message: 'H0 (or h) is required' }] };
  if (!(H0 > 0)) fail(H0 === input.H0 ? 'H0' : 'h', `H0 must be positive, got ${H0} km/s/Mpc`);
  if (H0 > 1000) fail(H0 === input.H0 ? 'H0' : 'h', `H0 = ${H0} km/s/Mpc is not plausible (expected about 50–100)`);

  // Radiation and neutrinos.
  const tCmb = input.T_CMB ?? 0;
  if (input.T_CMB === undefined) assumed.push('T_CMB=0 (no radiation)');
  if (tCmb < 0) fail('T_CMB', `T_CMB must not be negative, got ${tCmb} K`);
  if (tCmb > 100) fail('T_CMB', `T_CMB = ${tCmb} K is not plausible (expected about 2.7 K)`);
  let nEff = input.N_eff ?? (tCmb > 0 ? STANDARD_N_EFF : 0);
  if (input.N_eff === undefined && tCmb > 0) assumed.push(`N_eff=${STANDARD_N_EFF}`);
  if (tCmb === 0) nEff = input.N_eff ?? 0;
  if (nEff < 0) fail('N_eff', `N_eff must not be negative, got ${nEff}`);
  const mNu = input.m_nu ?? 0;
  if (input.m_nu === undefined && tCmb > 0) assumed.push('m_nu=0');
  if (mNu < 0) fail('m_nu', `m_nu must not be negative, got ${mNu} eV`);
  if (mNu > 0 && tCmb === 0) fail('m_nu', 'm_nu needs T_CMB > 0: the neutrino temperature follows from the CMB temperature');
  if (mNu > 0 && nEff < 1) fail('m_nu', `m_nu needs at least one neutrino species, but N_eff = ${nEff}`);
  if (errors.length) return { ok: false, errors };

  const h = H0 / 100;
  const omegaNuMass = massiveNeutrinoDensityParameter(mNu, h);

  // Matter.
  const omegaB = input.Omega_b ?? (input.omega_b !== undefined ? input.omega_b / (h * h) : undefined);
  const omegaC = input.Omega_c ?? (input.omega_c !== undefined ? input.omega_c / (h * h) : undefined);
  const bKey = input.Omega_b !== undefined ? 'Omega_b' : 'omega_b';
  const cKey = input.Omega_c !== undefined ? 'Omega_c' : 'omega_c';
  if (input.Omega_b !== undefined && input.omega_b !== undefined && Math.abs(input.Omega_b - input.omega_b / (h * h)) > DENSITY_CONSISTENCY_TOLERANCE) {
    fail('omega_b', `omega_b = ${input.omega_b} disagrees with Omega_b h² = ${(input.Omega_b * h * h).toPrecision(4)}`);
  }
  if (input.Omega_c !== undefined && input.omega_c !== undefined && Math.abs(input.Omega_c - input.omega_c / (h * h)) > DENSITY_CONSISTENCY_TOLERANCE) {
    fail('omega_c', `omega_c = ${input.omega_c} disagrees with Omega_c h² = ${(input.Omega_c * h * h).toPrecision(4)}`);
  }
  if (omegaB !== undefined && omegaB < 0) fail(bKey, `${bKey} must not be negative`);
  if (omegaC !== undefined && omegaC < 0) fail(cKey, `${cKey} must not be negative`);

  let omegaM = input.Omega_m;
  let resolvedB: number | null = omegaB ?? null;
  let resolvedC: number | null = omegaC ?? null;
  if (omegaM !== undefined) {
    if (omegaM < 0) fail('Omega_m', `Omega_m must not be negative, got ${omegaM}`);
    if (omegaB !== undefined && omegaC !== undefined) {
      const sum = omegaB + omegaC + omegaNuMass;
      if (Math.abs(sum - omegaM) > DENSITY_CONSISTENCY_TOLERANCE) {
        fail('Omega_m', `Omega_m = ${omegaM} disagrees with Omega_b + Omega_c + Omega_nu = ${sum.toPrecision(4)}`);
      }
    } else if (omegaB !== undefined) {
      resolvedC = omegaM - omegaB - omegaNuMass;
      if (resolvedC < 0) fail('Omega_b', `Omega_b = ${omegaB} exceeds Omega_m = ${omegaM} less the neutrino share`);
    } else if (omegaC !== undefined) {
      resolvedB = omegaM - omegaC - omegaNuMass;
      if (resolvedB < 0) fail('Omega_c', `Omega_c = ${omegaC} exceeds Omega_m = ${omegaM} less the neutrino share`);
    }
  } else if (omegaB !== undefined && omegaC !== undefined) {
    omegaM = omegaB + omegaC + omegaNuMass;
  } else {
    fail('Omega_m', 'Omega_m is required (or both Omega_b and Omega_c)');
  }
  if (errors.length || omegaM === undefined) return { ok: false, errors };
  const omegaCb = omegaM - omegaNuMass;
  if (omegaCb < 0) {
    return { ok: false, errors: [{ parameter: 'm_nu', message: `m_nu = ${mNu} eV gives Omega_nu = ${omegaNuMass.toPrecision(3)}, more than Omega_m = ${omegaM}` }] };
  }

  // Radiation densities.
  const omegaGamma = tCmb > 0 ? photonDensityParameter(tCmb, H0) : 0;
  const neutrinos = createNeutrinoModel(omegaGamma, tCmb, nEff, mNu > 0 ? [mNu] : []);
  const omegaNu = neutrinoDensity(neutrinos, 1);
  const omegaR = omegaGamma + masslessNeutrinoDensityToday(neutrinos);
  const nonDarkEnergy = omegaCb + omegaGamma + omegaNu;

  // Dark energy and curvature.
  const w0 = input.w0 ?? -1;
  const wa = input.wa ?? 0;
  if (input.w0 === undefined && input.wa !== undefined) assumed.push('w0=-1');
  let omegaL: number;
  let omegaK: number;
  let flat = false;
  if (input.flat || (input.Omega_k !== undefined && input.Omega_k === 0 && input.Omega_Lambda === undefined)) {
    flat = true;
    omegaK = 0;
    omegaL = 1 - nonDarkEnergy;
    if (input.Omega_k !== undefined && input.Omega_k !== 0) fail('Omega_k', `flat contradicts Omega_k = ${input.Omega_k}`);
    if (input.Omega_Lambda !== undefined && Math.abs(input.Omega_Lambda - omegaL) > DENSITY_CONSISTENCY_TOLERANCE) {
      fail('Omega_Lambda', `a flat model needs Omega_Lambda = ${omegaL.toPrecision(4)} for Omega_m = ${omegaM}, but Omega_Lambda = ${input.Omega_Lambda} was given`);
    }
  } else if (input.Omega_k !== undefined) {
    omegaK = input.Omega_k;
    omegaL = 1 - nonDarkEnergy - omegaK;
    flat = omegaK === 0;
    if (input.Omega_Lambda !== undefined && Math.abs(input.Omega_Lambda - omegaL) > DENSITY_CONSISTENCY_TOLERANCE) {
      fail('Omega_Lambda', `Omega_m + Omega_Lambda + Omega_k = ${(omegaM + input.Omega_Lambda + omegaK).toPrecision(4)}, but the densities must add up to 1`);
    }
  } else if (input.Omega_Lambda !== undefined) {
    omegaL = input.Omega_Lambda;
    omegaK = 1 - nonDarkEnergy - omegaL;
  } else {
    flat = true;
    omegaK = 0;
    omegaL = 1 - nonDarkEnergy;
    assumed.push('flat');
  }
  if (errors.length) return { ok: false, errors };

  const params: CosmologyParameters = {
    H0, h, Omega_m: omegaM, Omega_b: resolvedB, Omega_c: resolvedC, Omega_cb: omegaCb, Omega_nu_mass: omegaNuMass,
    Omega_gamma: omegaGamma, Omega_nu: omegaNu, Omega_r: omegaR, Omega_Lambda: omegaL, Omega_k: omegaK,
    w0, wa, T_CMB: tCmb, N_eff: nEff, m_nu: mNu, flat, stated, assumed,
  };
  const bounce = findNonPositiveExpansion(new Expansion(params, neutrinos));
  if (bounce !== null) {
    const who = input.Omega_Lambda !== undefined ? 'Omega_Lambda' : input.Omega_k !== undefined ? 'Omega_k' : input.w0 !== undefined || input.wa !== undefined ? 'w0' : 'Omega_m';
    return {
      ok: false,
      errors: [{ parameter: who, message: `E²(z) ≤ 0 near z = ${bounce.toPrecision(3)}: with these densities the universe has no big bang in its past (a bounce), so distances and ages are undefined` }],
    };
  }
  return { ok: true, params, neutrinos };
}

/**
 * Scans E²(z) = H²/H0² over z ∈ [0, 10⁸] on a logarithmic grid (step 0.023 in ln(1+z); the
 * background table then checks a finer grid up to z = 2×10⁴) and returns the first
 * redshift where it is not positive, or null. Beyond 10⁸ the highest power of (1+z) wins
 * and its coefficient is checked.
 */
function findNonPositiveExpansion(expansion: Expansion): number | null {
  const p = expansion.params;
  const steps = 800;
  const xMax = Math.log(1e8);
  for (let i = 0; i <= steps; i++) {
    const zp1 = Math.exp((xMax * i) / steps);
    if (!(expansion.e2(zp1) > 0)) return zp1 - 1;
  }
  // Leading behaviour as z → ∞: dark energy with w_early = w0 + wa > 1/3 dominates if negative.
  const wEarly = p.w0 + p.wa;
  if (p.Omega_Lambda < 0 && 3 * (1 + wEarly) > 4) return Infinity;
  return null;
}
