/**
 * The Markdown reader: unified + remark-parse, with remark-gfm (tables, footnotes), remark-math
 * ($…$ and $$…$$) and remark-frontmatter (YAML, read with `yaml`). Prose, headings, list items
 * and block quotes become blocks; table cells become blocks with their column header; math is
 * read by the LaTeX reader and mapped back into the Markdown source; code is skipped. Directive
 * comments are `<!-- comove: … -->`; front matter may declare the cosmology under `cosmology:`
 * (or `comove:`). Never throws.
 */

import type { Nodes, Root, RootContent, Table } from 'mdast';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { unified } from 'unified';
import { parse as parseYaml } from 'yaml';
import { unreadDocument, type Block, type BlockKind, type Directive, type DocumentReading, type MathSpan, type ReaderProblem, type TableCellPosition } from './documentReading.js';
import { readLatex } from './latexScanner.js';
import { markdownChunks, mayDefine, shiftNodes, type Chunk, type MarkdownMemory } from './markdownChunks.js';
import { splitSentences } from './sentences.js';
import { OutputStore, type Draft } from './sourceMap.js';

const parser = unified().use(remarkParse).use(remarkGfm).use(remarkMath).use(remarkFrontmatter, ['yaml']);

interface BlockDraft {
  kind: BlockKind;
  readonly out: Draft;
  readonly math: MathSpan[];
  readonly cell?: TableCellPosition;
}

const DIRECTIVE = /^<!--\s*comove\s*:([\s\S]*?)-->$/i;

class MarkdownWalker {
  private readonly store: OutputStore;
  readonly blocks: BlockDraft[] = [];
  readonly directives: Array<Omit<Directive, 'readingOffset'> & { blockIndex: number }> = [];
  readonly problems: ReaderProblem[] = [];
  frontMatter: Record<string, unknown> | null = null;
  private tableCount = 0;

  constructor(private readonly source: string) {
    this.store = new OutputStore(source);
  }

  private block(kind: BlockKind, cell?: TableCellPosition): BlockDraft {
    const b: BlockDraft = cell ? { kind, out: this.store.draft(), math: [], cell } : { kind, out: this.store.draft(), math: [] };
    this.blocks.push(b);
    return b;
  }

  /** Where the nodes being walked start in the source (a piece parsed on its own has positions relative to itself). */
  private base = 0;

  /** Walks the nodes of a piece whose positions count from `base`. */
  walkPiece(nodes: readonly RootContent[], base: number): void {
    this.base = base;
    this.walkBlocks(nodes);
    this.base = 0;
  }

  walkBlocks(nodes: readonly RootContent[]): void {
    for (const node of nodes) this.walkBlock(node);
  }

  private walkBlock(node: RootContent): void {
    switch (node.type) {
      case 'yaml':
        this.readFrontMatter(node.value, this.base + (node.position?.start.offset ?? 0), this.base + (node.position?.end.offset ?? 0));
        return;
      case 'heading':
        this.inline(this.block('heading'), node.children);
        return;
      case 'paragraph':
        this.inline(this.block('paragraph'), node.children);
        return;
      case 'math':
        this.math(this.block('paragraph'), node, true);
        return;
      case 'html':
        this.html(node.value, this.base + (node.position?.start.offset ?? 0), this.base + (node.position?.end.offset ?? 0));
        return;
      case 'table':
        this.table(node);
        return;
      case 'footnoteDefinition': {
        const before = this.blocks.length;
        this.walkBlocks(node.children);
        for (let i = before; i < this.blocks.length; i++) if (this.blocks[i].kind === 'paragraph') this.blocks[i].kind = 'footnote';
        return;
      }
      case 'code':
      case 'thematicBreak':
      case 'definition':
        return;
      default:
        if ('children' in node) this.walkBlocks(node.children as RootContent[]);
    }
  }

  private inline(b: BlockDraft, nodes: readonly Nodes[]): void {
    for (const node of nodes) {
      const start = this.base + (node.position?.start.offset ?? 0);
      const end = this.base + (node.position?.end.offset ?? start - this.base);
      switch (node.type) {
        case 'text':
          if (this.source.slice(start, end) === node.value) this.store.copy(b.out, start, end);
          else this.store.replace(b.out, node.value.replace(/\s+/g, ' '), start, end);
          break;
        case 'inlineMath':
          this.math(b, node, false);
          break;
        case 'break':
          this.store.space(b.out, start, end);
          break;
        case 'html':
          this.html(node.value, start, end);
          break;
        case 'inlineCode':
        case 'image':
        case 'imageReference':
          this.store.space(b.out, start, end);
          break;
        case 'footnoteReference':
          break;
        default:
          if ('children' in node) this.inline(b, node.children as Nodes[]);
      }
    }
  }

