/**
 * The plain-text reader, for text pulled out of a PDF or pasted by a referee: paragraphs are
 * separated by blank lines, lines within a paragraph are joined (a word hyphenated across a
 * line break is joined too), and everything else is read as it stands, Unicode symbols
 * included. Never throws.
 */

import type { Block, DocumentReading } from './documentReading.js';
import { splitSentences } from './sentences.js';
import { OutputStore } from './sourceMap.js';

/** Reads plain text. */
export function readPlainText(source: string): DocumentReading {
  const store = new OutputStore(source);
  const drafts = [];
  const paragraph = /[^\n]*\S[^\n]*(?:\n[^\n]*\S[^\n]*)*/g;
  for (let m = paragraph.exec(source); m !== null; m = paragraph.exec(source)) {
    const d = store.draft();
    const start = m.index;
    const end = start + m[0].length;
    let from = start;
    for (let i = start; i < end; i++) {
      if (source[i] !== '\n') continue;
      // "dis-\ntance" → "distance"; any other line break → a space
      if (i > from && source[i - 1] === '-' && /[a-z]/.test(source[i + 1] ?? '') && /[a-z]/.test(source[i - 2] ?? '')) {
        store.copy(d, from, i - 1);
      } else {
        store.copy(d, from, i);
        store.space(d, i, i + 1);
      }
      from = i + 1;
    }
    store.copy(d, from, end);
    drafts.push(d);
  }
  const nonEmpty = drafts.filter((d) => d.length > 0);
  const { reading, starts } = store.assemble(nonEmpty, '\n\n');
  const blocks: Block[] = nonEmpty.map((d, i) => ({ kind: 'paragraph', start: starts[i], end: starts[i] + d.length }));
  return {
    format: 'plaintext',
    reading,
    blocks,
    math: [],
    sentences: splitSentences(reading.text, blocks, []),
    directives: [],
    includes: [],
    texRoot: null,
    frontMatter: null,
    problems: [],
  };
}
