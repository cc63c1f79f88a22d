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

function isSpace(c: string): boolean {
  return c === ' ' || c === '\n' || c === '\t';
}

/** The word (letters and inner dots) ending just before offset `end`. */
function wordBefore(text: string, end: number, start: number): string {
  let i = end;
  while (i > start && /[A-Za-z.]/.test(text[i - 1])) i--;
  return text.slice(i, end);
}

/** Splits each block into sentences. `math` must be sorted by start. */
export function splitSentences(text: string, blocks: readonly Block[], math: readonly MathSpan[]): Sentence[] {
  const out: Sentence[] = [];
  let m = 0;
  for (const block of blocks) {
    let start = block.start;
    while (start < block.end && isSpace(text[start])) start++;
    // Jump from one '.', '!' or '?' to the next (a native search, not a loop over characters).
    const stop = /[.!?]/g;
    stop.lastIndex = start;
    for (let hit = stop.exec(text); hit !== null && hit.index < block.end; hit = stop.exec(text)) {
      const i = hit.index;
      const c = text[i];
      while (m < math.length && math[m].end <= i) m++;
      if (m < math.length && math[m].start <= i && i < math[m].end) continue;
      let j = i + 1;
      while (j < block.end && /["')\]’”]/.test(text[j])) j++;
      if (j < block.end && !isSpace(text[j])) continue;
      let k = j;
      while (k < block.end && isSpace(text[k])) k++;
      if (k < block.end && !/[A-Z(\[ΩΛΣ⟦“"]/.test(text[k])) continue;
      if (c === '.') {
        const word = wordBefore(text, i, start);
        const bare = word.replace(/\.$/, '').toLowerCase();
        if (ABBREVIATIONS.has(bare)) continue;
        if (/^[A-Z]$/.test(word)) continue; // an initial
      }
      out.push({ start, end: j });
      start = k;
      stop.lastIndex = k;
    }
    let end = block.end;
    while (end > start && isSpace(text[end - 1])) end--;
    if (end > start) out.push({ start, end });
  }
  return out;
}
