/**
 * The reading half of the core as one call: text in (a file, or a LaTeX project followed from
 * its root through \input, \include and \subfile), declarations, claims and problems out, with
 * source ranges. The core never touches the file system: included files come from a resolver
 * the caller passes in.
 */

import { unreadDocument, type DocumentFormat, type DocumentReading, type ReaderProblem } from '../reader/documentReading.js';
import { readLatex, type MacroDefinition } from '../reader/latexScanner.js';
import type { ReadingMemory } from '../reader/incrementalReading.js';
import { readMarkdown } from '../reader/markdownReader.js';
import { readPlainText } from '../reader/plainTextReader.js';
import type { SentenceCache } from './sentenceCache.js';
import { extractClaims, type Claim } from './claimExtractor.js';
import type { Declaration, DeclarationProblem, SkipRegion } from './declarations.js';

export interface SourceFile {
  readonly uri: string;
  readonly text: string;
}

/** Finds an included file: `path` as written in `fromUri`; null when it cannot be had. */
export type IncludeResolver = (fromUri: string, path: string) => SourceFile | null;

/** Largest file read, in characters; beyond it the file is reported and not read. */
export const MAX_FILE_CHARS = 64 * 1024 * 1024;
/** Deepest chain of \input files followed. */
export const MAX_INCLUDE_DEPTH = 16;

export interface FileExtraction {
  readonly uri: string;
  /** The source text that was read (offsets and fixes refer to it). */
  readonly text: string;
  readonly format: DocumentFormat;
  readonly reading: DocumentReading;
  readonly declarations: readonly Declaration[];
  readonly skips: readonly SkipRegion[];
  readonly claims: readonly Claim[];
  readonly problems: readonly ReaderProblem[];
  readonly declarationProblems: readonly DeclarationProblem[];
}

export interface ProjectExtraction {
  readonly files: readonly FileExtraction[];
}

/** The format of a file from its name (and, for LaTeX, its content). */
export function formatOf(uri: string, text = ''): DocumentFormat {
  const lower = uri.toLowerCase();
  if (/\.(?:tex|ltx|latex|sty|cls|bbl)$/.test(lower)) return 'latex';
  if (/\.(?:md|markdown|mdown|mkd|qmd|rmd)$/.test(lower)) return 'markdown';
  if (/\.txt$/.test(lower) || !/\\(?:documentclass|begin\{document\}|section\{)/.test(text)) return 'plaintext';
  return 'latex';
}

/** Reads one file in the format its name says; binary and oversized files become a problem, not a crash. */
export function readFile(file: SourceFile, format: DocumentFormat = formatOf(file.uri, file.text), macros: readonly MacroDefinition[] = [], memory?: ReadingMemory): DocumentReading & { macros?: readonly MacroDefinition[] } {
  if (file.text.length > MAX_FILE_CHARS) {
    return unreadDocument(format, `the file is too large to read (${(file.text.length / 1e6).toFixed(0)} MB; the limit is ${MAX_FILE_CHARS / 1024 / 1024} MB)`);
  }
  if (file.text.slice(0, 8192).includes('\u0000')) {
    return unreadDocument(format, 'this is a binary file, not a manuscript');
  }
  if (format === 'latex') return memory ? memory.readLatex(file.uri, file.text, macros, () => readLatex(file.text, { macros })) : readLatex(file.text, { macros });
  if (format === 'markdown') return readMarkdown(file.text, memory?.markdown(file.uri));
  return readPlainText(file.text);
}

function extractFile(file: SourceFile, reading: DocumentReading, cache?: SentenceCache): FileExtraction {
  const { claims, declarations } = extractClaims(reading, cache);
  return {
    uri: file.uri,
    text: file.text,
    format: reading.format,
    reading,
    declarations: declarations.declarations,
    skips: declarations.skips,
    claims,
    problems: reading.problems,
    declarationProblems: declarations.problems,
  };
}

/**
 * Reads a file and, for LaTeX, the files it includes (depth first, each once), passing the
 * root's macros on. Never throws.
 */
export interface ExtractOptions {
  /** Sentence readings kept between calls, per file (an editor's; see sentenceCache.ts). */
  readonly sentenceCache?: (uri: string) => SentenceCache | undefined;
  /** Last readings of LaTeX files, patched after small edits (an editor's; see incrementalReading.ts). */
  readonly readingMemory?: ReadingMemory;
}

export function extractProject(root: SourceFile, resolve: IncludeResolver = () => null, options: ExtractOptions = {}): ProjectExtraction {
  const files: FileExtraction[] = [];
  const seen = new Set<string>();
  const visit = (file: SourceFile, macros: readonly MacroDefinition[], depth: number) => {
    if (seen.has(file.uri)) return;
    seen.add(file.uri);
    const reading = readFile(file, formatOf(file.uri, file.text), macros, options.readingMemory);
    const extraction = extractFile(file, reading, options.sentenceCache?.(file.uri));
    const problems = [...extraction.problems];
    files.push({ ...extraction, problems });
    if (reading.format !== 'latex') return;
    const known = [...macros, ...(reading.macros ?? [])];
    for (const inc of reading.includes) {
      if (depth >= MAX_INCLUDE_DEPTH) {
        problems.push({ message: `\\${inc.command}{${inc.path}} is nested too deeply to follow`, sourceStart: inc.sourceStart, sourceEnd: inc.sourceEnd, severity: 'warning' });
        continue;
      }
      const child = resolve(file.uri, inc.path);
      if (!child) {
        problems.push({ message: `\\${inc.command}{${inc.path}}: the file cannot be found`, sourceStart: inc.sourceStart, sourceEnd: inc.sourceEnd, severity: 'warning' });
        continue;
      }
      visit(child, known, depth + 1);
    }
  };
  visit(root, [], 0);
  return { files };
}

/** Line and character (0-based, UTF-16 code units, as in LSP) of a source offset. */
export function lineColumn(text: string, offset: number, lineStarts: readonly number[] = lineStartsOf(text)): { line: number; character: number } {
  let lo = 0;
  let hi = lineStarts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (lineStarts[mid] <= offset) lo = mid;
    else hi = mid - 1;
  }
  return { line: lo, character: offset - lineStarts[lo] };
}

/** Offsets at which each line starts. */
export function lineStartsOf(text: string): number[] {
  const starts = [0];
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) starts.push(i + 1);
  return starts;
}
