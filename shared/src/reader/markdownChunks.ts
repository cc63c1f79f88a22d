/**
 * Markdown in independent pieces, for editors: remark parses ~0.3 MB/s, far too slow to parse a
 * long manuscript again after every keystroke. A document is cut at blank lines where CommonMark
 * closes every open block — outside fenced code, $$ math and HTML blocks that run across blank
 * lines, and before a line that can only start a new block (a letter, #, |, $, `, <, !, \).
 * Each piece parses to exactly the nodes the whole document would give there, so an editor can
 * keep each piece's parse and parse again only the piece an edit touched (`MarkdownMemory`).
 * Link-reference and footnote definitions reach across pieces: a document that has them is
 * parsed whole once, its definitions are kept, and a piece is then parsed with them appended
 * (markdownReader.ts).
 */

import type { RootContent } from 'mdast';

export interface Chunk {
  readonly start: number;
  readonly end: number;
  /** 1-based line of `start`. */
  readonly line: number;
}

/** What may be a definition that applies document-wide (`[label]: url`, `[^note]: text`), wherever it stands. */
const DEFINITION = /\[[^\]\n]+\]:/;

/** Whether a text may hold a link-reference or footnote definition. */
export function mayDefine(text: string): boolean {
  return DEFINITION.test(text);
}
/** First characters of a line that can only begin a new block after a blank line. */
const SAFE_START = /^[A-Za-z#|$`<!\\]/;
const FENCE_OPEN = /^ {0,3}(`{3,}|~{3,})/;
const MATH_OPEN = /^ {0,3}\$\$/;
const MATH_CLOSE = /^ {0,3}\$\$+[ \t]*$/;
/** HTML blocks that blank lines do not end (CommonMark kinds 1–5) and what ends each. */
const HTML_RUNS: ReadonlyArray<[RegExp, RegExp]> = [
  [/^ {0,3}<(?:script|pre|style|textarea)(?:\s|>|$)/i, /<\/(?:script|pre|style|textarea)>/i],
  [/^ {0,3}<!--/, /-->/],
  [/^ {0,3}<\?/, /\?>/],
  [/^ {0,3}<![A-Za-z]/, />/],
  [/^ {0,3}<!\[CDATA\[/, /\]\]>/],
];

/** The pieces of a Markdown document, or null when it must be parsed whole (it ends inside code, math or HTML). */
export function markdownChunks(text: string): Chunk[] | null {
  const chunks: Chunk[] = [];
  let chunkStart = 0;
  let chunkLine = 1;
  let line = 1;
  let fence: string | null = null;
  let math = false;
  let html: RegExp | null = null;
  // Front matter (a first line of ---) runs to its closing --- whatever lies between.
  let frontMatter = /^---[ \t]*(?:\r?\n|$)/.test(text);
  let previousBlank = false;
  for (let at = 0; at < text.length; line++) {
    const nl = text.indexOf('\n', at);
    const end = nl < 0 ? text.length : nl;
    const content = text.slice(at, end);
    const blank = content.trim() === '';
    if (frontMatter) {
      if (line > 1 && /^---[ \t]*$/.test(content)) frontMatter = false;
      previousBlank = false;
      at = nl < 0 ? text.length : nl + 1;
      continue;
    }
    if (fence === null && !math && html === null && previousBlank && !blank && at > chunkStart && SAFE_START.test(content)) {
      chunks.push({ start: chunkStart, end: at, line: chunkLine });
      chunkStart = at;
      chunkLine = line;
    }
    if (fence !== null) {
      const m = FENCE_OPEN.exec(content);
      if (m && m[1][0] === fence[0] && m[1].length >= fence.length && content.trim() === m[1]) fence = null;
    } else if (math) {
      if (MATH_CLOSE.test(content)) math = false;
    } else if (html !== null) {
      if (html.test(content)) html = null;
    } else {
      const f = FENCE_OPEN.exec(content);
      if (f) fence = f[1];
      else if (MATH_OPEN.test(content)) math = true;
      else {
        for (const [open, close] of HTML_RUNS) {
          if (open.test(content)) {
            if (!close.test(content.replace(open, ''))) html = close;
            break;
          }
        }
      }
    }
    previousBlank = blank;
    at = nl < 0 ? text.length : nl + 1;
  }
  if (fence !== null || math || html !== null || frontMatter) return null;
  chunks.push({ start: chunkStart, end: text.length, line: chunkLine });
  return chunks;
}

/** A copy of parsed nodes with every position moved by `offset` characters and `lines` lines. */
export function shiftNodes(nodes: readonly RootContent[], offset: number, lines: number): RootContent[] {
  if (offset === 0 && lines === 0) return nodes as RootContent[];
  const shift = (node: Record<string, unknown>): Record<string, unknown> => {
    const copy: Record<string, unknown> = { ...node };
    const p = node.position as { start: { line: number; column: number; offset?: number }; end: { line: number; column: number; offset?: number } } | undefined;
    if (p) {
      copy.position = {
        start: { line: p.start.line + lines, column: p.start.column, offset: (p.start.offset ?? 0) + offset },
        end: { line: p.end.line + lines, column: p.end.column, offset: (p.end.offset ?? 0) + offset },
      };
    }
    if (Array.isArray(node.children)) copy.children = (node.children as Array<Record<string, unknown>>).map(shift);
    return copy;
  };
  return nodes.map((n) => shift(n as unknown as Record<string, unknown>) as unknown as RootContent);
}

/**
 * The parse of each piece of a Markdown file from the last reading, kept by the piece's text (an
 * editor's; see markdownReader.ts), with the definitions the pieces were parsed with. What the
 * last reading did not use is dropped.
 */
export class MarkdownMemory {
  private previous = new Map<string, readonly RootContent[]>();
  private current = new Map<string, readonly RootContent[]>();
  /** The definitions appended to each piece, and the texts of the pieces that hold them. */
  private definitions: { text: string; holders: readonly string[] } | null = null;
  private parsedCount = 0;
  private reusedCount = 0;

  /** The nodes of `chunkText` (positions relative to it), parsed by `parse` unless remembered. */
  nodes(chunkText: string, parse: (text: string) => readonly RootContent[]): readonly RootContent[] {
    let nodes = this.current.get(chunkText) ?? this.previous.get(chunkText);
    if (nodes) this.reusedCount++;
    else {
      nodes = parse(chunkText);
      this.parsedCount++;
    }
    this.current.set(chunkText, nodes);
    return nodes;
  }

  /** Stores the nodes of a piece taken from a parse of the whole document. */
  put(chunkText: string, nodes: readonly RootContent[]): void {
    this.current.set(chunkText, nodes);
  }

  /**
   * The definitions text to parse pieces with, if the pieces that hold definitions are the same
   * as last time; null when the whole document must be parsed again to find them.
   */
  definitionsFor(holders: readonly string[]): string | null {
    const d = this.definitions;
    if (!d || d.holders.length !== holders.length || d.holders.some((h, i) => h !== holders[i])) return null;
    return d.text;
  }

  /** Sets the definitions pieces are parsed with (null: none); pieces parsed with others are dropped. */
  setDefinitions(definitions: { text: string; holders: readonly string[] } | null): void {
    if ((definitions?.text ?? null) !== (this.definitions?.text ?? null)) {
      this.previous = new Map();
      this.current = new Map();
    }
    this.definitions = definitions;
  }

  endRun(): void {
    this.previous = this.current;
    this.current = new Map();
  }

  /** Pieces parsed and reused since the memory was made (for tests and benchmarks). */
  get stats(): { parsed: number; reused: number } {
    return { parsed: this.parsedCount, reused: this.reusedCount };
  }
}
