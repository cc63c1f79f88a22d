/** The server's settings (`comove.*` in the editor), with their defaults and validation. */

import { parseParameterText, type ClaimKind, type ParameterInput } from '../../shared/src/index.js';

export type SeverityName = 'error' | 'warning' | 'information' | 'hint';

export interface ComoveSettings {
  /** Parameter set used when a manuscript declares none ('' for none: claims stay unchecked). */
  readonly defaultParameters: string;
  /** Relative floor, per cent. */
  readonly relativeFloor: number;
  /** Severity of an inconsistent number: 'byDistance' gives an error from `errorTolerances` tolerances on, else a warning. */
  readonly inconsistentSeverity: 'byDistance' | SeverityName;
  readonly errorTolerances: number;
  /** Kinds of claim to report (empty: all). */
  readonly enabledKinds: readonly ClaimKind[];
  /** Document languages to check. */
  readonly languages: readonly string[];
  /** Inlay hints with the recomputed value: none, after inconsistent numbers only, or after all. */
  readonly inlayHints: 'off' | 'inconsistent' | 'all';
  /** Milliseconds to wait after an edit before checking. */
  readonly debounceMs: number;
}

export const DEFAULT_SETTINGS: ComoveSettings = {
  defaultParameters: '',
  relativeFloor: 0.5,
  inconsistentSeverity: 'byDistance',
  errorTolerances: 3,
  enabledKinds: [],
  languages: ['latex', 'tex', 'markdown'],
  inlayHints: 'inconsistent',
  debounceMs: 5,
};

/** Settings from the client's answer (any shape), falling back to the defaults value by value. */
export function readSettings(raw: unknown): ComoveSettings {
  const r = (raw && typeof raw === 'object' ? raw : {}) as Record<string, unknown>;
  const pick = <K extends keyof ComoveSettings>(key: K, ok: (v: unknown) => boolean): ComoveSettings[K] => (ok(r[key]) ? (r[key] as ComoveSettings[K]) : DEFAULT_SETTINGS[key]);
  const isNumber = (v: unknown) => typeof v === 'number' && Number.isFinite(v);
  return {
    defaultParameters: pick('defaultParameters', (v) => typeof v === 'string'),
    relativeFloor: pick('relativeFloor', (v) => isNumber(v) && (v as number) >= 0 && (v as number) <= 50),
    inconsistentSeverity: pick('inconsistentSeverity', (v) => ['byDistance', 'error', 'warning', 'information', 'hint'].includes(v as string)),
    errorTolerances: pick('errorTolerances', (v) => isNumber(v) && (v as number) > 0),
    enabledKinds: pick('enabledKinds', (v) => Array.isArray(v) && v.every((k) => typeof k === 'string')),
    languages: pick('languages', (v) => Array.isArray(v) && v.every((k) => typeof k === 'string')),
    inlayHints: pick('inlayHints', (v) => v === 'off' || v === 'inconsistent' || v === 'all'),
    debounceMs: pick('debounceMs', (v) => isNumber(v) && (v as number) >= 0 && (v as number) <= 5000),
  };
}

/** The default parameter set as input, or null (none, or not valid: the problem is returned). */
export function defaultParameterInput(settings: ComoveSettings): { input: ParameterInput | null; problem: string | null } {
  const text = settings.defaultParameters.trim();
  if (!text) return { input: null, problem: null };
  const parsed = parseParameterText(text);
  if (parsed.problems.length) return { input: null, problem: `comove.defaultParameters: ${parsed.problems.map((p) => p.message).join('; ')}` };
  return { input: parsed.input, problem: null };
}
