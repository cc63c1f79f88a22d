/**
 * A fast single-pass LaTeX reader. It turns a LaTeX source into reading text (what a person
 * reads, with symbols, units and the author's own macros expanded) mapped back to the source,
 * and records blocks, math spans, table cells with their column headers, directive comments,
 * included files and problems. It never throws: malformed input (unbalanced braces or math,
 * unknown macros, runaway definitions) is read as far as it makes sense and reported.
 *
 * It is not a TeX engine: it knows the commands that matter for reading numbers (see
 * latexSymbols.ts) and expands simple user macros (\newcommand, \renewcommand,
 * \providecommand, \def with #1…#9 parameters, \DeclareMathOperator), up to a depth of 16.
 */

import {
  CITATION_OPEN,
  INJECTED_VALUE,
  type Block,
  type BlockKind,
  type Directive,
  type DocumentReading,
  type Include,
  type MathSpan,
  type ReaderProblem,
  type TableCellPosition,
  unreadDocument,
} from './documentReading.js';
import {
  CITATION_MACROS,
  DROPPED_WITH_ARGS,
  FONT_SWITCHES,
  MATH_ENVIRONMENTS,
  SECTION_MACROS,
  SI_PREFIXES,
  SI_UNITS,
  SKIPPED_ENVIRONMENTS,
  SYMBOL_MACROS,
  TABLE_ENVIRONMENTS,
  TRANSPARENT_ONE_ARG,
} from './latexSymbols.js';
import { splitSentences } from './sentences.js';
import { OutputStore, type Draft as Output } from './sourceMap.js';

/** A user macro: `\newcommand{\name}[params][default]{body}` or `\def\name#1#2{body}`. */
export interface MacroDefinition {
  readonly name: string;
  readonly params: number;
  /** Default of the first (optional) parameter, if the definition gives one. */
  readonly defaultArg: string | null;
  readonly body: string;
}

const MAX_EXPANSION_DEPTH = 16;
const MAX_EXPANSIONS = 200_000;

/** Characters that end a run of plain text. */
const SPECIAL = new Uint8Array(128);
for (const ch of '\\{}$%&~\n^_-\r\t') SPECIAL[ch.charCodeAt(0)] = 1;

type Terminator =
  | { readonly kind: 'eof' }
  | { readonly kind: 'brace' }
  | { readonly kind: 'dollar'; readonly double: boolean; readonly start: number }
  | { readonly kind: 'paren'; readonly start: number }
  | { readonly kind: 'display'; readonly start: number }
  | { readonly kind: 'env'; readonly name: string };

interface Draft {
  readonly kind: BlockKind;
  readonly out: Output;
  /** Math spans in the draft, created on the first one (most drafts have none). */
  math: MathSpan[] | null;
  cell?: TableCellPosition;
  /** Where the draft starts in the reading text, once assembled (−1 before, or if empty). */
  readingStart: number;
}

/** A position in the output while it is being built: a draft, an offset in it, and how many drafts were finished before. */
interface Anchor {
  draft: Draft;
  offset: number;
  finishedBefore: number;
}

interface TableContext {
  readonly id: number;
  row: number;
  column: number;
  headers: string[];
  /** Headers given by \tablehead/\colhead (deluxetable); otherwise the first row is the header. */
  explicitHeaders: boolean;
  firstRow: Draft[];
  /** Every non-empty cell, in order. */
  cells: Draft[];
}

/** One level of input: the original source, or the body of a macro being expanded. */
interface Frame {
  readonly src: string;
  pos: number;
  /** For an expansion: the source span of the invocation, which all its output maps to. */
  readonly span: { start: number; end: number } | null;
}

/** Macros with their own case in LatexScanner.macro (checked by one set lookup before the switch). */
const SWITCHED_MACROS = new Set(['begin', 'end', 'newcommand', 'renewcommand', 'providecommand', 'newcommand*', 'renewcommand*', 'providecommand*', 'DeclareRobustCommand', 'def', 'gdef', 'edef', 'xdef', 'DeclareMathOperator', 'DeclareMathOperator*', 'ifmmode', 'else', 'fi', '\\', 'par', 'item', '(', '[', 'verb', 'footnote', 'footnotetext', 'thanks', 'tablecomments', 'tablenotetext', 'caption', 'tablecaption', 'figcaption', 'tablehead', 'multicolumn', 'multirow', 'cutinhead', 'sidehead', 'startdata', 'enddata', 'input', 'include', 'subfile', 'subfileinclude', 'import', 'subimport', 'InputIfFileExists', 'variable', 'input@value', 'href', 'frac', 'dfrac', 'tfrac', 'sqrt', 'farcs', 'farcm', 'fdg', 'fs', 'fm', 'fh', 'fd', 'SI', 'qty', 'si', 'unit', 'num', 'SIrange', 'qtyrange', 'numrange', 'ang']);

const SWITCHED = 1;
const CITATION = 2;
const SECTION = 3;
const SYMBOL = 4;
const TRANSPARENT = 5;
const FONT = 6;
const DROPPED = 7;
/** Which table knows each macro name: filled from the lowest priority to the highest, so that a name in several tables belongs to the one macro() consults first. */
const MACRO_CLASS = new Map<string, number>();
for (const [names, cls] of [
  [Object.keys(DROPPED_WITH_ARGS), DROPPED],
  [[...FONT_SWITCHES], FONT],
  [[...TRANSPARENT_ONE_ARG], TRANSPARENT],
  [Object.keys(SYMBOL_MACROS), SYMBOL],
  [[...SECTION_MACROS], SECTION],
  [[...CITATION_MACROS], CITATION],
  [[...SWITCHED_MACROS], SWITCHED],
] as Array<[string[], number]>) {
  for (const name of names) MACRO_CLASS.set(name, cls);
}

