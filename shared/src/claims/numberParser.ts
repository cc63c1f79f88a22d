/**
 * Numbers as authors state them, in reading text: decimals, thousands separators, scientific
 * forms (1.2×10^28, 1.2e28, 10^3.5), uncertainties (± 0.2, ^+0.1_-0.2), ranges (1.5–2.5,
 * "between 9 and 11"), approximations (∼, ≈, "about") and bounds (<, ≲, "up to"), each with
 * the precision it was stated to and the unit that follows it.
 */

import { parseUnit, type Unit } from '../cosmology/units.js';

export type Qualifier = 'exact' | 'approximate' | 'upper-bound' | 'lower-bound' | 'range';

export interface StatedUnit {
  /** Unit text as written (reading text). */
  readonly text: string;
  readonly start: number;
  readonly end: number;
  /** The parsed unit, or null when the text is a unit we do not know. */
  readonly unit: Unit | null;
}

export interface StatedNumber {
  /** Central value (for a range: its middle). */
  readonly value: number;
  /** Reading-text range of the number expression: qualifier word or symbol excluded, uncertainty and range included. */
  readonly start: number;
  readonly end: number;
  /** Range of the mantissa digits alone (what a fix rewrites). */
  readonly digitsStart: number;
  readonly digitsEnd: number;
  /** The number as written. */
  readonly text: string;
  readonly significantDigits: number;
  /** Place value of the last stated digit (0.1 for 6.6, 100 for 6600, 1e27 for 1.2e28). */
  readonly resolution: number;
  readonly qualifier: Qualifier;
  /** The relation symbol or word before the number, if any ("=", "≈", "about", "<"…). */
  readonly relation: string | null;
  readonly uncertainty: { readonly plus: number; readonly minus: number } | null;
  readonly range: { readonly low: number; readonly high: number } | null;
  readonly unit: StatedUnit | null;
}

const SUPERSCRIPT_DIGITS: Readonly<Record<string, string>> = { '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁻': '-', '⁺': '+' };

/** A mantissa: digits with optional thousands separators and decimals. */
const MANTISSA = /(?:\d{1,3}(?:,\d{3})+(?!\d)|\d+)(?:\.\d+)?|\.\d+/y;
/** Exponent forms after a mantissa. */
const TIMES_TEN = /\s*[×x]\s*10\s*(?:\^\s*\(?\s*([-−+]?\d+(?:\.\d+)?)\s*\)?|([⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+))/y;
const E_NOTATION = /[eE]([-+]?\d+)(?![A-Za-z])/y;
/** A bare power of ten: 10^3.5, 10^{-3}. */
const POWER_OF_TEN = /10\s*\^\s*\(?\s*([-−+]?\d+(?:\.\d+)?)\s*\)?/y;
const PLUS_MINUS = /\s*(?:±|\+\/-|\+-|\\pm)\s*/y;
const ASYMMETRIC = /\s*\^\s*\(?\s*\+\s*(\d*\.?\d+)\s*\)?\s*_\s*\(?\s*[-−]\s*(\d*\.?\d+)\s*\)?|\s*_\s*\(?\s*[-−]\s*(\d*\.?\d+)\s*\)?\s*\^\s*\(?\s*\+\s*(\d*\.?\d+)\s*\)?/y;
const RANGE_DASH = /\s*(?:–|—|-|−|to|and)\s*/y;

/** Relations and qualifier words that may stand before a number, longest first. */
const RELATIONS: ReadonlyArray<[string, Qualifier]> = [
  ['approximately', 'approximate'], ['roughly', 'approximate'], ['around', 'approximate'], ['about', 'approximate'], ['nearly', 'approximate'],
  ['almost', 'approximate'], ['some', 'approximate'], ['of order', 'approximate'], ['circa', 'approximate'], ['ca.', 'approximate'],
  ['less than', 'upper-bound'], ['fewer than', 'upper-bound'], ['below', 'upper-bound'], ['up to', 'upper-bound'], ['at most', 'upper-bound'], ['under', 'upper-bound'],
  ['within', 'upper-bound'], ['more than', 'lower-bound'], ['greater than', 'lower-bound'], ['larger than', 'lower-bound'], ['above', 'lower-bound'], ['over', 'lower-bound'],
  ['at least', 'lower-bound'], ['beyond', 'lower-bound'], ['exceeding', 'lower-bound'],
  ['≈', 'approximate'], ['≃', 'approximate'], ['∼', 'approximate'], ['~', 'approximate'], ['≅', 'approximate'],
  ['≲', 'upper-bound'], ['≤', 'upper-bound'], ['<', 'upper-bound'], ['≪', 'upper-bound'],
  ['≳', 'lower-bound'], ['≥', 'lower-bound'], ['>', 'lower-bound'], ['≫', 'lower-bound'],
  ['=', 'exact'], ['≡', 'exact'], ['is', 'exact'], ['of', 'exact'],
];

/** Unit words and symbols as written in prose and math, mapped to units.ts spellings. */
const UNIT_WORDS: ReadonlyArray<[RegExp, string]> = [
  [/^billion (?:light[- ])?years?/i, 'Gyr'],
  [/^million (?:light[- ])?years?/i, 'Myr'],
  [/^thousand years?/i, 'kyr'],
  [/^light[- ]years?/i, 'ly'],
  [/^years?\b/i, 'yr'],
  [/^per ?cent\b/i, '%'],
  [/^degrees?\b/i, 'deg'],
  [/^arcsec(?:onds?)?\b/i, 'arcsec'],
  [/^arcmin(?:utes?)?\b/i, 'arcmin'],
  [/^magnitudes?\b/i, 'mag'],
  [/^kelvin\b/i, 'K'],
];

/** First letters (lower case) of the unit words, to skip the word patterns at once. */
const UNIT_WORD_INITIALS = new Set(['b', 'm', 't', 'l', 'y', 'p', 'd', 'a', 'k']);

/** Tokens a unit expression may be made of (after symbols are normalised). */
const UNIT_TOKEN = /(?:[hH](?:_?70)?|Gpc|Mpc|kpc|pc|Gyr|Myr|kyr|yr|Gly|Mly|kly|ly|km|cm|s|K|mK|mag|arcsec|arcmin|deg|rad|sr|Msun|M_⊙|M⊙|g|%|au|AU|eV|meV)(?:\s*\^\s*\{?\s*[-−+]?\d+\s*\}?|[⁻⁺]?[¹²³⁴⁵⁶⁷⁸⁹])?(?![A-Za-z0-9])/y;

function normaliseExponent(s: string): string {
  return s.replace(/−/g, '-').replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺]/g, (c) => SUPERSCRIPT_DIGITS[c]);
}