  /** Math content is read by the LaTeX reader and its pieces mapped into the Markdown source. */
  private math(b: BlockDraft, node: { value: string; position?: { start: { offset?: number }; end: { offset?: number } } }, display: boolean): void {
    const start = this.base + (node.position?.start.offset ?? 0);
    const end = this.base + (node.position?.end.offset ?? start - this.base);
    const raw = this.source.slice(start, end);
    const at = raw.indexOf(node.value);
    const verbatim = node.value.length > 0 && at >= 0;
    const base = start + (verbatim ? at : 0);
    const inner = readLatex(node.value, { math: true });
    const outStart = b.out.length;
    inner.reading.forEachPiece((o0, o1, s0, s1, exact) => {
      const text = inner.reading.text.slice(o0, o1);
      if (exact && verbatim) this.store.copy(b.out, base + s0, base + s1);
      else this.store.replace(b.out, text, verbatim ? base + s0 : start, verbatim ? base + s1 : end);
    });
    b.math.push({ start: outStart, end: b.out.length, display });
  }

  private html(value: string, start: number, end: number): void {
    const m = DIRECTIVE.exec(value.trim());
    if (m) this.directives.push({ text: m[1].trim(), sourceStart: start, sourceEnd: end, blockIndex: this.blocks.length });
  }

  private table(node: Table): void {
    const id = this.tableCount++;
    const headers: string[] = [];
    node.children.forEach((row, r) => {
      row.children.forEach((cell, c) => {
        const b = this.block('table-cell', { table: id, row: r, column: c, header: r === 0 ? null : headers[c] ?? null });
        this.inline(b, cell.children);
        if (r === 0) headers[c] = this.store.textOf(b.out).trim();
      });
    });
  }

  private readFrontMatter(value: string, start: number, end: number): void {
    try {
      const data = parseYaml(value) as unknown;
      if (data && typeof data === 'object' && !Array.isArray(data)) {
        this.frontMatter = data as Record<string, unknown>;
        for (const key of ['cosmology', 'comove']) {
          const declared = this.frontMatter[key];
          if (declared === undefined || declared === null) continue;
          this.directives.push({ text: frontMatterDeclaration(declared), sourceStart: start, sourceEnd: end, blockIndex: this.blocks.length });
        }
      }
    } catch (e) {
      this.problems.push({ message: `front matter is not valid YAML: ${(e as Error).message.split('\n')[0]}`, sourceStart: start, sourceEnd: end, severity: 'warning' });
    }
  }

  assemble(): DocumentReading {
    const drafts = this.blocks.filter((b) => b.out.length > 0);
    const { reading, starts } = this.store.assemble(drafts.map((d) => d.out), '\n\n');
    const blocks: Block[] = [];
    const math: MathSpan[] = [];
    const startOf = new Map<BlockDraft, number>();
    drafts.forEach((d, i) => {
      const start = starts[i];
      startOf.set(d, start);
      const end = start + d.out.length;
      const trimmedEnd = end - (/\s*$/.exec(reading.text.slice(start, end))?.[0].length ?? 0);
      if (trimmedEnd > start) blocks.push(d.cell ? { kind: d.kind, start, end: trimmedEnd, cell: d.cell } : { kind: d.kind, start, end: trimmedEnd });
      for (const m of d.math) if (m.end > m.start) math.push(trimRange(reading.text, { start: start + m.start, end: start + m.end, display: m.display }));
    });
    const readingOffsetOf = (blockIndex: number) => {
      for (let i = blockIndex; i < this.blocks.length; i++) {
        const s = startOf.get(this.blocks[i]);
        if (s !== undefined) return s;
      }
      return reading.text.length;
    };
    return {
      format: 'markdown',
      reading,
      blocks,
      math,
      sentences: splitSentences(reading.text, blocks, math),
      directives: this.directives.map(({ blockIndex, ...d }) => ({ ...d, readingOffset: readingOffsetOf(blockIndex) })),
      includes: [],
      texRoot: null,
      frontMatter: this.frontMatter,
      problems: this.problems,
    };
  }
}

