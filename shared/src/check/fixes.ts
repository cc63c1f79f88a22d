/**
 * Replacement text for a stated number, in the author's notation: only the digits of the
 * mantissa change, to the same number of decimals (or the same rounding place for integers such
 * as 6600), with thousands separators kept; the exponent, unit, qualifier and markup around them
 * stay as written (`\SI{6.6}{\giga\parsec}` stays siunitx). A number that did not come verbatim
 * from the source (it was expanded from a macro) or that states a range or an uncertainty is
 * not rewritten.
 */

import type { StatedNumber } from '../claims/numberParser.js';
import type { DocumentReading } from '../reader/documentReading.js';

/** A text edit on the source: replace source[start, end) by newText. */
export interface SourceEdit {
  readonly start: number;
  readonly end: number;
  readonly newText: string;
}

/** The mantissa digits of `n` rewritten for `value` (same decimals / rounding place), or null if it cannot be. */
export function formatLike(n: StatedNumber, digits: string, value: number): string | null {
  if (!Number.isFinite(value)) return null;
  const plain = digits.replace(/[,\s]|\{,\}|\\,/g, '');
  const mantissa = Number(plain);
  if (!Number.isFinite(mantissa) || mantissa === 0) return null;
  // The exponent part of the stated number (1.2×10^28: 1e28), kept as written.
  const scale = n.value / mantissa;
  if (!Number.isFinite(scale) || scale === 0) return null;
  const target = value / scale;
  const dot = plain.indexOf('.');
  let text: string;
  if (dot >= 0) {
    text = target.toFixed(plain.length - dot - 1);
  } else {
    // Integers: round to the place of the last significant digit (6600 stated to two digits → hundreds).
    const place = Math.max(1, n.resolution / scale);
    text = String(Math.round(target / place) * place);
  }
  if (/^-?0*(?:\.0*)?$/.test(text)) return null; // rounds to zero: no honest rewrite
  if (digits.includes(',') || digits.includes('{,}') || digits.includes('\\,')) {
    const sep = digits.includes('{,}') ? '{,}' : digits.includes('\\,') ? '\\,' : ',';
    const [int, frac] = text.split('.');
    text = int.replace(/\B(?=(\d{3})+(?!\d))/g, sep) + (frac !== undefined ? `.${frac}` : '');
  }
  return text;
}

/**
 * The edit that restates `n` as `value`, or a reason it cannot be made. With `exact`, the value
 * is written in full (a declared parameter: H0 = 70 becomes 67.66, not 70).
 */
export function restate(doc: DocumentReading, source: string, n: StatedNumber, value: number, exact = false): SourceEdit | string {
  if (n.range || n.uncertainty) return 'a range or a value with an uncertainty is not rewritten';
  const r = doc.reading.sourceRange(n.digitsStart, n.digitsEnd);
  const written = source.slice(r.start, r.end);
  const read = doc.reading.text.slice(n.digitsStart, n.digitsEnd);
  // Only digits copied verbatim from the source can be rewritten in place.
  if (written.replace(/\{,\}|\\,/g, ',') !== read) return 'the number is not written out in the source (it comes from a macro)';
  const text = exact ? (Number.isFinite(value) ? String(+value.toPrecision(12)) : null) : formatLike(n, written, value);
  if (text === null) return 'the value cannot be written in the stated notation';
  return { start: r.start, end: r.end, newText: text };
}
