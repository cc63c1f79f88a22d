/**
 * Migration of a manuscript to another parameter set: every edit that rewrites the declaration
 * and the numbers that depend on it, in the author's notation, plus the list of what could not
 * be rewritten (and why). Pure: the caller applies the edits.
 */

import { parameterStatements } from '../claims/declarations.js';
import type { FileExtraction } from '../claims/extraction.js';
import { findNumbers, type StatedNumber } from '../claims/numberParser.js';
import { CosmologyCache } from '../cosmology/cosmology.js';
import type { ParameterInput, ParameterKey } from '../cosmology/parameters.js';
import { formatParameterInput } from '../cosmology/parameterText.js';
import { checkFile, type CheckOptions } from './checker.js';
import { kindTitle } from './explain.js';
import { restate, type SourceEdit } from './fixes.js';

export interface MigrationEdit extends SourceEdit {
  /** What the edit changes, for a listing. */
  readonly what: string;
  readonly oldText: string;
}

export interface NotRewritten {
  /** Reading-text range. */
  readonly start: number;
  readonly end: number;
  readonly what: string;
  readonly reason: string;
}

export interface Migration {
  readonly edits: readonly MigrationEdit[];
  readonly notRewritten: readonly NotRewritten[];
}

/** The value of `key` in a resolved-enough input (h from H0 and back). */
function newValueOf(key: ParameterKey, to: ParameterInput, resolved: { H0: number; Omega_m: number; Omega_Lambda: number; Omega_b: number | null; Omega_k: number }): number | null {
  const v = to[key];
  if (typeof v === 'number') return v;
  switch (key) {
    case 'H0':
      return resolved.H0;
    case 'h':
      return resolved.H0 / 100;
    case 'Omega_m':
      return resolved.Omega_m;
    case 'Omega_Lambda':
      return resolved.Omega_Lambda;
    case 'Omega_k':
      return resolved.Omega_k;
    case 'Omega_b':
      return resolved.Omega_b;
    default:
      return null;
  }
}

/** Everything that moves a file from its declared set to `to`. Overlapping edits never occur: each source range is edited once. */
export function migrateFile(file: FileExtraction, to: ParameterInput, options: Omit<CheckOptions, 'override'> & { cache?: CosmologyCache } = {}): Migration | { error: string } {
  const cache = options.cache ?? new CosmologyCache();
  const made = cache.get(to);
  if (!made.ok) return { error: `the new parameters are not a valid set: ${made.errors.map((e) => `${e.parameter}: ${e.message}`).join('; ')}` };
  const resolvedCheck = made.cosmology.params;
  // The author's-cosmology fit says nothing a migration uses.
  const before = checkFile(file, { ...options, cache, fitAuthorCosmology: false });
  const after = checkFile(file, { ...options, cache, override: to, fitAuthorCosmology: false });
  const edits: MigrationEdit[] = [];
  const notRewritten: NotRewritten[] = [];
  const text = file.reading.reading.text;
  const taken: Array<[number, number]> = [];
  const push = (e: SourceEdit, what: string) => {
    if (taken.some(([a, b]) => e.start < b && a < e.end)) return;
    taken.push([e.start, e.end]);
    const oldText = file.text.slice(e.start, e.end);
    if (oldText !== e.newText) edits.push({ ...e, what, oldText });
  };

  // The declarations.
  for (const d of file.declarations.filter((x) => x.role === 'document')) {
    if (d.sourceRange && (d.origin === 'directive')) {
      const src = file.text.slice(d.sourceRange.start, d.sourceRange.end);
      const m = /comove\s*:/i.exec(src);
      if (m) {
        const closing = /\s*-->\s*$/.exec(src);
        const bodyStart = d.sourceRange.start + m.index + m[0].length;
        const bodyEnd = closing ? d.sourceRange.start + closing.index : d.sourceRange.end;
        push({ start: bodyStart, end: bodyEnd, newText: ` ${formatParameterInput(to)}${closing ? ' ' : ''}` }, 'the comove directive');
        continue;
      }
    }
    if (d.origin === 'prose') {
      const numbers = findNumbers(text, d.start, d.end);
      const used = new Set<StatedNumber>();
      for (const st of parameterStatements(text, d.start, d.end, numbers)) {
        const n = numbers.find((x) => !used.has(x) && x.start >= st.start && x.end <= st.end && x.value === st.value);
        if (!n) continue;
        used.add(n);
        const v = newValueOf(st.key, to, resolvedCheck);
        if (v === null) {
          notRewritten.push({ start: st.start, end: st.end, what: st.key, reason: `the new set does not give ${st.key}` });
          continue;
        }
        // A value the new set states is written as it is; one derived from it (Ω_m from ω_b and
        // ω_c) to four significant digits, or as many as the author wrote.
        const stated = typeof to[st.key] === 'number';
        const written = stated ? v : Number(v.toPrecision(Math.min(15, Math.max(4, n.significantDigits))));
        const edit = restate(file.reading, file.text, n, written, true);
        if (typeof edit === 'string') notRewritten.push({ start: st.start, end: st.end, what: st.key, reason: edit });
        else push(edit, `declared ${st.key}`);
      }
      const missing = (Object.keys(to) as ParameterKey[]).filter((k) => k !== ('flat' as ParameterKey) && typeof to[k] === 'number' && !d.stated.includes(k));
      if (missing.length) notRewritten.push({ start: d.start, end: d.end, what: 'the declaration', reason: `it does not state ${missing.join(', ')}: add ${missing.length === 1 ? 'it' : 'them'} by hand` });
      continue;
    }
    notRewritten.push({ start: d.start, end: Math.max(d.end, d.start), what: `the ${d.origin} declaration`, reason: d.origin === 'named-set' ? 'a named published set is rewritten by hand' : d.origin === 'front-matter' ? 'front matter is rewritten by hand' : 'Comove cannot rewrite it in place' });
  }

  // The numbers that depend on it.
  after.checks.forEach((check, i) => {
    const c = check.claim;
    const what = `${kindTitle(c.kind)}${c.z !== null ? ` at z = ${c.z}` : ''}`;
    const was = before.checks[i];
    if (was?.status === 'unchecked' || check.computed === null) {
      notRewritten.push({ start: c.start, end: c.end, what, reason: check.reason ?? was?.reason ?? 'not checkable' });
      return;
    }
    // A number that is already wrong is not carried over silently: it is fixed first, by hand or with the quick fix.
    if (was?.status === 'inconsistent') {
      notRewritten.push({ start: c.start, end: c.end, what, reason: `it disagrees with the current set already${was.slip ? ` (${was.slip.description})` : ''}` });
      return;
    }
    const edit = restate(file.reading, file.text, c.value, check.computed);
    if (typeof edit === 'string') notRewritten.push({ start: c.start, end: c.end, what, reason: edit });
    else push(edit, what);
  });
  edits.sort((a, b) => a.start - b.start);
  return { edits, notRewritten };
}

/** Applies non-overlapping edits to a text. */
export function applyEdits(text: string, edits: readonly SourceEdit[]): string {
  const sorted = [...edits].sort((a, b) => b.start - a.start);
  let out = text;
  for (const e of sorted) out = out.slice(0, e.start) + e.newText + out.slice(e.end);
  return out;
}
