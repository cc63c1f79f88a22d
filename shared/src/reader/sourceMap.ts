/**
 * Reading text with a map back to the source. Readers turn markup into plain "reading text"
 * (what a person reads: `$D_L = 6.6$\,Gpc` becomes `D_L = 6.6 Gpc`) and every character of
 * that text keeps the source range it came from, so that findings point at the author's text.
 *
 * A reader writes into an OutputStore, piece by piece, into several outputs at once (a
 * paragraph, a footnote met inside it, table cells); each output ("draft") becomes a block.
 * The store keeps every piece as a record in one growing Int32Array — no object per piece —
 * because a megabyte of LaTeX makes about a hundred thousand pieces, and keeping each alive as
 * a string and an object until the end made the garbage collector the slowest part of reading.
 * A verbatim piece maps character by character to its source; a replacement (a macro, a symbol,
 * an expansion) maps every character to the whole source span it replaced.
 */

/** One output being written: it becomes one block of the reading text. */
export interface Draft {
  readonly id: number;
  /** Characters written so far. */
  length: number;
  /** Char code of the last character written (0 before any). */
  last: number;
  /** True while nothing but white space has been written. */
  blank: boolean;
  /** Index of this draft's first record, to read its text back quickly. */
  firstRecord: number;
}

// Record fields (stride 5): draft id, offset in the draft, source start, source end, string index
// (VERBATIM: a copy of the source; SPACE: one space; otherwise an index into the strings).
const R_DRAFT = 0;
const R_OUT = 1;
const R_START = 2;
const R_END = 3;
const R_STR = 4;
const R_STRIDE = 5;
const VERBATIM = -1;
const SPACE = -2;
/** A verbatim copy the reader made only because of what it contains (a siunitx number): exact, but not to be patched. */
const VERBATIM_FIXED = -3;

// Map fields of ReadingText (stride 4): reading offset, source start, source end, and how the piece
// maps: 1 a verbatim copy of plain text (characters map one to one; a plain edit inside it reads
// the same), 2 a verbatim copy the reader chose for its content (one to one, but an edit may change
// how it is read), 0 a replacement (every character maps to the whole source span).
const M_OUT = 0;
const M_START = 1;
const M_END = 2;
const M_EXACT = 3;
const M_STRIDE = 4;

const UTF16 = new TextDecoder('utf-16le');
const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** A string from UTF-16 code units (TextDecoder where the platform is little-endian, as nearly all are). */
function decodeUnits(units: Uint16Array): string {
  if (LITTLE_ENDIAN) return UTF16.decode(units);
  let out = '';
  for (let i = 0; i < units.length; i += 8192) out += String.fromCharCode(...units.subarray(i, i + 8192));
  return out;
}

function isBlankCode(c: number): boolean {
  return c === 32 || c === 10 || c === 9 || c === 13;
}

/** Collects the pieces of every draft of one document. */
export class OutputStore {
  private records: Int32Array;
  private count = 0;
  private readonly strings: string[] = [];
  private nextId = 0;

  constructor(private readonly source: string) {
    // About one piece per 8 characters of source: allocated once, so that growing it neither
    // copies nor keeps the young-generation collector busy.
    this.records = new Int32Array(Math.max(1 << 12, Math.ceil(source.length / 8)) * R_STRIDE);
  }

  /** A new, empty output. */
  draft(): Draft {
    return { id: this.nextId++, length: 0, last: 0, blank: true, firstRecord: -1 };
  }

  private push(d: Draft, start: number, end: number, str: number, len: number): void {
    if (this.count * R_STRIDE + R_STRIDE > this.records.length) {
      const grown = new Int32Array(this.records.length * 2);
      grown.set(this.records);
      this.records = grown;
    }
    const r = this.records;
    const k = this.count * R_STRIDE;
    r[k + R_DRAFT] = d.id;
    r[k + R_OUT] = d.length;
    r[k + R_START] = start;
    r[k + R_END] = end;
    r[k + R_STR] = str;
    if (d.firstRecord < 0) d.firstRecord = this.count;
    this.count++;
    d.length += len;
  }

  /** Appends source[start, end) of the original source verbatim (`plain`: it would be copied whatever it contained). */
  copy(d: Draft, start: number, end: number, plain = true): void {
    const s = this.source;
    // White space never doubles, and an output never starts with it.
    if (d.last === 0 || isBlankCode(d.last)) while (start < end && isBlankCode(s.charCodeAt(start))) start++;
    if (end <= start) return;
    if (d.blank) {
      for (let i = start; i < end; i++) {
        if (!isBlankCode(s.charCodeAt(i))) {
          d.blank = false;
          break;
        }
      }
    }
    d.last = s.charCodeAt(end - 1);
    const k = (this.count - 1) * R_STRIDE;
    const r = this.records;
    // A copy that continues the draft's previous verbatim piece extends it.
    const kind = plain ? VERBATIM : VERBATIM_FIXED;
    if (k >= 0 && r[k + R_DRAFT] === d.id && r[k + R_STR] === kind && r[k + R_END] === start) {
      r[k + R_END] = end;
      d.length += end - start;
      return;
    }
    this.push(d, start, end, kind, end - start);
  }

