/**
 * Sentence boundaries in reading text. Sentences never cross blocks or math spans; a sentence
 * ends at '.', '!' or '?' followed by white space and a capital letter, an opening bracket or
 * the end of the block, except after the abbreviations of scientific prose (e.g., i.e., et al.,
 * Fig., Eq., Sect., Tab., cf., vs.) and single-letter initials.
 */

import type { Block, MathSpan, Sentence } from './documentReading.js';

const ABBREVIATIONS = new Set([
  'e.g', 'i.e', 'al', 'fig', 'figs', 'eq', 'eqs', 'sect', 'sec', 'secs', 'tab', 'tabs', 'cf', 'vs', 'approx', 'resp', 'ca',
  'no', 'nos', 'dr', 'prof', 'etc', 'ref', 'refs', 'app', 'vol', 'p', 'pp', 'ch', 'viz', 'c.f', 'km', 'e', 'i',
]);

const CLOSERS = new Set(['"', "'", ')', ']', '’', '”']);
const OPENERS = /[A-Z(\[ΩΛΣ⟦“"]/;

function isSpaceCode(c: number): boolean {
  return c === 32 || c === 10 || c === 9;
}

function isWordCode(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 46;
}

/** Whether the word (letters and inner dots) ending just before `end` is an abbreviation or an initial. */
function abbreviationBefore(text: string, end: number, start: number): boolean {
  let i = end;
  while (i > start && isWordCode(text.charCodeAt(i - 1))) i--;
  const length = end - i;
  if (length === 0 || length > 8) return false;
  const first = text.charCodeAt(i);
  if (length === 1 && first >= 65 && first <= 90) return true; // an initial
  let word = text.slice(i, end);
  if (word.endsWith('.')) word = word.slice(0, -1);
  return ABBREVIATIONS.has(word.toLowerCase());
}

/** Splits each block into sentences. `math` must be sorted by start. */
export function splitSentences(text: string, blocks: readonly Block[], math: readonly MathSpan[]): Sentence[] {
  const out: Sentence[] = [];
  let m = 0;
  for (const block of blocks) {
    let start = block.start;
    while (start < block.end && isSpaceCode(text.charCodeAt(start))) start++;
    for (let i = start; i < block.end; i++) {
      const c = text.charCodeAt(i);
      if (c !== 46 && c !== 33 && c !== 63) continue; // . ! ?
      let j = i + 1;
      // Fast exit: a decimal point or an abbreviation's inner dot is followed by no space.
      if (j < block.end && !isSpaceCode(text.charCodeAt(j)) && !CLOSERS.has(text[j])) continue;
      while (m < math.length && math[m].end <= i) m++;
      if (m < math.length && math[m].start <= i && i < math[m].end) continue;
      while (j < block.end && CLOSERS.has(text[j])) j++;
      if (j < block.end && !isSpaceCode(text.charCodeAt(j))) continue;
      let k = j;
      while (k < block.end && isSpaceCode(text.charCodeAt(k))) k++;
      if (k < block.end && !OPENERS.test(text[k])) continue;
      if (c === 46 && abbreviationBefore(text, i, start)) continue;
      out.push({ start, end: j });
      start = k;
      i = k - 1;
    }
    let end = block.end;
    while (end > start && isSpaceCode(text.charCodeAt(end - 1))) end--;
    if (end > start) out.push({ start, end });
  }
  return out;
}
