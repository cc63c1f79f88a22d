/**
 * Finds the parameter sets a manuscript declares, wherever and however it states them:
 * our directive comments (`% comove: H0=70 Omega_m=0.3 flat`), Markdown front matter
 * (`cosmology:`), prose ("we adopt a flat ΛCDM cosmology with H_0 = 70 km s^-1 Mpc^-1,
 * Ω_m = 0.3 and Ω_Λ = 0.7"), tuples ("(Ω_m, Ω_Λ) = (0.3, 0.7)"), and named published sets
 * ("the Planck 2018 cosmology", a Planck citation key, "WMAP9").
 *
 * Each declaration records where it was stated, which fields were stated, whether it is
 * incomplete (a value injected at build time, a named set we do not know), and its scope: the
 * whole document, or — for a simulation's or lens model's set — the section it stands in.
 * Directives also scope checking: skip-next-line, skip-begin … skip-end, and `local …`, an
 * override for the rest of the section.
 */

import type { ParameterInput, ParameterKey } from '../cosmology/parameters.js';
import { parseParameterText, mergeWithPreset } from '../cosmology/parameterText.js';
import { findPreset, type Preset } from '../cosmology/presets.js';
import { CITATION_OPEN, INJECTED_VALUE, type DocumentReading, type Sentence } from '../reader/documentReading.js';
import type { Unit } from '../cosmology/units.js';
import { findNumbers, type StatedNumber } from './numberParser.js';

export type DeclarationOrigin = 'directive' | 'front-matter' | 'prose' | 'named-set';
export type DeclarationRole = 'document' | 'local' | 'other-model';

export interface Declaration {
  readonly origin: DeclarationOrigin;
  readonly role: DeclarationRole;
  readonly input: ParameterInput;
  /** Keys stated here (and 'flat' when flatness was stated). */
  readonly stated: readonly string[];
  readonly preset: string | null;
  /** Reading-text range of the statement. */
  readonly start: number;
  readonly end: number;
  /** Reading-text range it applies to. */
  readonly scopeStart: number;
  readonly scopeEnd: number;
  /** Why the declaration cannot be used as it stands, if so. */
  readonly incomplete: string | null;
  /** Source range of a directive or front-matter entry (prose is located by start/end). */
  readonly sourceRange: { readonly start: number; readonly end: number } | null;
}

export interface DeclarationProblem {
  readonly message: string;
  /** Reading-text ranges involved (for a conflict: both statements). */
  readonly ranges: ReadonlyArray<{ readonly start: number; readonly end: number }>;
}

/** A region where checking is switched off. */
export interface SkipRegion {
  readonly start: number;
  readonly end: number;
}

export interface DeclarationScan {
  readonly declarations: readonly Declaration[];
  readonly skips: readonly SkipRegion[];
  readonly problems: readonly DeclarationProblem[];
}

/** Words that make a sentence a statement of the adopted model. */
const DECLARATION_CUE = /\b(?:adopt(?:s|ed|ing)?|assum(?:e|es|ed|ing)|throughout|we use|using|cosmolog(?:y|ical)|ΛCDM|LCDM|concordance|fiducial|parameters? (?:set|of)|we work|consistent with the)\b|ΛCDM/i;
/** Words that make numbers in a sentence measurements rather than adopted values. */
const MEASUREMENT_CUE = /\b(?:we (?:measure|find|obtain|infer|derive|constrain|detect)|measured|posterior|best[- ]fit|constraint|tension|our (?:measurement|result))\b/i;
/** Words that mark another model's parameters (a simulation, a lens model). */
const OTHER_MODEL_CUE = /\b(?:simulations?|N-body|mock|lens(?:ing)? model|halo catalogu?e|emulator|hydrodynamic|run with|box)\b/i;

