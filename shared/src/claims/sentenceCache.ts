/**
 * Sentence readings remembered between analyses of the same document, owned by the caller (an
 * editor keeps one per open document): after a keystroke only the edited sentence is read again;
 * every other sentence's numbers, redshifts and typed claims are taken from the cache and moved
 * to their new offsets. A reading depends only on the sentence's text and a few characters around
 * it (its window), so a hit gives exactly what reading would. Sentences away from the edit are
 * found by offset (the two texts are compared once per run for their shared start and end); only
 * those near it are looked up by their text. Entries unused in a run are dropped at its end.
 */

import type { StatedNumber } from './numberParser.js';
import type { RedshiftMention } from './redshifts.js';
import type { Sentence } from '../reader/documentReading.js';
import { textChange } from '../reader/textChange.js';
import type { Claim, SentenceReading } from './claimExtractor.js';
import type { ProseDeclaration } from './declarations.js';

/** Characters before and after a sentence that its reading may look at (relations, signs, units). */
const BEFORE = 24;
const AFTER = 64;

/** The cache key of a sentence: its text with the characters around it that its reading may see. */
export function sentenceKey(text: string, s: Pick<Sentence, 'start' | 'end'>): string {
  return `${text.slice(Math.max(0, s.start - BEFORE), s.start)}\u0001${text.slice(s.start, s.end)}\u0001${text.slice(s.end, s.end + AFTER)}`;
}

function moveNumber(n: StatedNumber, d: number): StatedNumber {
  // Written out field by field (one shape for all moved numbers): moving is most of a keystroke's work.
  const u = n.unit;
  return {
    value: n.value, start: n.start + d, end: n.end + d, digitsStart: n.digitsStart + d, digitsEnd: n.digitsEnd + d, text: n.text,
    significantDigits: n.significantDigits, resolution: n.resolution, qualifier: n.qualifier, relation: n.relation,
    uncertainty: n.uncertainty, range: n.range,
    unit: u ? { text: u.text, start: u.start + d, end: u.end + d, unit: u.unit } : null,
  };
}

function moveMention(m: RedshiftMention, d: number): RedshiftMention {
  return {
    value: m.value, range: m.range, start: m.start + d, end: m.end + d, numberStart: m.numberStart + d, list: m.list,
    listNumberStarts: m.listNumberStarts.length === 0 ? m.listNumberStarts : m.listNumberStarts.map((x) => x + d),
  };
}

function moveDeclaration(p: ProseDeclaration, d: number): ProseDeclaration {
  return { ...p, start: p.start + d, end: p.end + d, problems: p.problems.map((x) => ({ message: x.message, ranges: x.ranges.map((r) => ({ start: r.start + d, end: r.end + d })) })) };
}

function moveClaim(c: Claim, d: number): Claim {
  return {
    kind: c.kind, value: moveNumber(c.value, d), z: c.z, zRange: c.zRange, zSource: c.zSource, angleArcsec: c.angleArcsec, parameter: c.parameter,
    sinceEpoch: c.sinceEpoch, start: c.start + d, end: c.end + d, sentenceStart: c.sentenceStart + d, sentenceEnd: c.sentenceEnd + d,
    sentenceRedshifts: c.sentenceRedshifts, confidence: c.confidence, unchecked: c.unchecked,
  };
}

function move(r: SentenceReading, d: number): SentenceReading {
  if (d === 0 || (r.found.length === 0 && r.mentions.length === 0)) return r;
  return {
    ...r,
    mentions: r.mentions.map((m) => moveMention(m, d)),
    found: r.found.map((f) => ({
      kind: f.kind, value: moveNumber(f.value, d), angleArcsec: f.angleArcsec, parameter: f.parameter, sinceEpoch: f.sinceEpoch,
      start: f.start + d, end: f.end + d, sentenceStart: f.sentenceStart + d, sentenceEnd: f.sentenceEnd + d, cueDistance: f.cueDistance,
    })),
  };
}

/** Longest text whose offsets stay small integers (beyond it nothing is looked up by offset). */
const LIMIT = 1 << 30;