  /** Appends `text` standing for source[start, end). */
  replace(d: Draft, text: string, start: number, end: number): void {
    if (text === ' ') {
      if (d.last === 0 || isBlankCode(d.last)) return;
      d.last = 32;
      this.push(d, start, end, SPACE, 1);
      return;
    }
    if (d.last === 0 || isBlankCode(d.last)) {
      let lead = 0;
      while (lead < text.length && isBlankCode(text.charCodeAt(lead))) lead++;
      if (lead > 0) text = text.slice(lead);
    }
    if (!text) return;
    if (d.blank) {
      for (let i = 0; i < text.length; i++) {
        if (!isBlankCode(text.charCodeAt(i))) {
          d.blank = false;
          break;
        }
      }
    }
    d.last = text.charCodeAt(text.length - 1);
    this.strings.push(text);
    this.push(d, start, end, this.strings.length - 1, text.length);
  }

  /** Appends a space standing for source[start, end), unless the draft is empty or already ends in white space. */
  space(d: Draft, start: number, end: number): void {
    if (d.last === 0 || isBlankCode(d.last)) return;
    this.replace(d, ' ', start, end);
  }

  /** The text of the record at field offset k. */
  private pieceText(k: number): string {
    const str = this.records[k + R_STR];
    return str === VERBATIM || str === VERBATIM_FIXED ? this.source.slice(this.records[k + R_START], this.records[k + R_END]) : str === SPACE ? ' ' : this.strings[str];
  }

  /** The text of one draft. */
  textOf(d: Draft): string {
    if (d.firstRecord < 0) return '';
    const parts: string[] = [];
    const r = this.records;
    for (let i = d.firstRecord; i < this.count; i++) {
      const k = i * R_STRIDE;
      if (r[k + R_DRAFT] !== d.id) continue;
      parts.push(this.pieceText(k));
    }
    return parts.join('');
  }

  /**
   * The reading text of `drafts`, in that order, with `separator` between them, and each draft's
   * start offset in it.
   */
  assemble(drafts: readonly Draft[], separator: string): { reading: ReadingText; starts: number[] } {
    const order = new Int32Array(this.nextId).fill(-1);
    drafts.forEach((d, i) => (order[d.id] = i));
    // Counting sort of the records by the position of their draft.
    const perDraft = new Int32Array(drafts.length + 1);
    const r = this.records;
    for (let i = 0; i < this.count; i++) {
      const o = order[r[i * R_STRIDE + R_DRAFT]];
      if (o >= 0) perDraft[o + 1]++;
    }
    for (let i = 0; i < drafts.length; i++) perDraft[i + 1] += perDraft[i];
    const sorted = new Int32Array(perDraft[drafts.length]);
    const fill = perDraft.slice(0, drafts.length);
    for (let i = 0; i < this.count; i++) {
      const o = order[r[i * R_STRIDE + R_DRAFT]];
      if (o >= 0) sorted[fill[o]++] = i;
    }
    const starts: number[] = new Array(drafts.length);
    let total = 0;
    for (const d of drafts) total += d.length;
    total += Math.max(0, drafts.length - 1) * separator.length;
    // The text is written as UTF-16 code units into one buffer and decoded once: no string per piece.
    const units = new Uint16Array(total);
    const source = this.source;
    const map = new Int32Array((sorted.length + drafts.length) * M_STRIDE);
    let m = 0;
    let offset = 0;
    const write = (str: string) => {
      for (let i = 0; i < str.length; i++) units[offset + i] = str.charCodeAt(i);
      offset += str.length;
    };
    for (let j = 0; j < drafts.length; j++) {
      if (j > 0) {
        const prevEnd = m ? map[m - M_STRIDE + M_END] : 0;
        map[m++] = offset;
        map[m++] = prevEnd;
        map[m++] = prevEnd;
        map[m++] = 0;
        write(separator);
      }
      starts[j] = offset;
      const draftStart = offset;
      for (let q = perDraft[j]; q < perDraft[j + 1]; q++) {
        const k = sorted[q] * R_STRIDE;
        const str = r[k + R_STR];
        map[m++] = draftStart + r[k + R_OUT];
        map[m++] = r[k + R_START];
        map[m++] = r[k + R_END];
        map[m++] = str === VERBATIM ? 1 : str === VERBATIM_FIXED ? 2 : 0;
        offset = draftStart + r[k + R_OUT];
        if (str === VERBATIM || str === VERBATIM_FIXED) {
          const end = r[k + R_END];
          for (let i = r[k + R_START]; i < end; i++) units[offset++] = source.charCodeAt(i);
        } else if (str === SPACE) units[offset++] = 32;
        else write(this.strings[str]);
      }
      offset = draftStart + drafts[j].length;
    }
    const text = decodeUnits(units);
    return { reading: new ReadingText(text, map.subarray(0, m)), starts };
  }
}