/** Symbols of the parameters as they appear in reading text, mapped to declaration keys. */
const SYMBOLS: ReadonlyArray<[RegExp, ParameterKey | 'omega_m_lower' | 'omega_b_lower' | 'omega_c_lower']> = [
  [/H_?0(?![\d.])|H₀|H_\{?0\}?|Hubble constant(?: of)?/y, 'H0'],
  [/(?:Ω|Omega)_?(?:m|M|mat(?:ter)?)(?:,?0)?(?![A-Za-z])|(?:Ω|Omega)_?(?:0,?m)(?![A-Za-z])|Ω_?0(?![A-Za-z,])/y, 'Omega_m'],
  [/(?:Ω|Omega)_?(?:Λ|λ|L|Lambda|lambda|DE|de|v|vac)(?:,?0)?(?![A-Za-z])/y, 'Omega_Lambda'],
  [/(?:Ω|Omega)_?(?:b|B|bar)(?:,?0)?(?![A-Za-z])/y, 'Omega_b'],
  [/(?:Ω|Omega)_?(?:c|cdm|CDM|dm|DM)(?:,?0)?(?![A-Za-z])/y, 'Omega_c'],
  [/(?:Ω|Omega)_?(?:k|K|curv)(?:,?0)?(?![A-Za-z])/y, 'Omega_k'],
  [/ω_?(?:m|M)(?![A-Za-z])/y, 'omega_m_lower'],
  [/ω_?(?:b|B)(?![A-Za-z])/y, 'omega_b_lower'],
  [/ω_?(?:c|cdm|dm)(?![A-Za-z])/y, 'omega_c_lower'],
  [/w_?0(?![\d.])|w_\{?0\}?/y, 'w0'],
  [/w_?a(?![A-Za-z])/y, 'wa'],
  [/T_?(?:CMB|cmb|0)(?![A-Za-z\d])/y, 'T_CMB'],
  [/N_?(?:eff|ν)(?![A-Za-z])/y, 'N_eff'],
  [/Σ\s*m_?ν|∑\s*m_?ν|m_?ν(?![A-Za-z])/y, 'm_nu'],
  [/\bh(?![A-Za-z_\d^])/y, 'h'],
];

const RELATION = /\s*(?:=|≈|≃|∼|~|of|is|≡)\s*/y;

/** Named published sets and the preset each stands for (null: a set we do not hold). */
const NAMED_SETS: ReadonlyArray<[RegExp, string | null]> = [
  [/Planck\s*(?:Collaboration\s*)?\(?\s*2018\)?|Planck\s+Collaboration\s*\(?\s*2020\)?|Planck\s*18\b|Planck\s+2018/i, 'planck-2018'],
  [/Planck\s*(?:Collaboration\s*)?\(?\s*2015\)?|Planck\s+Collaboration\s*\(?\s*2016\)?|Planck\s*15\b/i, 'planck-2015'],
  [/Planck\s*(?:Collaboration\s*)?\(?\s*2013\)?|2013 Planck|Planck\s*13\b|Planck\s+Collaboration\s*\(?\s*2014\)?/i, null],
  [/WMAP\s*-?\s*9|WMAP nine[- ]year|nine[- ]year WMAP|Hinshaw et al\.?\s*\(?2013\)?/i, 'wmap-9'],
  [/WMAP\s*-?\s*7|WMAP seven[- ]year|seven[- ]year WMAP|Komatsu et al\.?\s*\(?2011\)?/i, null],
  [/WMAP\s*-?\s*5|WMAP five[- ]year|five[- ]year WMAP|Komatsu et al\.?\s*\(?2009\)?/i, null],
];

interface Statement {
  key: ParameterKey;
  value: number;
  start: number;
  end: number;
}

