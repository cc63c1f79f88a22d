/**
 * The declaration syntax shared by `--params`, directive comments and settings:
 *
 *   [preset] key=value [key=value …] [flat]
 *
 * separated by spaces, commas or semicolons, e.g. `H0=70 Omega_m=0.3 flat` or
 * `planck-2018 H0=70`. Keys use the trade's symbols (ASCII or Unicode); values may carry
 * their unit (`H0=70km/s/Mpc`, `T_CMB=2.7255K`, `m_nu=0.06eV`). Parsing never fails: it
 * returns what it understood and one problem per token it did not.
 */

import type { ParameterInput, ParameterKey } from './parameters.js';
import { findPreset, PRESETS, type Preset } from './presets.js';

/** A token that was not understood, with its offsets in the text. */
export interface ParameterTextProblem {
  readonly key: string;
  readonly message: string;
  readonly start: number;
  readonly end: number;
}

export interface ParsedParameterText {
  /** The merged input: the preset's values, then the explicit ones. */
  readonly input: ParameterInput;
  /** The explicit key=value pairs only. */
  readonly explicit: ParameterInput;
  readonly preset: Preset | null;
  readonly problems: readonly ParameterTextProblem[];
}

/** Accepted spellings of each key. Matching is exact first, then case-insensitive where unambiguous. */
export const KEY_SPELLINGS: Readonly<Record<ParameterKey, readonly string[]>> = {
  H0: ['H0', 'H_0', 'H₀'],
  h: ['h'],
  Omega_m: ['Omega_m', 'Omega_M', 'Omega_m0', 'Omega_matter', 'Ωm', 'Ω_m', 'ΩM', 'Ω_M'],
  Omega_b: ['Omega_b', 'Omega_baryon', 'Ωb', 'Ω_b'],
  Omega_c: ['Omega_c', 'Omega_cdm', 'Ωc', 'Ω_c'],
  omega_b: ['omega_b', 'ωb', 'ω_b', 'Omega_b_h2', 'Omega_bh2'],
  omega_c: ['omega_c', 'ωc', 'ω_c', 'Omega_c_h2', 'Omega_ch2'],
  Omega_Lambda: ['Omega_Lambda', 'Omega_L', 'Omega_de', 'Omega_DE', 'Omega_lambda', 'ΩΛ', 'Ω_Λ', 'Ω_de'],
  Omega_k: ['Omega_k', 'Omega_K', 'Omega_curv', 'Ωk', 'Ω_k'],
  w0: ['w0', 'w_0', 'w'],
  wa: ['wa', 'w_a'],
  T_CMB: ['T_CMB', 'Tcmb', 'T_cmb', 'T0', 'T_0'],
  N_eff: ['N_eff', 'Neff', 'N_ν'],
  m_nu: ['m_nu', 'sum_m_nu', 'mnu', 'Σm_ν', 'Σmν'],
};

/** Units a value may carry, per key: unit text → factor to the key's own unit. */
const VALUE_UNITS: Partial<Record<ParameterKey, Readonly<Record<string, number>>>> = {
  H0: { 'km/s/Mpc': 1, 'kms^-1Mpc^-1': 1, 'kms-1Mpc-1': 1, 'km s^-1 Mpc^-1': 1 },
  T_CMB: { K: 1, mK: 1e-3 },
  m_nu: { eV: 1, meV: 1e-3 },
};

const EXACT = new Map<string, ParameterKey>();
const FOLDED = new Map<string, ParameterKey | 'ambiguous'>();
for (const [key, spellings] of Object.entries(KEY_SPELLINGS) as Array<[ParameterKey, readonly string[]]>) {
  for (const s of spellings) {
    EXACT.set(s, key);
    const f = s.toLowerCase();
    const prev = FOLDED.get(f);
    FOLDED.set(f, prev === undefined || prev === key ? key : 'ambiguous');
  }
}

/** The key a spelling stands for, 'ambiguous', or null. */
export function lookupKey(spelling: string): ParameterKey | 'ambiguous' | null {
  return EXACT.get(spelling) ?? FOLDED.get(spelling.toLowerCase()) ?? null;
}

const NUMBER = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)(.*)$/;