/** The first character at or after `pos` that is not a space (regular-expression guards: most numbers are followed by none of the forms). */
function nextNonSpace(text: string, pos: number): string {
  while (pos < text.length && /\s/.test(text[pos])) pos++;
  return pos < text.length ? text[pos] : '';
}

/** The last character before `pos` that is not a space. */
function nextNonSpaceBefore(text: string, pos: number): string {
  while (pos > 0 && /\s/.test(text[pos - 1])) pos--;
  return pos > 0 ? text[pos - 1] : '';
}

function matchAt(re: RegExp, text: string, pos: number): RegExpExecArray | null {
  re.lastIndex = pos;
  return re.exec(text);
}

/** Significant digits and the place value of the last one, for a mantissa as written. */
export function precisionOf(mantissa: string): { significantDigits: number; resolution: number } {
  // Digits only (thousands separators dropped), and where the decimal point was.
  let digits = 0;
  let leadingZeros = 0;
  let seenNonZero = false;
  let dot = -1;
  let trailingZeros = 0;
  for (let i = 0; i < mantissa.length; i++) {
    const c = mantissa.charCodeAt(i);
    if (c === 46) {
      dot = digits;
      continue;
    }
    if (c < 48 || c > 57) continue; // ','
    digits++;
    if (c === 48) {
      if (!seenNonZero) leadingZeros++;
      trailingZeros++;
    } else {
      seenNonZero = true;
      trailingZeros = 0;
    }
  }
  if (dot >= 0) {
    // With a decimal point every digit after the first non-zero one counts (6.60 has three).
    return { significantDigits: Math.max(1, digits - leadingZeros), resolution: Number(`1e-${digits - dot}`) };
  }
  // An integer: trailing zeros are not taken as significant (6600 is stated to the hundred).
  if (!seenNonZero) return { significantDigits: 1, resolution: 1 };
  return { significantDigits: Math.max(1, digits - leadingZeros - trailingZeros), resolution: 10 ** trailingZeros };
}