/** Scans a document for declarations, skip regions and declaration problems. Never throws. */
export function findDeclarations(
  doc: DocumentReading,
  unitCache?: Map<string, Unit | null>,
  numbersIn: (from: number, to: number) => StatedNumber[] = (from, to) => findNumbers(doc.reading.text, from, to, unitCache),
  memo?: (sentence: Sentence, read: () => ProseDeclaration | null) => ProseDeclaration | null,
): DeclarationScan {
  const text = doc.reading.text;
  const declarations: Declaration[] = [];
  const problems: DeclarationProblem[] = [];
  const skips: SkipRegion[] = [];
  const headings = doc.blocks.filter((b) => b.kind === 'heading').map((b) => b.start);
  const sectionEnd = (at: number) => headings.find((h) => h > at) ?? text.length;
  const sectionStart = (at: number) => [...headings].reverse().find((h) => h <= at) ?? 0;

  // Directives and front matter.
  let skipOpen: number | null = null;
  for (const d of doc.directives) {
    const at = d.readingOffset;
    const word = d.text.trim().toLowerCase();
    if (word === 'skip-next-line' || word === 'skip-next') {
      const nextSentence = doc.sentences.find((s) => s.end > at);
      if (nextSentence) skips.push({ start: at, end: nextSentence.end });
      continue;
    }
    if (word === 'skip-begin') {
      skipOpen = at;
      continue;
    }
    if (word === 'skip-end') {
      if (skipOpen !== null) skips.push({ start: skipOpen, end: at });
      skipOpen = null;
      continue;
    }
    const local = /^local\b\s*/i.exec(d.text);
    const body = local ? d.text.slice(local[0].length) : d.text;
    const parsed = parseParameterText(body);
    const origin: DeclarationOrigin = doc.format === 'markdown' && d.sourceStart === 0 && doc.frontMatter ? 'front-matter' : 'directive';
    const stated = [...Object.keys(parsed.explicit), ...(parsed.preset ? [`preset:${parsed.preset.name}`] : [])];
    declarations.push({
      origin,
      role: local ? 'local' : 'document',
      input: parsed.input,
      stated,
      preset: parsed.preset?.name ?? null,
      start: at,
      end: at,
      scopeStart: local ? at : 0,
      scopeEnd: local ? sectionEnd(at) : text.length,
      incomplete: parsed.problems.length ? parsed.problems.map((p) => p.message).join('; ') : null,
      sourceRange: { start: d.sourceStart, end: d.sourceEnd },
    });
  }
  if (skipOpen !== null) skips.push({ start: skipOpen, end: text.length });

  // Prose.
  for (const s of doc.sentences) {
    const found = memo ? memo(s, () => proseDeclaration(text, s, numbersIn)) : proseDeclaration(text, s, numbersIn);
    if (!found) continue;
    problems.push(...found.problems);
    const other = found.other;
    declarations.push({
      origin: found.origin,
      role: other ? 'other-model' : 'document',
      input: found.input,
      stated: found.stated,
      preset: found.preset,
      start: found.start,
      end: found.end,
      scopeStart: other ? sectionStart(s.start) : 0,
      scopeEnd: other ? sectionEnd(s.start) : text.length,
      incomplete: found.incomplete,
      sourceRange: null,
    });
  }

  // Conflicts among the document-wide declarations.
  const documentWide = declarations.filter((d) => d.role === 'document' && !d.incomplete);
  const seen = new Map<string, { value: number; start: number; end: number }>();
  for (const d of documentWide) {
    for (const key of Object.keys(d.input) as Array<keyof ParameterInput>) {
      const v = d.input[key];
      if (typeof v !== 'number') continue;
      const prev = seen.get(key);
      if (prev && Math.abs(prev.value - v) > 1e-9 * Math.max(1, Math.abs(v))) {
        problems.push({ message: `conflicting declarations: ${key} = ${prev.value} and ${key} = ${v}`, ranges: [{ start: prev.start, end: prev.end }, { start: d.start, end: d.end }] });
      } else if (!prev) seen.set(key, { value: v, start: d.start, end: d.end });
    }
  }
  return { declarations, skips, problems };
}

/**
 * What one sentence of prose declares, if anything, before its scope is known: it depends only
 * on the sentence's text (an editor's cache keeps it per sentence).
 */
export interface ProseDeclaration extends Omit<Declaration, 'role' | 'scopeStart' | 'scopeEnd' | 'sourceRange'> {
  /** Whether the sentence is about another model than the manuscript's ("for comparison, … EdS"). */
  readonly other: boolean;
  readonly problems: readonly DeclarationProblem[];
}