const BRACE: Terminator = { kind: 'brace' };
const EOF: Terminator = { kind: 'eof' };

class LatexScanner {
  private readonly original: string;
  private readonly store: OutputStore;
  private frame: Frame;
  private readonly frames: Frame[] = [];
  private mathDepth = 0;
  private silent = false;
  private current: Draft;
  private readonly finished: Draft[] = [];
  private asides: Draft[] = [];
  private table: TableContext | null = null;
  private tableCount = 0;
  private expansions = 0;
  private readonly conditionals: boolean[] = [];
  readonly macros = new Map<string, MacroDefinition>();
  readonly directives: Array<Omit<Directive, 'readingOffset'> & Anchor> = [];
  readonly includes: Array<Omit<Include, 'readingOffset'> & Anchor> = [];
  readonly problems: ReaderProblem[] = [];
  texRoot: string | null = null;

  constructor(source: string, macros: readonly MacroDefinition[], mathMode = false) {
    this.original = source;
    this.store = new OutputStore(source);
    this.frame = { src: source, pos: 0, span: null };
    for (const m of macros) this.macros.set(m.name, m);
    this.current = this.newDraft('paragraph');
    if (mathMode) this.mathDepth = 1;
  }

  private newDraft(kind: BlockKind): Draft {
    return { kind, out: this.store.draft(), math: null, readingStart: -1 };
  }

  // ---- source access -------------------------------------------------------------------

  private get src(): string {
    return this.frame.src;
  }

  private get pos(): number {
    return this.frame.pos;
  }

  private set pos(p: number) {
    this.frame.pos = p;
  }

  private spanOf(start: number, end: number): [number, number] {
    return this.frame.span ? [this.frame.span.start, this.frame.span.end] : [start, end];
  }

  private problem(message: string, start: number, end: number, severity: ReaderProblem['severity'] = 'warning'): void {
    const [s, e] = this.spanOf(start, end);
    if (this.problems.length < 500) this.problems.push({ message, sourceStart: s, sourceEnd: Math.max(e, s), severity });
  }

  // ---- output --------------------------------------------------------------------------

  /** Copies source[start, end) verbatim; `plain` is false where the copy depends on what the text is (a siunitx number, a one-character argument). */
  private emitCopy(start: number, end: number, plain = true): void {
    if (this.silent || end <= start) return;
    if (this.frame.span) this.store.replace(this.current.out, this.src.slice(start, end), this.frame.span.start, this.frame.span.end);
    else this.store.copy(this.current.out, start, end, plain);
  }

  private emit(text: string, start: number, end: number): void {
    if (this.silent || !text) return;
    const span = this.frame.span;
    if (span) this.store.replace(this.current.out, text, span.start, span.end);
    else this.store.replace(this.current.out, text, start, end);
  }

  private emitSpace(start: number, end: number): void {
    if (this.silent) return;
    const span = this.frame.span;
    if (span) this.store.space(this.current.out, span.start, span.end);
    else this.store.space(this.current.out, start, end);
  }

  /** Ends the current paragraph (if it has text) and places the asides collected in it after it. */
  private endParagraph(): void {
    if (this.table) return;
    this.finishDraft(this.current);
    for (const a of this.asides) this.finishDraft(a);
    this.asides = [];
    this.current = this.newDraft('paragraph');
  }

  private finishDraft(d: Draft): void {
    this.finished.push(d);
  }

  /** Scans a group into a separate block (footnote, caption, heading), placed after the paragraph. */
  private scanAside(kind: BlockKind, asHeading = false): void {
    const saved = this.current;
    const savedMath = this.mathDepth;
    this.current = this.newDraft(kind);
    this.mathDepth = 0;
    this.scanArgument();
    const draft = this.current;
    this.current = saved;
    this.mathDepth = savedMath;
    if (asHeading) {
      this.endParagraph();
      this.finishDraft(draft);
    } else if (this.table) {
      this.finishDraft(draft);
    } else {
      this.asides.push(draft);
    }
  }

  /** Where in the reading text an item met now will stand. */
  private anchor(): Anchor {
    return { draft: this.current, offset: this.current.out.length, finishedBefore: this.finished.length };
  }

  // ---- low-level parsing ----------------------------------------------------------------

  private skipSpaces(): boolean {
    const s = this.src;
    let p = this.pos;
    let skipped = false;
    while (p < s.length) {
      const c = s.charCodeAt(p);
      if (c === 32 || c === 9 || c === 13) p++;
      else if (c === 10) {
        // a single newline is a space; a blank line is not skipped here
        let q = p + 1;
        while (q < s.length && (s.charCodeAt(q) === 32 || s.charCodeAt(q) === 9 || s.charCodeAt(q) === 13)) q++;
        if (q < s.length && s.charCodeAt(q) === 10) break;
        p = q;
      } else break;
      skipped = true;
    }
    this.pos = p;
    return skipped;
  }