/**
 * Spans with a value each, in parallel arrays sorted by start (one push per span and no object
 * per entry: a keystroke stores thousands). Lookups mostly come in document order, so a cursor
 * finds them; anything else is a binary search.
 */
class SpanList<V> {
  readonly starts: number[] = [];
  readonly ends: number[] = [];
  readonly values: V[] = [];
  private sorted = true;
  private cursor = 0;

  push(start: number, end: number, value: V): void {
    const n = this.starts.length;
    if (n > 0 && start < this.starts[n - 1]) this.sorted = false;
    this.starts.push(start);
    this.ends.push(end);
    this.values.push(value);
  }

  /** Index of the span [start, end), or −1. */
  find(start: number, end: number): number {
    const starts = this.starts;
    let i = this.cursor;
    // The cursor serves when it stands at the first span starting at or after `start`.
    if (!(i <= starts.length && (i === starts.length || starts[i] >= start) && (i === 0 || starts[i - 1] < start))) {
      let lo = 0;
      let hi = starts.length;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (starts[mid] < start) lo = mid + 1;
        else hi = mid;
      }
      i = lo;
    }
    for (let k = i; k < starts.length && starts[k] === start; k++) {
      if (this.ends[k] === end) {
        this.cursor = k + 1;
        return k;
      }
    }
    this.cursor = i;
    return -1;
  }

  /** The same spans sorted by start (stable), if they were not pushed in order. */
  finish(): SpanList<V> {
    if (this.sorted) return this;
    const order = this.starts.map((_, i) => i).sort((x, y) => this.starts[x] - this.starts[y] || x - y);
    const list = new SpanList<V>();
    for (const i of order) list.push(this.starts[i], this.ends[i], this.values[i]);
    return list;
  }
}

/**
 * Values remembered per span of a text, found again in the next run's text by the edit between
 * the two: a span whose window (the span with the characters around it that its value may depend
 * on) lies in the text both runs share at the start keeps its offsets; one in the shared end moves
 * by the change in length; only spans near the edit are looked up by their text. What a run did
 * not use is forgotten at its end.
 */
class SpanMemory<V> {
  private previous = new SpanList<V>();
  private current = new SpanList<V>();
  /** Spans of the previous run near the edit, by their windowed text (built when first needed). */
  private nearEdit: Map<string, number> | null = null;

  constructor(private readonly move: (value: V, by: number) => V) {}

  take(edit: TextEdit, start: number, end: number, accept: (value: V) => boolean = () => true): V | null {
    let i = -1;
    let by = 0;
    if (edit.identical || end + AFTER <= edit.prefix) i = this.previous.find(start, end);
    else if (start - BEFORE >= edit.suffixStart) {
      by = edit.delta;
      i = this.previous.find(start - by, end - by);
    } else {
      i = this.nearTheEdit(edit).get(sentenceKey(edit.text, { start, end })) ?? -1;
      if (i >= 0) by = start - this.previous.starts[i];
    }
    if (i < 0 || !accept(this.previous.values[i])) return null;
    const value = by === 0 ? this.previous.values[i] : this.move(this.previous.values[i], by);
    this.current.push(start, end, value);
    return value;
  }

  put(start: number, end: number, value: V): void {
    this.current.push(start, end, value);
  }

  endRun(): void {
    this.previous = this.current.finish();
    this.current = new SpanList();
    this.nearEdit = null;
  }

  get size(): number {
    return this.previous.starts.length;
  }

  private nearTheEdit(edit: TextEdit): Map<string, number> {
    if (this.nearEdit) return this.nearEdit;
    this.nearEdit = new Map();
    if (edit.previousText === null) return this.nearEdit;
    const oldSuffixStart = edit.suffixStart - edit.delta;
    const { starts, ends } = this.previous;
    for (let i = 0; i < starts.length; i++) {
      if (ends[i] + AFTER <= edit.prefix || starts[i] - BEFORE >= oldSuffixStart) continue;
      this.nearEdit.set(sentenceKey(edit.previousText, { start: starts[i], end: ends[i] }), i);
    }
    return this.nearEdit;
  }
}