export function proseDeclaration(text: string, s: Sentence, numbersIn: (from: number, to: number) => StatedNumber[]): ProseDeclaration | null {
  const sentence = text.slice(s.start, s.end);
  // Only sentences with a parameter symbol, a cue or a named set can declare anything.
  if (!/[HΩωwTNΣ∑mh]|Omega|Planck|WMAP|⟦/.test(sentence)) return null;
  const cue = DECLARATION_CUE.test(sentence);
  // Named sets need a name or a citation to stand on.
  const named = /planck|wmap|komatsu|hinshaw|⟦/i.test(sentence) ? namedSet(sentence) : null;
  // Without a cue or a named set, only a sentence with two parameter statements declares
  // anything, and that takes two parameter symbols: most sentences stop here, unparsed.
  if (!cue && !named && countSymbols(sentence) < 2) return null;
  const statements = parameterStatements(text, s.start, s.end, numbersIn(s.start, s.end));
  const flat = /\bflat\b|spatially flat|Ω_?k\s*=\s*0(?![.\d])|zero curvature/i.test(sentence);
  const lambdaFromMatter = /Ω_?(?:Λ|λ|L)\S*\s*=\s*1\s*[-−]\s*Ω_?(?:m|M)/.exec(sentence);
  const injected = sentence.includes(INJECTED_VALUE) && /H_?0|Ω|h\s*=/.test(sentence);
  if (!cue && statements.length < 2 && !named) return null;
  if (MEASUREMENT_CUE.test(sentence) && !/\b(?:adopt|assum)/i.test(sentence)) return null;
  if (statements.length === 0 && !named && !injected) return null;
  const problems: DeclarationProblem[] = [];
  const input: ParameterInput = {};
  const stated: string[] = [];
  for (const st of statements) {
    if (input[st.key] !== undefined && input[st.key] !== st.value) {
      problems.push({ message: `${st.key} is stated twice in one sentence with different values`, ranges: [{ start: st.start, end: st.end }] });
    }
    input[st.key] = st.value;
    stated.push(st.key);
  }
  if (flat || lambdaFromMatter) {
    input.flat = true;
    stated.push('flat');
  }
  const preset: Preset | null = named?.preset ? findPreset(named.preset) ?? null : null;
  const merged = preset && statements.length === 0 ? mergeWithPreset(preset, input) : input;
  const incomplete = injected
    ? 'a value is injected at build time (\\variable{…}); declare the parameters with a comove directive'
    : named && !named.preset && statements.length === 0
      ? `the named set "${named.text}" is not one Comove holds; declare its parameters with a comove directive`
      : null;
  if (named && !preset && statements.length === 0 && !incomplete) return null;
  return {
    origin: statements.length ? 'prose' : 'named-set',
    other: OTHER_MODEL_CUE.test(sentence),
    input: merged,
    stated: preset && statements.length === 0 ? [`preset:${preset.name}`] : stated,
    preset: preset?.name ?? null,
    start: statements.length ? Math.min(...statements.map((x) => x.start)) : s.start,
    end: statements.length ? Math.max(...statements.map((x) => x.end)) : s.end,
    incomplete,
    problems,
  };
}