/** Parses declaration text (see the module comment). Never throws. */
export function parseParameterText(text: string): ParsedParameterText {
  const problems: ParameterTextProblem[] = [];
  const explicit: Record<string, number | boolean> = {};
  let preset: Preset | null = null;
  // The last key=value pair without a unit, so that a unit written after a space attaches to it.
  let lastBare: ParameterKey | null = null;
  const token = /([^\s,;=]+)\s*=\s*([^\s,;]*)|([^\s,;]+)/g;
  for (let m = token.exec(text); m !== null; m = token.exec(text)) {
    const start = m.index;
    const end = start + m[0].length;
    if (m[3] !== undefined) {
      const word = m[3];
      const unitFactor = lastBare === null ? undefined : VALUE_UNITS[lastBare]?.[word];
      if (lastBare !== null && unitFactor !== undefined) {
        explicit[lastBare] = (explicit[lastBare] as number) * unitFactor;
        lastBare = null;
        continue;
      }
      lastBare = null;
      if (word.toLowerCase() === 'flat') {
        explicit.flat = true;
        continue;
      }
      const found = findPreset(word);
      if (found) {
        if (preset) problems.push({ key: word, message: `only one preset may be named (already '${preset.name}')`, start, end });
        else preset = found;
        continue;
      }
      problems.push({ key: word, message: `'${word}' is neither a key=value pair, 'flat', nor a preset (${PRESETS.map((p) => p.name).join(', ')})`, start, end });
      continue;
    }
    lastBare = null;
    const [, rawKey, rawValue] = m;
    const key = lookupKey(rawKey);
    if (key === null) {
      problems.push({ key: rawKey, message: `unknown parameter '${rawKey}' (known: ${Object.keys(KEY_SPELLINGS).join(', ')})`, start, end });
      continue;
    }
    if (key === 'ambiguous') {
      problems.push({ key: rawKey, message: `'${rawKey}' is ambiguous: write Omega_b/Omega_c for density parameters or omega_b/omega_c for Ω h²`, start, end });
      continue;
    }
    const num = NUMBER.exec(rawValue);
    if (!num) {
      problems.push({ key, message: `${key} needs a number, got '${rawValue}'`, start, end });
      continue;
    }
    let value = Number(num[1]);
    const unitText = num[2].trim();
    if (unitText) {
      const factor = VALUE_UNITS[key]?.[unitText];
      if (factor === undefined) {
        problems.push({ key, message: `unknown unit '${unitText}' for ${key}`, start, end });
        continue;
      }
      value *= factor;
    }
    if (key in explicit) problems.push({ key, message: `${key} is given twice; the last value counts`, start, end });
    explicit[key] = value;
    if (!unitText) lastBare = key;
  }
  const explicitInput = explicit as ParameterInput;
  return { input: mergeWithPreset(preset, explicitInput), explicit: explicitInput, preset, problems };
}

/**
 * A preset overridden by explicit values. Overriding any matter density drops the preset's
 * Ωc (re-derived from Ωm), and overriding ΩΛ or Ωk drops its flatness.
 */
export function mergeWithPreset(preset: Preset | null, explicit: ParameterInput): ParameterInput {
  if (!preset) return { ...explicit };
  const base: ParameterInput = { ...preset.input };
  const has = (k: keyof ParameterInput) => explicit[k] !== undefined;
  if (has('Omega_m') || has('Omega_b') || has('Omega_c') || has('omega_b') || has('omega_c')) {
    delete base.omega_c;
    delete base.Omega_c;
  }
  if (has('Omega_b')) delete base.omega_b;
  if (has('Omega_Lambda') || has('Omega_k')) delete base.flat;
  if (has('h')) delete base.H0;
  return { ...base, ...explicit };
}

/** Canonical declaration text for a parameter input (what `--params` would accept). */
export function formatParameterInput(input: ParameterInput): string {
  const parts: string[] = [];
  for (const key of Object.keys(KEY_SPELLINGS) as ParameterKey[]) {
    const v = input[key];
    if (v !== undefined) parts.push(`${key}=${v}`);
  }
  if (input.flat) parts.push('flat');
  return parts.join(' ');
}