/** How this run's text differs from the last run's: one changed stretch between a shared start and a shared end. */
interface TextEdit {
  readonly text: string;
  readonly previousText: string | null;
  readonly identical: boolean;
  /** Length of the shared start. */
  readonly prefix: number;
  /** Offset in this run's text where the shared end begins. */
  readonly suffixStart: number;
  /** Change in length. */
  readonly delta: number;
}

function textEdit(previousText: string | null, text: string): TextEdit {
  if (previousText === null || text.length >= LIMIT || previousText.length >= LIMIT) {
    // Nothing to compare with (or too long for span ids): every span is looked up by its text.
    return { text, previousText: null, identical: false, prefix: -Infinity, suffixStart: Infinity, delta: 0 };
  }
  if (previousText === text) return { text, previousText, identical: true, prefix: text.length, suffixStart: text.length, delta: 0 };
  const { prefix: p, suffix: q } = textChange(previousText, text);
  return { text, previousText, identical: false, prefix: p, suffixStart: text.length - q, delta: text.length - previousText.length };
}

export class SentenceCache {
  private readonly readings = new SpanMemory<SentenceReading>(move);
  /** Numbers of other spans (table cells, declaration sentences), kept the same way. */
  private readonly numbers = new SpanMemory<readonly StatedNumber[]>((numbers, d) => numbers.map((n) => moveNumber(n, d)));
  /** Claims of whole tables, with the layout they were read under. */
  private readonly tables = new SpanMemory<{ layout: string; claims: readonly Claim[] }>((t, d) => ({ layout: t.layout, claims: t.claims.map((c) => moveClaim(c, d)) }));
  /** What each sentence declares (mostly nothing). */
  private readonly declarations = new SpanMemory<{ declaration: ProseDeclaration | null }>((e, d) => (e.declaration ? { declaration: moveDeclaration(e.declaration, d) } : e));
  private lastText: string | null = null;
  private edit: TextEdit = textEdit(null, '');
  private hitCount = 0;
  private missCount = 0;

  /** Starts a run on the reading text `text`. */
  beginRun(text: string): void {
    this.edit = textEdit(this.lastText, text);
    this.lastText = text;
    this.hitCount = 0;
    this.missCount = 0;
  }

  /** The reading of the sentence at [start, end) as it was last read (moved to its offsets), or null. */
  take(start: number, end: number): SentenceReading | null {
    const reading = this.readings.take(this.edit, start, end);
    if (reading) this.hitCount++;
    else this.missCount++;
    return reading;
  }

  put(start: number, end: number, reading: SentenceReading): void {
    this.readings.put(start, end, reading);
  }

  /** The numbers of the span [start, end) as last parsed (moved to its offsets), or null. */
  takeNumbers(start: number, end: number): readonly StatedNumber[] | null {
    return this.numbers.take(this.edit, start, end);
  }

  putNumbers(start: number, end: number, numbers: readonly StatedNumber[]): void {
    this.numbers.put(start, end, numbers);
  }

  /** The claims of the table spanning [start, end) if it was last read with the same layout (moved to its offsets), or null. */
  takeTable(start: number, end: number, layout: string): Claim[] | null {
    const t = this.tables.take(this.edit, start, end, (t) => t.layout === layout);
    if (t) this.hitCount++;
    else this.missCount++;
    return t ? [...t.claims] : null;
  }

  putTable(start: number, end: number, layout: string, claims: readonly Claim[]): void {
    this.tables.put(start, end, { layout, claims });
  }

  /** What the sentence at [start, end) declares: remembered, or found by `read` and remembered. */
  declarationOf(start: number, end: number, read: () => ProseDeclaration | null): ProseDeclaration | null {
    const known = this.declarations.take(this.edit, start, end);
    if (known) return known.declaration;
    const declaration = read();
    this.declarations.put(start, end, { declaration });
    return declaration;
  }

  /** Ends a run: what was not used in it is forgotten. */
  endRun(): void {
    this.declarations.endRun();
    this.readings.endRun();
    this.numbers.endRun();
    this.tables.endRun();
  }

  /** Hits and misses of sentence readings and tables in the last run (for tests and benchmarks). */
  get stats(): { hits: number; misses: number; size: number } {
    return { hits: this.hitCount, misses: this.missCount, size: this.readings.size };
  }
}