/** A loose count of parameter symbols in a sentence (never fewer than parameterStatements can find). */
const ANY_SYMBOL = /H_?0|H₀|H_\{|Hubble constant|Ω|Omega|ω|(?<![A-Za-z])h(?![A-Za-z])|w_?[0a]|w_\{|T_?(?:CMB|cmb|0)|N_?(?:eff|ν)|m_?ν/g;
function countSymbols(sentence: string): number {
  let n = 0;
  ANY_SYMBOL.lastIndex = 0;
  while (ANY_SYMBOL.exec(sentence) && ++n < 2);
  return n;
}

/** Parameter statements (symbol, relation, number) in text[from, to), including tuples. */
export function parameterStatements(text: string, from: number, to: number, known?: readonly StatedNumber[]): Statement[] {
  const out: Statement[] = [];
  const numbers = known ?? findNumbers(text, from, to);
  const numberAt = (pos: number) => numbers.find((n) => n.start >= pos && n.start <= pos + 2);
  for (let p = from; p < to; p++) {
    const c = text[p];
    if (c !== 'H' && c !== 'Ω' && c !== 'O' && c !== 'ω' && c !== 'w' && c !== 'T' && c !== 'N' && c !== 'Σ' && c !== '∑' && c !== 'm' && c !== 'h' && c !== '(') continue;
    if (p > from && /[A-Za-z0-9]/.test(text[p - 1]) && c !== 'Ω' && c !== 'ω') continue;
    if (p > from && text[p - 1] === '/') continue; // cz/H_0: a ratio, not a statement of H0
    if (c === '(') {
      const tuple = tupleAt(text, p, to);
      if (tuple) {
        out.push(...tuple.statements);
        p = tuple.end - 1;
      }
      continue;
    }
    for (const [re, key] of SYMBOLS) {
      re.lastIndex = p;
      const m = re.exec(text);
      if (!m || m.index !== p) continue;
      const after = p + m[0].length;
      RELATION.lastIndex = after;
      const rel = RELATION.exec(text);
      if (!rel || rel.index !== after) break;
      const n = numberAt(after + rel[0].length - 1);
      if (!n || n.range) break;
      // "Ω_Λ = 1 − Ω_m": an expression, not a value.
      if (/^\s*[-−+]\s*[ΩωH(]/.test(text.slice(n.end, n.end + 4))) break;
      const resolved = resolveLowerOmega(key, n.value);
      // "H_0 = 100 h km s^-1 Mpc^-1": a symbolic h, not a value of H0.
      if (resolved === 'H0' && /^\s*h\b/.test(text.slice(n.end, n.end + 3)) && n.value === 100) break;
      out.push({ key: resolved, value: n.value, start: p, end: n.unit ? n.unit.end : n.end });
      p = n.end - 1;
      break;
    }
  }
  return out;
}

function resolveLowerOmega(key: ParameterKey | 'omega_m_lower' | 'omega_b_lower' | 'omega_c_lower', value: number): ParameterKey {
  // Authors write lower-case ω both for Ω (ω_M = 0.3) and for Ω h² (ω_b = 0.0224): tell them apart by size.
  if (key === 'omega_m_lower') return value > 0.2 ? 'Omega_m' : 'omega_c';
  if (key === 'omega_b_lower') return value > 0.035 ? 'Omega_b' : 'omega_b';
  if (key === 'omega_c_lower') return value > 0.18 ? 'Omega_c' : 'omega_c';
  return key;
}

/** "(Ω_m, Ω_Λ) = (0.3, 0.7)" and "(Ω_m, Ω_Λ, h) = (0.3, 0.7, 0.7)". */
function tupleAt(text: string, p: number, to: number): { statements: Statement[]; end: number } | null {
  const m = /^\(([^()=]{2,60})\)\s*=\s*\(([^()]{2,60})\)/.exec(text.slice(p, Math.min(to, p + 140)));
  if (!m) return null;
  const names = m[1].split(',').map((x) => x.trim());
  const valuesStart = p + m[0].lastIndexOf('(') + 1;
  const values = findNumbers(text, valuesStart, p + m[0].length - 1);
  if (names.length !== values.length || names.length < 2) return null;
  const statements: Statement[] = [];
  names.forEach((name, i) => {
    for (const [re, key] of SYMBOLS) {
      re.lastIndex = 0;
      const sm = new RegExp(`^(?:${re.source})$`).exec(name);
      if (sm) {
        statements.push({ key: resolveLowerOmega(key, values[i].value), value: values[i].value, start: p, end: p + m[0].length });
        break;
      }
    }
  });
  return statements.length === names.length ? { statements, end: p + m[0].length } : null;
}

/** A named published set in a sentence (by name or by a Planck/WMAP citation key). */
function namedSet(sentence: string): { text: string; preset: string | null } | null {
  for (const [re, preset] of NAMED_SETS) {
    const m = re.exec(sentence);
    if (m && /cosmolog|parameters|adopt|assum|use|consistent|results|values/i.test(sentence)) return { text: m[0].trim(), preset };
  }
  const cite = sentence.indexOf(CITATION_OPEN);
  if (cite >= 0) {
    const keys = sentence.slice(cite + CITATION_OPEN.length, sentence.indexOf('⟧', cite)).split(',');
    for (const key of keys) {
      const k = /planck.*?(20\d\d)|(20\d\d).*?planck/i.exec(key);
      if (!k || !/cosmolog|parameters|adopt|assum/i.test(sentence)) continue;
      const year = k[1] ?? k[2];
      const preset = year === '2018' || year === '2020' ? 'planck-2018' : year === '2015' || year === '2016' ? 'planck-2015' : null;
      return { text: key.trim(), preset };
    }
  }
  return null;
}