/** Last characters of the relations, to rule most positions out at once. */
const RELATION_LAST_CHARS = new Set(RELATIONS.map(([word]) => word[word.length - 1]));

/** The relation written just before `pos` (skipping spaces), with where it starts. */
function relationBefore(text: string, pos: number): { relation: string; qualifier: Qualifier; start: number } | null {
  let p = pos;
  while (p > 0 && (text[p - 1] === ' ' || text[p - 1] === '\n')) p--;
  if (p === 0 || !RELATION_LAST_CHARS.has(text[p - 1])) return null;
  const before = text.slice(Math.max(0, p - 16), p);
  for (const [word, qualifier] of RELATIONS) {
    if (!before.endsWith(word)) continue;
    const start = p - word.length;
    // Words must stand alone ("over" not "cover", "of" not "proof").
    if (/^[a-z]/i.test(word) && start > 0 && /[A-Za-z]/.test(text[start - 1])) continue;
    return { relation: word, qualifier, start };
  }
  return null;
}

/** The unit written at `pos` (after spaces), if any. */
export function unitAt(text: string, pos: number, cache?: Map<string, Unit | null>): StatedUnit | null {
  const okUnit = (spelled: string) => parseUnitCached(spelled, cache);
  let p = pos;
  while (p < text.length && (text[p] === ' ' || text[p] === '\n')) p++;
  // Units start with a letter or one of a few symbols; anything else rules a unit out at once.
  if (p >= text.length || !/[A-Za-z%″′°^'∘μ⊙]/.test(text[p])) return null;
  const rest = text.slice(p, p + 40);
  if (UNIT_WORD_INITIALS.has(text[p].toLowerCase())) {
    for (const [re, spelled] of UNIT_WORDS) {
      const m = re.exec(rest);
      if (m) return { text: m[0], start: p, end: p + m[0].length, unit: spelled === '%' ? null : okUnit(spelled) };
    }
  }
  // Symbol units right after the number: ″ ′ ° (1.5″, 10°), also as superscripts (1.0^′′).
  const mark = /^\^*\s*(″|′′|''|′|°|∘)/.exec(rest);
  if (mark) {
    const spelled = mark[1] === '′' ? 'arcmin' : mark[1] === '°' || mark[1] === '∘' ? 'deg' : 'arcsec';
    return { text: mark[0], start: p, end: p + mark[0].length, unit: okUnit(spelled) };
  }
  // A sequence of unit tokens joined by spaces, '/', '·' or '×'.
  let q = p;
  let lastEnd = p;
  const pieces: string[] = [];
  while (q < text.length) {
    const sep = /^(\s*[/·]\s*|\s+|)/.exec(text.slice(q, q + 4))![0];
    const m = matchAt(UNIT_TOKEN, text, q + sep.length);
    if (!m) break;
    const token = m[0];
    // A lone 'h' or 's' or 'g' or 'K' is a unit only next to another unit token or after the number directly.
    pieces.push((sep.includes('/') ? '/' : pieces.length ? ' ' : '') + token);
    q = q + sep.length + token.length;
    lastEnd = q;
  }
  if (!pieces.length) return null;
  // A token's exponent pattern may have taken white space after it: the unit ends at its last character.
  while (lastEnd > p && /\s/.test(text[lastEnd - 1])) lastEnd--;
  let written = text.slice(p, lastEnd);
  // Scale units: "kpc/″", "kpc per arcsec".
  const perAngle = /^\s*(?:\/|per)\s*(″|′|arcsec|arcmin|'')/.exec(text.slice(lastEnd, lastEnd + 12));
  if (perAngle) {
    pieces.push(`/${perAngle[1] === '″' || perAngle[1] === "''" || perAngle[1] === 'arcsec' ? 'arcsec' : 'arcmin'}`);
    lastEnd += perAngle[0].length;
    written = text.slice(p, lastEnd);
  }
  // Per unit of sky: "per square degree", "/deg^2".
  const perArea = /^\s*(?:per|\/)\s*(?:square degree|sq\.? ?deg(?:ree)?|deg\s*\^?\s*2|deg²)/i.exec(text.slice(lastEnd, lastEnd + 20));
  if (perArea) {
    pieces.push(' deg^-2');
    lastEnd += perArea[0].length;
    written = text.slice(p, lastEnd);
  }
  const spelled = normaliseExponent(pieces.join(''))
    .replace(/M_?⊙/g, 'Msun')
    .replace(/\^\s*\{?\s*([-+]?\d+)\s*\}?/g, '^$1')
    .replace(/(?<=[A-Za-z])([-+]\d)/g, '^$1');
  const only = spelled.trim();
  if (/^(?:h|s|g|K|%)$/.test(only) && only !== 'K') {
    // "7 h" (hours), "3 s", "2 g": not ours; a bare % is reported as a percentage
    if (only === '%') return { text: written, start: p, end: lastEnd, unit: null };
    return null;
  }
  return { text: written, start: p, end: lastEnd, unit: okUnit(only) };
}

/** parseUnit, remembered in `cache` (owned by the caller) when one is given. */
function parseUnitCached(spelled: string, cache?: Map<string, Unit | null>): Unit | null {
  const hit = cache?.get(spelled);
  if (hit !== undefined) return hit;
  const r = parseUnit(spelled);
  const unit = r.ok ? r.unit : null;
  cache?.set(spelled, unit);
  return unit;
}

/**
 * Every number in text[from, to). Numbers inside citation markers (⟦…⟧) are skipped, as are
 * digits that are part of a word or identifier (H0, z_1, 2MASS, J1234+56).
 */
export function findNumbers(text: string, from = 0, to = text.length, unitCache?: Map<string, Unit | null>): StatedNumber[] {
  const out: StatedNumber[] = [];
  let p = from;
  while (p < to) {
    const c = text.charCodeAt(p);
    if (c === 0x27e6) {
      // ⟦ … ⟧: a citation or injected value
      const close = text.indexOf('⟧', p);
      p = close < 0 ? to : close + 1;
      continue;
    }
    const isDigit = c >= 48 && c <= 57;
    const isDotDigit = c === 46 && p + 1 < to && /\d/.test(text[p + 1]) && (p === 0 || !/[\d\w]/.test(text[p - 1]));
    if (!isDigit && !isDotDigit) {
      p++;
      continue;
    }
    // Digits glued to letters, underscores or carets belong to a name or an exponent (H0, z_1,
    // 2MASS, J1234+56, s^-1).
    const prev = p > 0 ? text[p - 1] : '';
    const prev2 = p > 1 ? text[p - 2] : '';
    if (/[A-Za-z_\u0370-\u03ff^]/.test(prev) || (/[-−+]/.test(prev) && /[A-Za-z0-9_^]/.test(prev2))) {
      p = skipWord(text, p);
      continue;
    }
    const parsed = parseNumberAt(text, p, unitCache);
    if (!parsed) {
      p = skipWord(text, p);
      continue;
    }
    out.push(parsed);
    p = parsed.unit ? Math.max(parsed.end, parsed.unit.end) : parsed.end;
  }
  return out;
}

function skipWord(text: string, p: number): number {
  while (p < text.length && /[\w.]/.test(text[p])) p++;
  return p;
}

/** Parses a number expression starting at p (a digit or '.'); null when it is part of an identifier. */
function parseNumberAt(text: string, p: number, unitCache?: Map<string, Unit | null>): StatedNumber | null {
  // A sign right before the number (not a range dash after a digit).
  let start = p;
  let sign = 1;
  const prev = text[p - 1];
  if ((prev === '-' || prev === '−') && !/[\d)]\s*$/.test(text.slice(Math.max(0, p - 3), p - 1))) {
    sign = -1;
    start = p - 1;
  }
  let value: number;
  let end: number;
  let mantissaText: string;
  let digitsEnd: number;
  let precision: { significantDigits: number; resolution: number };
  // A bare power of ten starts with "10" and a caret.
  const power = text.charCodeAt(p) === 49 && text.charCodeAt(p + 1) === 48 ? matchAt(POWER_OF_TEN, text, p) : null;
  if (power && power.index === p) {
    const exponent = Number(normaliseExponent(power[1]));
    value = 10 ** exponent;
    end = p + power[0].length;
    mantissaText = power[0];
    digitsEnd = end;
    // The exponent is stated to `decimals` places: the value lies within 10^(x ± half a place).
    const decimals = (power[1].split('.')[1] ?? '').length;
    const half = 0.5 * 10 ** -decimals;
    precision = { significantDigits: Math.max(1, decimals + 1), resolution: value * (10 ** half - 10 ** -half) };
  } else {
    const m = matchAt(MANTISSA, text, p);
    if (!m) return null;
    mantissaText = m[0];
    end = p + m[0].length;
    digitsEnd = end;
    // "2MASS", "3D", "10th": a number glued to letters is not a quantity
    if (/[A-Za-z]/.test(text[end] ?? '') && !/^[eE][-+]?\d/.test(text.slice(end, end + 4)) && !/^(?:h|K|s)\b/.test(text.slice(end, end + 2))) {
      if (!/^(?:Gpc|Mpc|kpc|pc|Gyr|Myr|kyr|yr|mag|arcsec|arcmin|deg|km|cm)/.test(text.slice(end, end + 6))) return null;
    }
    value = Number(mantissaText.replace(/,/g, ''));
    precision = precisionOf(mantissaText);
    const next = nextNonSpace(text, end);
    const times = next === '×' || next === 'x' ? matchAt(TIMES_TEN, text, end) : null;
    const eNote = times || (text[end] !== 'e' && text[end] !== 'E') ? null : matchAt(E_NOTATION, text, end);
    if (times) {
      const exponent = Number(normaliseExponent(times[1] ?? times[2]));
      value *= 10 ** exponent;
      precision = { significantDigits: precision.significantDigits, resolution: precision.resolution * 10 ** exponent };
      end += times[0].length;
    } else if (eNote) {
      const exponent = Number(eNote[1]);
      value *= 10 ** exponent;
      precision = { significantDigits: precision.significantDigits, resolution: precision.resolution * 10 ** exponent };
      end += eNote[0].length;
    }
  }
  value *= sign;
  const scale = Math.abs(value) / Math.abs(Number(mantissaText.replace(/,/g, '')) || 1);

  // Uncertainty.
  let uncertainty: StatedNumber['uncertainty'] = null;
  const after = nextNonSpace(text, end);
  const pm = after === '±' || after === '+' || after === '\\' ? matchAt(PLUS_MINUS, text, end) : null;
  if (pm) {
    const err = matchAt(MANTISSA, text, end + pm[0].length);
    if (err) {
      const e = Number(err[0].replace(/,/g, '')) * (Number.isFinite(scale) && scale > 0 ? scale : 1);
      uncertainty = { plus: e, minus: e };
      end += pm[0].length + err[0].length;
    }
  } else {
    const asym = after === '^' || after === '_' ? matchAt(ASYMMETRIC, text, end) : null;
    if (asym) {
      const plus = Number(asym[1] ?? asym[4]);
      const minus = Number(asym[2] ?? asym[3]);
      uncertainty = { plus, minus };
      end += asym[0].length;
    }
  }

  // Range: "1.5–2.5", "9 to 11", "between 9 and 11".
  let range: StatedNumber['range'] = null;
  const rel = relationBefore(text, start);
  const between = nextNonSpaceBefore(text, start) === 'n' && /between\s*$/.test(text.slice(Math.max(0, start - 9), start));
  if (!uncertainty) {
    const dash = after === '–' || after === '—' || after === '-' || after === '−' || after === 't' || after === 'a' ? matchAt(RANGE_DASH, text, end) : null;
    const word = dash ? dash[0].trim() : '';
    if (dash && (word !== 'and' || between) && (word !== '-' || !/\s/.test(dash[0]))) {
      const second = matchAt(MANTISSA, text, end + dash[0].length);
      if (second && !/[A-Za-z_]/.test(text[end + dash[0].length + second[0].length] ?? '')) {
        const high = Number(second[0].replace(/,/g, '')) * (scale > 0 && Number.isFinite(scale) ? scale : 1);
        if (high > value) {
          range = { low: value, high };
          end += dash[0].length + second[0].length;
          const p2 = precisionOf(second[0]);
          precision = { significantDigits: Math.max(precision.significantDigits, p2.significantDigits), resolution: Math.min(precision.resolution, p2.resolution * (scale || 1)) };
        }
      }
    }
  }

  const unit = unitAt(text, end, unitCache);
  const qualifier: Qualifier = range ? 'range' : rel ? rel.qualifier : 'exact';
  return {
    value: range ? (range.low + range.high) / 2 : value,
    start,
    end,
    digitsStart: start,
    digitsEnd,
    text: text.slice(start, end),
    significantDigits: precision.significantDigits,
    resolution: precision.resolution,
    qualifier,
    relation: rel ? rel.relation : between ? 'between' : null,
    uncertainty,
    range,
    unit,
  };
}