/** Reading text and the map from its offsets to source offsets. */
export class ReadingText {
  constructor(
    readonly text: string,
    private readonly map: ArrayLike<number>,
  ) {}

  /** An empty reading. */
  static empty(): ReadingText {
    return new ReadingText('', new Int32Array(0));
  }

  /** Field offset of the map entry containing reading offset `out` (the last starting at or before it), or −1. */
  private entryAt(out: number): number {
    const n = this.map.length / M_STRIDE;
    if (n === 0) return -1;
    let lo = 0;
    let hi = n - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.map[mid * M_STRIDE] <= out) lo = mid;
      else hi = mid - 1;
    }
    return lo * M_STRIDE;
  }

  /** Source offset of the character at reading offset `out` (its start). */
  sourceStart(out: number): number {
    const k = this.entryAt(out);
    if (k < 0) return 0;
    const c = this.map;
    return c[k + M_EXACT] !== 0 ? Math.min(c[k + M_START] + (out - c[k + M_OUT]), c[k + M_END]) : c[k + M_START];
  }

  /** Source offset just past the character before reading offset `outEnd`. */
  sourceEnd(outEnd: number): number {
    if (outEnd <= 0) return this.sourceStart(0);
    const k = this.entryAt(outEnd - 1);
    if (k < 0) return 0;
    const c = this.map;
    return c[k + M_EXACT] !== 0 ? Math.min(c[k + M_START] + (outEnd - c[k + M_OUT]), c[k + M_END]) : c[k + M_END];
  }

  /**
   * Calls `visit` for each piece of the reading text, in order: its reading range, its source
   * range, and whether it is a verbatim copy.
   */
  forEachPiece(visit: (outStart: number, outEnd: number, srcStart: number, srcEnd: number, exact: boolean) => void): void {
    const c = this.map;
    for (let k = 0; k < c.length; k += M_STRIDE) {
      const outEnd = k + M_STRIDE < c.length ? c[k + M_STRIDE + M_OUT] : this.text.length;
      visit(c[k + M_OUT], outEnd, c[k + M_START], c[k + M_END], c[k + M_EXACT] !== 0);
    }
  }

  /**
   * For an edit of source[srcStart, srcEnd) that lies inside one verbatim piece (not at its first
   * character): where the edit falls in the reading text. Null when the edit touches anything the
   * reader transformed.
   */
  verbatimEditAt(srcStart: number, srcEnd: number): { at: number; atPieceEnd: boolean } | null {
    const c = this.map;
    for (let k = 0; k < c.length; k += M_STRIDE) {
      if (c[k + M_EXACT] !== 1) continue;
      if (c[k + M_START] < srcStart && srcEnd <= c[k + M_END]) return { at: c[k + M_OUT] + (srcStart - c[k + M_START]), atPieceEnd: srcEnd === c[k + M_END] };
    }
    return null;
  }

  /**
   * This reading after replacing `removed` characters at reading offset `at` (source offset
   * `srcAt`, inside a verbatim piece: see verbatimEditAt) by `inserted`, which stands for
   * itself. Offsets after the edit move by the change in length.
   */
  withVerbatimEdit(at: number, srcAt: number, removed: number, inserted: string): ReadingText {
    const delta = inserted.length - removed;
    const text = this.text.slice(0, at) + inserted + this.text.slice(at + removed);
    const c = Int32Array.from(this.map);
    for (let k = 0; k < c.length; k += M_STRIDE) {
      // The piece holding the edit starts before it, so only what follows moves.
      if (c[k + M_OUT] >= at + removed) c[k + M_OUT] += delta;
      if (c[k + M_START] >= srcAt + removed) c[k + M_START] += delta;
      if (c[k + M_END] >= srcAt + removed) c[k + M_END] += delta;
    }
    return new ReadingText(text, c);
  }

  /** Source range [start, end) of the reading range [outStart, outEnd). */
  sourceRange(outStart: number, outEnd: number): { start: number; end: number } {
    const start = this.sourceStart(outStart);
    return { start, end: Math.max(start, this.sourceEnd(outEnd)) };
  }
}