function trimRange<T extends { start: number; end: number }>(text: string, r: T): T {
  let { start, end } = r;
  while (start < end && /\s/.test(text[start])) start++;
  while (end > start && /\s/.test(text[end - 1])) end--;
  return { ...r, start, end };
}

/**
 * The declaration text of a front-matter entry: a string as it is (`planck-2018`,
 * `H0=70 Omega_m=0.3 flat`), a mapping as key=value pairs (`{H0: 70, flat: true}`).
 */
export function frontMatterDeclaration(value: unknown): string {
  if (typeof value === 'string' || typeof value === 'number') return String(value);
  if (value && typeof value === 'object' && !Array.isArray(value)) {
    return Object.entries(value as Record<string, unknown>)
      .map(([k, v]) => (v === true && k.toLowerCase() === 'flat' ? 'flat' : k.toLowerCase() === 'preset' ? String(v) : `${k}=${String(v)}`))
      .join(' ');
  }
  return '';
}

/** Reads a Markdown source. Never throws. */
/**
 * Walks a document piece by piece, parsing only the pieces `memory` does not hold. A document
 * with definitions is parsed whole whenever the pieces that hold them change (its definitions
 * are then collected); otherwise each piece is parsed with those definitions appended after a
 * blank line, and only the piece's own nodes are kept.
 */
function readInPieces(walker: MarkdownWalker, source: string, chunks: readonly Chunk[], memory: MarkdownMemory): void {
  const texts = chunks.map((c) => source.slice(c.start, c.end));
  const holders = texts.filter(mayDefine);
  let definitions: string | null = null;
  if (holders.length === 0) memory.setDefinitions(null);
  else {
    definitions = memory.definitionsFor(holders);
    if (definitions === null) {
      // Parse the whole document; keep its definitions and each piece's nodes.
      const tree = parser.parse(source) as Root;
      const found: string[] = [];
      const visit = (nodes: readonly Nodes[]) => {
        for (const n of nodes) {
          if ((n.type === 'definition' || n.type === 'footnoteDefinition') && n.position) found.push(source.slice(n.position.start.offset, n.position.end.offset));
          if ('children' in n) visit(n.children as Nodes[]);
        }
      };
      visit(tree.children);
      memory.setDefinitions({ text: found.join('\n\n'), holders });
      let k = 0;
      chunks.forEach((c, i) => {
        const own: RootContent[] = [];
        while (k < tree.children.length && (tree.children[k].position?.start.offset ?? 0) < c.end) own.push(tree.children[k++]);
        if (own.every((n) => (n.position?.end.offset ?? 0) <= c.end)) memory.put(texts[i], shiftNodes(own, -c.start, -(c.line - 1)));
      });
      walker.walkBlocks(tree.children);
      memory.endRun();
      return;
    }
  }
  const appended = definitions;
  const parse = (text: string): readonly RootContent[] => {
    if (appended === null) return (parser.parse(text) as Root).children;
    const own = (parser.parse(`${text}\n\n${appended}`) as Root).children.filter((n) => (n.position?.start.offset ?? 0) < text.length);
    // A node of the piece that runs on into the definitions: the piece cannot be read on its own.
    if (own.some((n) => (n.position?.end.offset ?? 0) > text.length)) throw RUNS_ON;
    return own;
  };
  const parts: Array<readonly RootContent[]> = [];
  try {
    chunks.forEach((_, i) => parts.push(memory.nodes(texts[i], parse)));
  } catch (e) {
    if (e !== RUNS_ON) throw e;
    memory.setDefinitions({ text: '', holders: [] });
    return readInPieces(walker, source, chunks, memory);
  }
  parts.forEach((nodes, i) => walker.walkPiece(nodes, chunks[i].start));
  memory.endRun();
}

const RUNS_ON = new Error('a piece runs on into the appended definitions');

/**
 * Reads a Markdown source. With `memory` (an editor's), the source is parsed piece by piece
 * (markdownChunks.ts) and pieces unchanged since the last reading are not parsed again; the
 * reading is the same either way.
 */
export function readMarkdown(source: string, memory?: MarkdownMemory): DocumentReading {
  const walker = new MarkdownWalker(source);
  try {
    const chunks = memory ? markdownChunks(source) : null;
    if (memory && chunks) readInPieces(walker, source, chunks, memory);
    else walker.walkBlocks((parser.parse(source) as Root).children);
    return walker.assemble();
  } catch (e) {
    return unreadDocument('markdown', `internal reader error: ${(e as Error).message}`);
  }
}