  /** Reads a macro name after the backslash at this.pos − 1. */
  private readName(): string {
    const s = this.src;
    const start = this.pos;
    if (start >= s.length) return '';
    const c = s.charCodeAt(start);
    if ((c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 64) {
      let p = start + 1;
      while (p < s.length) {
        const d = s.charCodeAt(p);
        if ((d >= 65 && d <= 90) || (d >= 97 && d <= 122) || d === 64) p++;
        else break;
      }
      if (p < s.length && s[p] === '*') {
        const starred = s.slice(start, p) + '*';
        if (SECTION_MACROS.has(starred) || starred in DROPPED_WITH_ARGS || starred === 'newcommand*' || starred === 'renewcommand*' || starred === 'providecommand*' || starred === 'DeclareMathOperator*') {
          this.pos = p + 1;
          return starred;
        }
      }
      this.pos = p;
      return s.slice(start, p);
    }
    this.pos = start + 1;
    return s[start];
  }

  /** The raw text of a balanced {…} group at this.pos (after spaces), without braces; null if none. */
  private readRawGroup(): string | null {
    this.skipSpaces();
    const s = this.src;
    if (this.pos >= s.length || s[this.pos] !== '{') return null;
    const start = this.pos + 1;
    let depth = 1;
    let p = start;
    while (p < s.length) {
      const c = s.charCodeAt(p);
      if (c === 92) p += 2; // backslash: skip the escaped character
      else {
        if (c === 123) depth++;
        else if (c === 125 && --depth === 0) break;
        p++;
      }
    }
    if (p >= s.length) {
      this.problem('unbalanced braces: a group is not closed', start - 1, s.length, 'error');
      this.pos = s.length;
      return s.slice(start);
    }
    this.pos = p + 1;
    return s.slice(start, p);
  }

  /** The raw text of an optional [...] argument; null if none. */
  private readRawOptional(): string | null {
    const save = this.pos;
    this.skipSpaces();
    const s = this.src;
    if (this.pos >= s.length || s[this.pos] !== '[') {
      this.pos = save;
      return null;
    }
    let depth = 0;
    let p = this.pos + 1;
    const start = p;
    while (p < s.length) {
      const c = s[p];
      if (c === '\\') p += 2;
      else {
        if (c === '{') depth++;
        else if (c === '}') depth--;
        else if (c === ']' && depth <= 0) break;
        p++;
      }
    }
    this.pos = Math.min(p + 1, s.length);
    return s.slice(start, p);
  }

  /** A single mandatory argument read raw: a {group}, a \macro, or one character. */
  private readRawArgument(): string {
    const g = this.readRawGroup();
    if (g !== null) return g;
    const s = this.src;
    if (this.pos >= s.length) return '';
    if (s[this.pos] === '\\') {
      this.pos++;
      return '\\' + this.readName();
    }
    return s[this.pos++];
  }

  /** Scans the next argument ({group} or single token) into the current output. */
  private scanArgument(): void {
    this.skipSpaces();
    const s = this.src;
    if (this.pos >= s.length) return;
    if (s[this.pos] === '{') {
      this.pos++;
      this.loop(BRACE);
    } else if (s[this.pos] === '\\') {
      this.pos++;
      this.macro(this.pos - 1);
    } else {
      this.emitCopy(this.pos, this.pos + 1, false);
      this.pos++;
    }
  }

  /** Scans a string (an expansion or a constructed fragment) as LaTeX, all of it mapped to [start, end). */
  private scanText(text: string, start: number, end: number, mathMode: boolean | null = null): void {
    if (this.frames.length >= MAX_EXPANSION_DEPTH || ++this.expansions > MAX_EXPANSIONS) {
      this.problem('macro expansion too deep or too long; the rest of this macro is not read', start, end, 'warning');
      return;
    }
    const [s, e] = this.spanOf(start, end);
    this.frames.push(this.frame);
    this.frame = { src: text, pos: 0, span: { start: s, end: e } };
    const savedMath = this.mathDepth;
    if (mathMode !== null) this.mathDepth = mathMode ? Math.max(1, this.mathDepth) : 0;
    this.loop(EOF);
    this.mathDepth = savedMath;
    this.frame = this.frames.pop()!;
  }

  // ---- the main loop --------------------------------------------------------------------

  /** Scans until the terminator; returns true if it was found, false at the end of input. */
  private loop(term: Terminator): boolean {
    const s = this.src;
    const n = s.length;
    while (this.pos < n) {
      const p = this.pos;
      const c = s.charCodeAt(p);
      if (c >= 128 || SPECIAL[c] === 0) {
        // a run of plain text
        let q = p + 1;
        while (q < n) {
          const d = s.charCodeAt(q);
          if (d < 128 && SPECIAL[d] === 1) break;
          q++;
        }
        this.emitCopy(p, q);
        this.pos = q;
        continue;
      }
      switch (c) {
        case 92: // backslash
          this.pos = p + 1;
          if (this.pos < n) {
            const next = s[this.pos];
            if (term.kind === 'paren' && next === ')') {
              this.pos++;
              return true;
            }
            if (term.kind === 'display' && next === ']') {
              this.pos++;
              return true;
            }
          }
          if (this.macro(p, term)) return true;
          break;
        case 123: // {
          this.pos = p + 1;
          this.loop(BRACE);
          break;
        case 125: // }
          this.pos = p + 1;
          if (term.kind === 'brace') return true;
          if (!this.frame.span) this.problem('unbalanced braces: this } closes nothing', p, p + 1, 'warning');
          break;
        case 36: // $
          if (term.kind === 'dollar') {
            this.pos = p + (term.double && s[p + 1] === '$' ? 2 : 1);
            return true;
          }
          this.openDollarMath(p);
          break;
        case 37: // %
          this.comment(p);
          break;
        case 38: // &
          this.pos = p + 1;
          if (this.table && this.mathDepth === 0) this.nextCell();
          else this.emitSpace(p, p + 1);
          break;
        case 126: // ~
          this.pos = p + 1;
          this.emitSpace(p, p + 1);
          break;
        case 10: {
          // newline: a space, or a paragraph break after a blank line
          let q = p + 1;
          while (q < n && (s.charCodeAt(q) === 32 || s.charCodeAt(q) === 9 || s.charCodeAt(q) === 13)) q++;
          if (q < n && s.charCodeAt(q) === 10 && (term.kind === 'dollar' || term.kind === 'paren' || term.kind === 'display')) {
            // TeX allows no blank line inside math: the formula was not closed
            if (!this.frame.span) this.problem('unbalanced math: this formula is not closed before the paragraph ends', term.start, term.start + 1, 'error');
            this.pos = p;
            return true;
          }
          if (q < n && s.charCodeAt(q) === 10 && this.mathDepth === 0) {
            while (q < n && (s.charCodeAt(q) === 10 || s.charCodeAt(q) === 32 || s.charCodeAt(q) === 9 || s.charCodeAt(q) === 13)) q++;
            this.pos = q;
            if (!this.table) this.endParagraph();
            else this.emitSpace(p, q);
          } else {
            this.pos = q;
            this.emitSpace(p, q);
          }
          break;
        }
        case 13:
        case 9:
          this.pos = p + 1;
          this.emitSpace(p, p + 1);
          break;
        case 45: {
          // - : dashes in text
          let q = p + 1;
          while (q < n && s[q] === '-') q++;
          this.pos = q;
          if (this.mathDepth > 0 || q - p === 1) this.emitCopy(p, q);
          else this.emit(q - p === 2 ? '–' : '—', p, q);
          break;
        }
        default:
          // ^ and _ : kept (math superscripts and subscripts)
          this.emitCopy(p, p + 1);
          this.pos = p + 1;
      }
    }
    if (term.kind === 'dollar' || term.kind === 'paren' || term.kind === 'display') {
      if (!this.frame.span) this.problem('unbalanced math: this formula is not closed before the end of the file', term.start, term.start + 1, 'error');
    } else if (term.kind === 'env' && !this.frame.span) {
      this.problem(`\\begin{${term.name}} is not closed by \\end{${term.name}}`, n, n, 'error');
    } else if (term.kind === 'brace' && !this.frame.span && this.frames.length === 0) {
      this.problem('unbalanced braces: a group is not closed before the end of the file', n, n, 'error');
    }
    return false;
  }

  private withMath(display: boolean, term: Terminator): void {
    const draft = this.current;
    const outStart = draft.out.length;
    this.mathDepth++;
    this.loop(term);
    this.mathDepth--;
    if (!this.silent) (draft.math ??= []).push({ start: outStart, end: draft.out.length, display });
  }

  private openDollarMath(p: number): void {
    const s = this.src;
    if (s[p + 1] === '$') {
      this.pos = p + 2;
      this.withMath(true, { kind: 'dollar', double: true, start: p });
    } else {
      this.pos = p + 1;
      if (this.mathDepth > 0) {
        // a $ inside math closes nothing we know of: treat as a stray
        this.problem('unexpected $ inside math', p, p + 1, 'warning');
        return;
      }
      this.withMath(false, { kind: 'dollar', double: false, start: p });
    }
  }

  private comment(p: number): void {
    const s = this.src;
    let eol = s.indexOf('\n', p);
    if (eol < 0) eol = s.length;
    const body = s.slice(p + 1, eol);
    const directive = /^\s*comove\s*:(.*)$/i.exec(body);
    if (directive && !this.frame.span) {
      this.directives.push({ text: directive[1].trim(), sourceStart: p, sourceEnd: eol, ...this.anchor() });
    }
    const root = /^\s*!\s*TEX\s+root\s*=\s*(.+?)\s*$/i.exec(body);
    if (root && !this.frame.span) this.texRoot = root[1];
    // TeX drops the comment, its newline and the next line's leading spaces, unless that line is blank.
    let q = eol + 1;
    while (q < s.length && (s[q] === ' ' || s[q] === '\t' || s[q] === '\r')) q++;
    this.pos = q < s.length && s[q] === '\n' ? eol : Math.min(q, s.length);
  }

  // ---- macros ---------------------------------------------------------------------------

  /** Handles the macro whose backslash is at p (this.pos is just past it). Returns true if it ended `term`. */
  private macro(p: number, term: Terminator = EOF): boolean {
    const name = this.readName();
    if (name === '') return false;
    const c0 = name.charCodeAt(0);
    const isWord = (c0 >= 65 && c0 <= 90) || (c0 >= 97 && c0 <= 122) || c0 === 64;
    const afterName = this.pos;
    const spaced = isWord ? this.skipSpaces() : false;

    // One lookup tells which table (if any) knows the name.
    const known = MACRO_CLASS.get(name) ?? 0;
    if (known === SWITCHED) {
      switch (name) {
        case 'begin':
          return this.beginEnvironment(p);
        case 'end': {
          const env = (this.readRawGroup() ?? '').trim();
          if (term.kind === 'env' && term.name === env) return true;
          if (env === 'document' && !this.frame.span) {
            // LaTeX reads nothing after \end{document}
            this.pos = this.src.length;
            return false;
          }
          if (!this.frame.span) this.problem(`\\end{${env}} without a matching \\begin{${env}}`, p, this.pos, 'warning');
          return false;
        }
        case 'newcommand':
        case 'renewcommand':
        case 'providecommand':
        case 'newcommand*':
        case 'renewcommand*':
        case 'providecommand*':
        case 'DeclareRobustCommand':
          this.defineNewcommand(p);
          return false;
        case 'def':
        case 'gdef':
        case 'edef':
        case 'xdef':
          this.defineDef(p);
          return false;
        case 'DeclareMathOperator':
        case 'DeclareMathOperator*': {
          const target = this.readRawArgument().trim().replace(/^\\/, '');
          const body = this.readRawGroup() ?? '';
          if (target) this.macros.set(target, { name: target, params: 0, defaultArg: null, body: `\\mathrm{${body}}` });
          return false;
        }
        case 'ifmmode':
          this.conditional(this.mathDepth > 0);
          return false;
        case 'else':
          // reached at the end of a taken branch: skip the other branch
          this.skipConditionalBranch(false);
          return false;
        case 'fi':
          this.conditionals.pop();
          return false;
        case '\\': {
          this.readRawOptional();
          if (this.table && this.mathDepth === 0) this.nextRow();
          else this.emitSpace(p, this.pos);
          return false;
        }
        case 'par':
          this.endParagraph();
          return false;
        case 'item':
          this.readRawOptional();
          this.endParagraph();
          return false;
        case '(':
          this.withMath(false, { kind: 'paren', start: p });
          return false;
        case '[':
          this.withMath(true, { kind: 'display', start: p });
          return false;
        case 'verb': {
          const s = this.src;
          const delim = s[this.pos];
          const close = delim ? s.indexOf(delim, this.pos + 1) : -1;
          this.pos = close < 0 ? s.length : close + 1;
          return false;
        }
        case 'footnote':
        case 'footnotetext':
        case 'thanks':
        case 'tablecomments':
          this.readRawOptional();
          this.scanAside('footnote');
          return false;
        case 'tablenotetext':
          this.readRawArgument();
          this.scanAside('footnote');
          return false;
        case 'caption':
        case 'tablecaption':
        case 'figcaption':
          this.readRawOptional();
          this.scanAside('caption');
          return false;
        case 'tablehead':
          this.tableHead();
          return false;
        case 'multicolumn':
        case 'multirow': {
          const span = Number.parseInt(this.readRawArgument(), 10);
          this.readRawOptional();
          this.readRawArgument();
          this.scanArgument();
          if (name === 'multicolumn' && this.table && span > 1) this.table.column += span - 1;
          return false;
        }
        case 'cutinhead':
        case 'sidehead':
          this.readRawGroup();
          return false;
        case 'startdata':
        case 'enddata':
          return false;
        case 'input':
        case 'include':
        case 'subfile':
        case 'subfileinclude':
        case 'import':
        case 'subimport':
        case 'InputIfFileExists': {
          const dir = name === 'import' || name === 'subimport' ? this.readRawGroup() ?? '' : '';
          const arg = this.readRawGroup();
          if (arg !== null && !this.frame.span) {
            this.includes.push({ command: name, path: dir + arg.trim(), sourceStart: p, sourceEnd: this.pos, ...this.anchor() });
          }
          return false;
        }
        case 'variable':
        case 'input@value': {
          this.readRawGroup();
          this.emit(INJECTED_VALUE, p, this.pos);
          return false;
        }
        case 'href':
          this.readRawGroup();
          this.scanArgument();
          return false;
        case 'frac':
        case 'dfrac':
        case 'tfrac': {
          const num = this.readRawArgument();
          const den = this.readRawArgument();
          this.scanText(`(${num})/(${den})`, p, this.pos, true);
          return false;
        }
        case 'sqrt': {
          this.readRawOptional();
          const arg = this.readRawArgument();
          this.scanText(`√(${arg})`, p, this.pos, true);
          return false;
        }
        case 'farcs':
        case 'farcm':
        case 'fdg':
        case 'fs':
        case 'fm':
        case 'fh':
        case 'fd':
          this.fractionalUnit(name, p);
          return false;
        case 'SI':
        case 'qty':
          this.siQuantity(p);
          return false;
        case 'si':
        case 'unit':
          this.readRawOptional();
          this.emitUnit(this.readRawGroup() ?? '', p);
          return false;
        case 'num':
          this.readRawOptional();
          this.siNumberArgument(p);
          return false;
        case 'SIrange':
        case 'qtyrange':
        case 'numrange': {
          this.readRawOptional();
          const a = siNumber(this.readRawGroup() ?? '');
          const b = siNumber(this.readRawGroup() ?? '');
          const u = name === 'numrange' ? '' : siUnit(this.readRawGroup() ?? '');
          this.emit(`${a}–${b}${u ? ` ${u}` : ''}`, p, this.pos);
          return false;
        }
        case 'ang': {
          this.readRawOptional();
          const parts = (this.readRawGroup() ?? '').split(';');
          const marks = ['°', '′', '″'];
          this.emit(parts.map((v, i) => (v.trim() ? `${siNumber(v)}${marks[i] ?? ''}` : '')).join(''), p, this.pos);
          return false;
        }
      }
    }

    if (known === CITATION) {
      this.readRawOptional();
      this.readRawOptional();
      const keys = (this.readRawGroup() ?? '').split(',').map((k) => k.trim()).filter(Boolean);
      this.emit(`${CITATION_OPEN}${keys.join(',')}⟧`, p, this.pos);
      if (spaced) this.emitSpace(this.pos, this.pos);
      return false;
    }
    if (known === SECTION) {
      this.readRawOptional();
      this.scanAside('heading', true);
      return false;
    }
    const user = this.macros.get(name);
    if (user) {
      this.expand(user, p, spaced);
      return false;
    }
    if (known === SYMBOL) {
      this.emit(SYMBOL_MACROS[name], p, afterName);
      if (spaced && isWord) this.emitSpace(afterName, this.pos);
      return false;
    }
    if (known === TRANSPARENT) {
      const s = this.src;
      if (name === 'ensuremath') {
        if (this.mathDepth > 0) this.scanArgument();
        else {
          const draft = this.current;
          const outStart = draft.out.length;
          this.mathDepth++;
          this.scanArgument();
          this.mathDepth--;
          if (!this.silent) (draft.math ??= []).push({ start: outStart, end: draft.out.length, display: false });
        }
      } else if (this.pos < s.length && (s[this.pos] === '{' || s[this.pos] === '\\')) this.scanArgument();
      return false;
    }
    if (known === FONT) return false;
    if (known === DROPPED) {
      this.readRawOptional();
      for (let i = 0; i < DROPPED_WITH_ARGS[name]; i++) this.readRawGroup();
      return false;
    }
    if (!isWord) {
      // an escaped character not in the tables (e.g. \") : drop the backslash
      return false;
    }
    // Unknown macro: its name reads as nothing; its arguments flow as ordinary groups.
    if (spaced) this.emitSpace(afterName, this.pos);
    return false;
  }

  private expand(m: MacroDefinition, p: number, spaced: boolean): void {
    const args: string[] = [];
    let remaining = m.params;
    if (m.defaultArg !== null && remaining > 0) {
      args.push(this.readRawOptional() ?? m.defaultArg);
      remaining--;
    }
    for (let i = 0; i < remaining; i++) args.push(this.readRawArgument());
    const body = m.params === 0 ? m.body : m.body.replace(/#([1-9])/g, (_, d: string) => args[Number(d) - 1] ?? '');
    this.scanText(body, p, this.pos);
    if (spaced && m.params === 0) this.emitSpace(this.pos, this.pos);
  }

  private defineNewcommand(p: number): void {
    this.skipSpaces();
    let target = '';
    if (this.src[this.pos] === '{') target = (this.readRawGroup() ?? '').trim();
    else if (this.src[this.pos] === '\\') {
      this.pos++;
      target = '\\' + this.readName();
    }
    target = target.replace(/^\\/, '');
    const params = Number(this.readRawOptional() ?? '0') || 0;
    const defaultArg = this.readRawOptional();
    const body = this.readRawGroup();
    if (!target || body === null) {
      this.problem('a \\newcommand that could not be read', p, this.pos, 'warning');
      return;
    }
    this.macros.set(target, { name: target, params: Math.min(9, Math.max(0, params)), defaultArg, body });
  }

  private defineDef(p: number): void {
    const s = this.src;
    if (s[this.pos] !== '\\') {
      this.problem('a \\def that could not be read', p, this.pos, 'warning');
      return;
    }
    this.pos++;
    const target = this.readName();
    const brace = s.indexOf('{', this.pos);
    if (brace < 0) {
      this.problem('a \\def without a body', p, this.pos, 'warning');
      return;
    }
    const paramText = s.slice(this.pos, brace);
    const params = (paramText.match(/#[1-9]/g) ?? []).length;
    this.pos = brace;
    const body = this.readRawGroup() ?? '';
    this.macros.set(target, { name: target, params, defaultArg: null, body });
  }

  /** \ifmmode: when the branch is not taken, skip to the matching \else or \fi. */
  private conditional(taken: boolean): void {
    this.conditionals.push(taken);
    if (!taken) this.skipConditionalBranch(true);
  }

  /** Skips to the matching \else (if stopAtElse) or \fi, counting nested \if… commands. */
  private skipConditionalBranch(stopAtElse: boolean): void {
    const s = this.src;
    let depth = 0;
    const re = /\\(if[A-Za-z@]*|else|fi)(?![A-Za-z@])/g;
    re.lastIndex = this.pos;
    for (let m = re.exec(s); m !== null; m = re.exec(s)) {
      const word = m[1];
      if (word === 'fi') {
        if (depth === 0) {
          this.pos = m.index + m[0].length;
          this.conditionals.pop();
          return;
        }
        depth--;
      } else if (word === 'else') {
        if (depth === 0 && stopAtElse) {
          this.pos = m.index + m[0].length;
          return;
        }
      } else depth++;
    }
    this.pos = s.length;
  }

  /** \farcs and friends: `1\farcs5` reads 1.5″. */
  private fractionalUnit(name: string, p: number): void {
    const marks: Record<string, string> = { farcs: '″', farcm: '′', fdg: '°', fs: 's', fm: 'm', fh: 'h', fd: 'd' };
    const s = this.src;
    let q = this.pos;
    while (q < s.length && s.charCodeAt(q) >= 48 && s.charCodeAt(q) <= 57) q++;
    const digits = s.slice(this.pos, q);
    this.pos = q;
    this.emit(digits ? `.${digits}${marks[name]}` : marks[name], p, q);
  }

  private siQuantity(p: number): void {
    this.readRawOptional();
    const numberEnd = this.siNumberArgument(p);
    const unitText = this.readRawGroup() ?? '';
    this.emit(` ${siUnit(unitText)}`, numberEnd, this.pos);
  }

  /**
   * Reads the number argument of \SI, \qty or \num and writes it. Plain digits are copied
   * verbatim, so that a fix can rewrite them in place; other forms (1.2e28, 1+-0.1) are
   * written as read. Returns the source offset just past the argument.
   */
  private siNumberArgument(p: number): number {
    const raw = this.readRawGroup() ?? '';
    const end = this.pos;
    const num = siNumber(raw);
    const trimmed = raw.trim();
    const contentStart = end - 1 - raw.length;
    if (num === trimmed && trimmed && !this.frame.span && this.src.slice(contentStart, end - 1) === raw) {
      const lead = raw.length - raw.trimStart().length;
      this.emitCopy(contentStart + lead, contentStart + lead + trimmed.length, false);
    } else this.emit(num, p, end);
    return end;
  }

  private emitUnit(unitText: string, p: number): void {
    this.emit(siUnit(unitText), p, this.pos);
  }

  // ---- environments -----------------------------------------------------------------------

  private beginEnvironment(p: number): boolean {
    const env = (this.readRawGroup() ?? '').trim();
    if (env === 'document') {
      this.silent = false;
      return false;
    }
    if (SKIPPED_ENVIRONMENTS.has(env)) {
      const endTag = `\\end{${env}}`;
      const close = this.src.indexOf(endTag, this.pos);
      if (close < 0) {
        this.problem(`\\begin{${env}} is not closed`, p, this.src.length, 'error');
        this.pos = this.src.length;
      } else this.pos = close + endTag.length;
      return false;
    }
    if (MATH_ENVIRONMENTS.has(env)) {
      if (env.startsWith('alignat')) this.readRawGroup();
      if (this.mathDepth > 0) {
        this.loop({ kind: 'env', name: env });
        return false;
      }
      this.withMath(true, { kind: 'env', name: env });
      return false;
    }
    if (TABLE_ENVIRONMENTS.has(env)) {
      this.tableEnvironment(env);
      return false;
    }
    // Other environments are read through; a block environment breaks the paragraph.
    const inline = this.mathDepth > 0 || env === 'minipage';
    if (!inline) this.endParagraph();
    if (env === 'minipage' || env === 'figure' || env === 'figure*' || env === 'table' || env === 'table*' || env === 'wrapfigure') this.readRawOptional();
    if (env === 'minipage' || env === 'wrapfigure') this.readRawGroup();
    this.loop({ kind: 'env', name: env });
    if (!inline) this.endParagraph();
    return false;
  }

  private tableEnvironment(env: string): void {
    if (this.mathDepth > 0 && env === 'array') {
      this.readRawGroup();
      this.loop({ kind: 'env', name: env });
      return;
    }
    if (env === 'tabular*' || env === 'tabularx') this.readRawGroup();
    this.readRawOptional();
    this.readRawGroup(); // column specification
    const outer = this.table;
    const savedCurrent = this.current;
    if (!outer) this.endParagraph();
    this.table = { id: this.tableCount++, row: 0, column: 0, headers: [], explicitHeaders: false, firstRow: [], cells: [] };
    this.current = this.newCellDraft();
    this.loop({ kind: 'env', name: env });
    this.finishCell();
    const t = this.table;
    if (!t.explicitHeaders) {
      t.headers = t.firstRow.map((d) => this.store.textOf(d.out).trim());
      for (const d of t.firstRow) d.cell = { ...d.cell!, header: null };
    }
    this.applyHeaders(t);
    this.table = outer;
    this.current = outer ? this.newCellDraft() : savedCurrent;
    if (!outer) this.current = this.newDraft('paragraph');
  }

  private newCellDraft(): Draft {
    const d = this.newDraft('table-cell');
    const t = this.table!;
    d.cell = { table: t.id, row: t.row, column: t.column, header: null };
    return d;
  }

  private finishCell(): void {
    const t = this.table!;
    const d = this.current;
    if (!d.out.blank) {
      this.finishDraft(d);
      t.cells.push(d);
      if (t.row === 0) t.firstRow.push(d);
    }
  }

  private nextCell(): void {
    this.finishCell();
    this.table!.column++;
    this.current = this.newCellDraft();
  }

  private nextRow(): void {
    this.finishCell();
    const t = this.table!;
    if (t.column > 0 || t.firstRow.length > 0 || t.row > 0) t.row++;
    t.column = 0;
    this.current = this.newCellDraft();
  }

  private applyHeaders(t: TableContext): void {
    const headerRow = new Set(t.explicitHeaders ? [] : t.firstRow);
    for (const d of t.cells) {
      if (d.cell && !headerRow.has(d)) d.cell = { ...d.cell, header: t.headers[d.cell.column] ?? null };
    }
  }

  /** AASTeX \tablehead{\colhead{…} & \colhead{…}}: explicit column headers. */
  private tableHead(): void {
    const start = this.pos;
    const raw = this.readRawGroup() ?? '';
    const t = this.table;
    if (!t) return;
    const heads = splitTopLevel(raw, '&').map((cell) => this.readFragment(cell.replace(/\\colhead\s*/g, ''), start, this.pos));
    if (heads.some((h) => h)) {
      t.headers = heads;
      t.explicitHeaders = true;
    }
  }

  /** Reads a LaTeX fragment to plain text with the macros known here, producing no output. */
  private readFragment(fragment: string, start: number, end: number): string {
    const saved = this.current;
    const savedTable = this.table;
    this.current = this.newDraft('paragraph');
    this.table = null;
    this.scanText(fragment, start, end);
    const text = this.store.textOf(this.current.out).trim();
    this.current = saved;
    this.table = savedTable;
    return text;
  }

  // ---- driver -----------------------------------------------------------------------------

  run(): DocumentReading {
    const s = this.original;
    const beginDoc = s.search(/\\begin\s*\{document\}/);
    if (beginDoc >= 0) {
      // The preamble defines macros and may hold directives; it produces no reading text.
      this.silent = true;
      this.loop(EOF);
    } else {
      this.loop(EOF);
    }
    this.endParagraph();
    return this.assemble();
  }

  private assemble(): DocumentReading {
    const drafts = this.finished.filter((d) => d.out.length > 0);
    const { reading, starts } = this.store.assemble(drafts.map((d) => d.out), '\n\n');
    const text = reading.text;
    const blocks: Block[] = [];
    const math: MathSpan[] = [];
    const blank = (c: number) => c === 32 || c === 10;
    drafts.forEach((d, i) => {
      const start = starts[i];
      d.readingStart = start;
      // The block is its non-blank part.
      let a = start;
      let e = start + d.out.length;
      while (a < e && blank(text.charCodeAt(a))) a++;
      while (e > a && blank(text.charCodeAt(e - 1))) e--;
      if (e > a) blocks.push(d.cell ? { kind: d.kind, start: a, end: e, cell: d.cell } : { kind: d.kind, start: a, end: e });
      for (const m of d.math ?? []) {
        let ms = start + m.start;
        let me = start + m.end;
        while (ms < me && blank(text.charCodeAt(ms))) ms++;
        while (me > ms && blank(text.charCodeAt(me - 1))) me--;
        if (me > ms) math.push({ start: ms, end: me, display: m.display });
      }
    });
    /** Start in the reading text of the first non-empty draft at or after each finished index. */
    const startFrom: number[] = new Array(this.finished.length + 1);
    startFrom[this.finished.length] = reading.text.length;
    for (let i = this.finished.length - 1; i >= 0; i--) startFrom[i] = this.finished[i].readingStart >= 0 ? this.finished[i].readingStart : startFrom[i + 1];
    const where = ({ draft, offset, finishedBefore }: Anchor) => {
      if (draft.readingStart >= 0) return draft.readingStart + Math.min(offset, draft.out.length);
      // the draft produced no text (the preamble, say): the item stands before the next block
      return startFrom[finishedBefore];
    };
    math.sort((a, b) => a.start - b.start);
    return {
      format: 'latex',
      reading,
      blocks,
      math,
      sentences: splitSentences(reading.text, blocks, math),
      directives: this.directives.map(({ draft, offset, finishedBefore, ...d }) => ({ ...d, readingOffset: where({ draft, offset, finishedBefore }) })),
      includes: this.includes.map(({ draft, offset, finishedBefore, ...i }) => ({ ...i, readingOffset: where({ draft, offset, finishedBefore }) })),
      texRoot: this.texRoot,
      frontMatter: null,
      problems: this.problems,
    };
  }
}

/** Splits text at `sep` where it is outside braces. */
function splitTopLevel(text: string, sep: string): string[] {
  const out: string[] = [];
  let depth = 0;
  let from = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '\\') i++;
    else if (c === '{') depth++;
    else if (c === '}') depth--;
    else if (c === sep && depth === 0) {
      out.push(text.slice(from, i));
      from = i + 1;
    }
  }
  out.push(text.slice(from));
  return out;
}


/** siunitx number text: `1.2e3` → `1.2×10^3`, `+-` → `±`, spaces dropped. */
export function siNumber(text: string): string {
  return text
    .replace(/\s+/g, '')
    .replace(/\+-/g, '±')
    .replace(/\\pm/g, '±')
    .replace(/([0-9.])[eEdD]([+-]?\d+)/, '$1×10^$2')
    .replace(/\\times/g, '×');
}

/** siunitx unit text (`\kilo\metre\per\second\per\mega\parsec`, `km.s^{-1}`) as plain unit text (`km s^-1 Mpc^-1`). */
export function siUnit(text: string): string {
  const tokens = text.match(/\\[A-Za-z]+|\{[^{}]*\}|[^\\\s{}]+/g) ?? [];
  const parts: string[] = [];
  let prefix = '';
  let per = false;
  for (let i = 0; i < tokens.length; i++) {
    const tok = tokens[i];
    if (tok.startsWith('\\')) {
      const name = tok.slice(1);
      if (name === 'per') {
        per = true;
        continue;
      }
      if (name in SI_PREFIXES) {
        prefix += SI_PREFIXES[name];
        continue;
      }
      if (name === 'squared' || name === 'cubed') {
        const last = parts.pop() ?? '';
        const base = last.replace(/\^-?\d+$/, '');
        const neg = /\^-\d+$/.test(last);
        parts.push(`${base}^${neg ? '-' : ''}${name === 'squared' ? 2 : 3}`);
        continue;
      }
      if (name === 'tothe' || name === 'raiseto') {
        const arg = (tokens[++i] ?? '').replace(/[{}]/g, '');
        const last = parts.pop() ?? '';
        parts.push(`${last.replace(/\^-?\d+$/, '')}^${arg}`);
        continue;
      }
      const unitName = SI_UNITS[name] ?? SYMBOL_MACROS[name] ?? name;
      parts.push(`${prefix}${unitName}${per ? '^-1' : ''}`);
      prefix = '';
      per = false;
      continue;
    }
    // literal units such as km.s^{-1} or Mpc/h
    parts.push(tok.replace(/[{}]/g, '').replace(/\./g, ' ').replace(/~/g, ' '));
  }
  return parts.join(' ').replace(/\s+/g, ' ').trim();
}

/** Reads a LaTeX fragment (a header cell, a macro body) to plain reading text. */
export function readLatexFragment(fragment: string, macros: ReadonlyMap<string, MacroDefinition> = new Map()): string {
  const scanner = new LatexScanner(fragment, [...macros.values()]);
  return scanner.run().reading.text.trim();
}

export interface LatexReadOptions {
  /** Definitions known from elsewhere (the root file of a multi-file project). */
  readonly macros?: readonly MacroDefinition[];
  /** Read the whole source as math (the content of a formula taken from another format). */
  readonly math?: boolean;
}

/** Reads a LaTeX source. Never throws. */
export function readLatex(source: string, options: LatexReadOptions = {}): DocumentReading & { macros: readonly MacroDefinition[] } {
  const scanner = new LatexScanner(source, options.macros ?? [], options.math ?? false);
  let reading: DocumentReading;
  try {
    reading = scanner.run();
  } catch (e) {
    // A reader bug must not take the editor down: report it.
    return { ...unreadDocument('latex', `internal reader error: ${(e as Error).message}`), macros: [] };
  }
  return { ...reading, macros: [...scanner.macros.values()] };
}
