/**
 * What a reader makes of a document, whatever its format: reading text mapped back to the
 * source, its blocks (paragraphs, headings, captions, footnotes, table cells), math spans,
 * sentences, directive comments, included files and the problems met on the way.
 * Offsets in `blocks`, `math` and `sentences` are reading-text offsets; the others are source
 * offsets.
 */

import { ReadingText } from './sourceMap.js';

export type DocumentFormat = 'latex' | 'markdown' | 'plaintext';

export type BlockKind = 'paragraph' | 'heading' | 'caption' | 'footnote' | 'table-cell';

/** Where a table cell sits, and the header of its column. */
export interface TableCellPosition {
  /** Tables are numbered from 0 in document order. */
  readonly table: number;
  readonly row: number;
  readonly column: number;
  readonly header: string | null;
}

export interface Block {
  readonly kind: BlockKind;
  readonly start: number;
  readonly end: number;
  readonly cell?: TableCellPosition;
}

export interface MathSpan {
  readonly start: number;
  readonly end: number;
  readonly display: boolean;
}

export interface Sentence {
  readonly start: number;
  readonly end: number;
}

/** A `comove:` directive comment (`% comove: …`, `<!-- comove: … -->`) or front-matter entry. */
export interface Directive {
  /** The text after `comove:`, trimmed. */
  readonly text: string;
  readonly sourceStart: number;
  readonly sourceEnd: number;
  /** Reading-text offset where the directive stood, for scoping (it applies from here on). */
  readonly readingOffset: number;
}

/** `\input`, `\include`, `\subfile` and the like. */
export interface Include {
  readonly command: string;
  readonly path: string;
  readonly sourceStart: number;
  readonly sourceEnd: number;
  readonly readingOffset: number;
}

export type ProblemSeverity = 'error' | 'warning' | 'information';

export interface ReaderProblem {
  readonly message: string;
  readonly sourceStart: number;
  readonly sourceEnd: number;
  readonly severity: ProblemSeverity;
}

export interface DocumentReading {
  readonly format: DocumentFormat;
  readonly reading: ReadingText;
  readonly blocks: readonly Block[];
  readonly math: readonly MathSpan[];
  readonly sentences: readonly Sentence[];
  readonly directives: readonly Directive[];
  readonly includes: readonly Include[];
  /** `% !TEX root = …` if present. */
  readonly texRoot: string | null;
  /** Front matter of a Markdown document (parsed YAML), if any. */
  readonly frontMatter: Readonly<Record<string, unknown>> | null;
  readonly problems: readonly ReaderProblem[];
  /** True when the file could not be read at all (binary, too large). */
  readonly unread?: boolean;
}

/** Marker the readers put in the reading text for a citation: ⟦cite:key1,key2⟧. */
export const CITATION_OPEN = '⟦cite:';
/** Marker for a value injected at build time (`\variable{…}`): ⟦value⟧. */
export const INJECTED_VALUE = '⟦value⟧';

/** A reading with nothing read and one problem saying why (a binary file, a reader failure). */
export function unreadDocument(format: DocumentFormat, message: string): DocumentReading {
  return {
    format,
    reading: ReadingText.empty(),
    blocks: [],
    math: [],
    sentences: [],
    directives: [],
    includes: [],
    texRoot: null,
    frontMatter: null,
    problems: [{ message, sourceStart: 0, sourceEnd: 0, severity: 'error' }],
    unread: true,
  };
}
