/**
 * Reading a LaTeX source again after a small plain edit, without reading it all: when an edit
 * (typing or deleting letters, digits, spaces and ordinary punctuation) lies inside text the
 * reader copied verbatim, the new reading is the old one with the same edit and every offset after
 * it moved. Anything else — a backslash, brace, dollar, comment, dash, a line break, an edit at the
 * edge of a block or formula, or next to what the reader transformed — returns null, and the
 * caller reads the whole source. Property-tested against full readings.
 */

import type { Block, DocumentReading, MathSpan } from './documentReading.js';
import type { MacroDefinition } from './latexScanner.js';
import { MarkdownMemory } from './markdownChunks.js';
import { splitSentences } from './sentences.js';
import { textChange } from './textChange.js';

/** Characters an edit may remove or insert: they stand for themselves wherever plain text does. */
const PLAIN = /^[A-Za-z0-9 .,;:!?()=+<>*/|@#"]*$/;
/** Edits longer than this are read in full. */
const MAX_EDIT = 64;

type LatexReading = DocumentReading & { macros: readonly MacroDefinition[] };

const isLetter = (c: string | undefined) => c !== undefined && ((c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z'));

/**
 * Whether the characters on either side of offset q of a LaTeX source belong to one token the
 * reader reads as a whole: a dash (-- or ---), $$, or a control sequence (a backslash takes the
 * next character, and every letter after it when that is a letter).
 */
function joinsAt(src: string, q: number): boolean {
  const x = src[q - 1];
  const y = src[q];
  if (x === undefined || y === undefined) return false;
  if ((x === '-' && y === '-') || (x === '$' && y === '$')) return true;
  let i = q - 1;
  if (isLetter(y)) while (i >= 0 && isLetter(src[i])) i--;
  // An odd run of backslashes ending at i starts a control sequence that reaches q.
  let slashes = 0;
  while (i - slashes >= 0 && src[i - slashes] === '\\') slashes++;
  return slashes % 2 === 1;
}

export function patchLatexReading(oldSource: string, old: LatexReading, source: string): LatexReading | null {
  if (old.unread) return null;
  // The edit: the common prefix and suffix of the two sources.
  const { prefix: p, suffix: q } = textChange(oldSource, source);
  const removed = oldSource.length - p - q;
  const inserted = source.slice(p, source.length - q);
  if (removed === 0 && inserted === '') return old;
  if (removed + inserted.length > MAX_EDIT) return null;
  const removedText = oldSource.slice(p, p + removed);
  if (!PLAIN.test(inserted) || !PLAIN.test(removedText)) return null;
  // Plain characters can still join their neighbours into one token ("mat-ter-x" less "ter" is an
  // en dash), or split one, at either edge of the edit, before or after it.
  if (joinsAt(oldSource, p) || joinsAt(oldSource, p + removed) || joinsAt(source, p) || joinsAt(source, p + inserted.length)) return null;
  const edit = old.reading.verbatimEditAt(p, p + removed);
  if (edit === null) return null;
  const at = edit.at;
  const delta = inserted.length - removed;
  const blank = /\s/.test(inserted) || /\s/.test(removedText);

  // Boundaries (block, formula, directive) may not fall inside the removed text, and where white
  // space is involved — in the edit or right around it — no boundary may be near: the reader
  // trims white space at the edges of blocks and formulas.
  const text = old.reading.text;
  let left = at;
  while (left > 0 && /\s/.test(text[left - 1])) left--;
  let right = at + removed;
  while (right < text.length && /\s/.test(text[right])) right++;
  // The reader never writes two white-space characters in a row where one came from a line
  // break or a macro: an edit that puts white space next to white space is read in full.
  const isBlank = (c: string | undefined) => c !== undefined && /\s/.test(c);
  const before = text[at - 1];
  const after = text[at + removed];
  const first = inserted.length ? inserted[0] : after;
  const last = inserted.length ? inserted[inserted.length - 1] : before;
  if ((isBlank(before) && isBlank(first)) || (isBlank(last) && isBlank(after))) return null;
  // At the end of a verbatim piece the next thing the reader writes (a space for a line break or
  // an &, a macro's text) depends on whether the text so far ends in white space: that must not change.
  if (edit.atPieceEnd && isBlank(removed ? text[at + removed - 1] : before) !== isBlank(inserted.length ? last : before)) return null;
  // The edit must fall inside a block (not in white space the reader dropped at a block's edge),
  // and not in a table's header cell, whose text the reader also keeps as the column's header.
  const holder = old.blocks.find((b) => b.start < at && at <= b.end);
  if (!holder || (holder.cell && holder.cell.header === null)) return null;
  const spacey = blank || left < at || right > at + removed;
  const near = (x: number) => spacey && x >= left && x <= right;
  for (const b of old.blocks) if (near(b.start) || near(b.end)) return null;
  for (const m of old.math) if (near(m.start) || near(m.end)) return null;
  let ok = true;
  const move = (x: number): number => {
    if (x < at) return x;
    if (x >= at + removed) return x + delta;
    ok = false;
    return x;
  };
  /** A span after the edit, moved (by `make`, in the span's own shape); one that ends before it is kept as it is. */
  const moveSpan = <T extends { start: number; end: number }>(x: T, make: (start: number, end: number) => T): T =>
    x.end < at ? x : make(x.start >= at ? move(x.start) : x.start, x.end === at ? x.end + delta : move(x.end));
  const blocks: Block[] = old.blocks.map((b) => moveSpan(b, (start, end) => (b.cell ? { kind: b.kind, start, end, cell: b.cell } : { kind: b.kind, start, end })));
  const math: MathSpan[] = old.math.map((m) => moveSpan(m, (start, end) => ({ start, end, display: m.display })));
  const srcMove = (x: number) => (x >= p + removed ? x + delta : x);
  const directives = old.directives.map((d) => ({ ...d, sourceStart: srcMove(d.sourceStart), sourceEnd: srcMove(d.sourceEnd), readingOffset: d.readingOffset >= at ? move(d.readingOffset) : d.readingOffset }));
  const includes = old.includes.map((i) => ({ ...i, sourceStart: srcMove(i.sourceStart), sourceEnd: srcMove(i.sourceEnd), readingOffset: i.readingOffset >= at ? move(i.readingOffset) : i.readingOffset }));
  if (!ok) return null;
  const reading = old.reading.withVerbatimEdit(at, p, removed, inserted);
  // Sentences never cross blocks: only the edited block is split again.
  const holderIndex = old.blocks.indexOf(holder);
  const sentences = [
    ...old.sentences.filter((x) => x.end <= holder.start),
    ...splitSentences(reading.text, [blocks[holderIndex]], math),
    ...old.sentences.filter((x) => x.start > holder.end).map((x) => ({ start: x.start + delta, end: x.end + delta })),
  ];
  return {
    ...old,
    reading,
    blocks,
    math,
    sentences,
    directives,
    includes,
    problems: old.problems.map((x) => ({ ...x, sourceStart: srcMove(x.sourceStart), sourceEnd: srcMove(x.sourceEnd) })),
  };
}

/**
 * The last reading of each LaTeX file, owned by the caller (an editor keeps one per session), so
 * that the next reading after a small edit is a patch. A reading is reused only with the same
 * macros from the including file. For Markdown files it keeps the parsed pieces instead.
 */
export class ReadingMemory {
  private readonly entries = new Map<string, { text: string; macrosKey: string; reading: LatexReading }>();
  private readonly markdownEntries = new Map<string, MarkdownMemory>();
  private patchedCount = 0;
  private readCount = 0;

  /** Reads `text` (the file `uri`) with `macros`, patching the last reading where it can. */
  readLatex(uri: string, text: string, macros: readonly MacroDefinition[], read: () => LatexReading): LatexReading {
    const macrosKey = macros.map((m) => `${m.name}\u0000${m.params}\u0000${m.defaultArg ?? ''}\u0000${m.body}`).join('\u0001');
    const previous = this.entries.get(uri);
    const patched = previous && previous.macrosKey === macrosKey ? patchLatexReading(previous.text, previous.reading, text) : null;
    const reading = patched ?? read();
    if (patched) this.patchedCount++;
    else this.readCount++;
    this.entries.set(uri, { text, macrosKey, reading });
    return reading;
  }

  /** The parsed pieces of a Markdown file, kept between its readings. */
  markdown(uri: string): MarkdownMemory {
    let m = this.markdownEntries.get(uri);
    if (!m) this.markdownEntries.set(uri, (m = new MarkdownMemory()));
    return m;
  }

  forget(uri: string): void {
    this.entries.delete(uri);
    this.markdownEntries.delete(uri);
  }

  /** How many readings were patched and how many read in full (for tests and benchmarks). */
  get stats(): { patched: number; read: number } {
    return { patched: this.patchedCount, read: this.readCount };
  }
}
