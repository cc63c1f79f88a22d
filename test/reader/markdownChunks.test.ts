/**
 * Reading Markdown piece by piece (the editor's MarkdownMemory) gives exactly the reading of the
 * whole source — text, source map, blocks, math, sentences, directives, front matter, problems —
 * along chains of random edits that insert the constructs that decide where pieces may be cut
 * (fences, $$ math, HTML comments, lists, block quotes, tables, link-reference and footnote
 * definitions and references, front matter markers), and an unchanged document is read without
 * parsing anything again.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { readMarkdown } from '../../shared/src/reader/markdownReader.js';
import { markdownChunks, MarkdownMemory } from '../../shared/src/reader/markdownChunks.js';
import { syntheticMarkdownManuscript } from '../bench/syntheticManuscript.js';

const ROOT = new URL('../../', import.meta.url).pathname;
const SOURCES: Record<string, string> = {
  'examples/kestrel-proposal.md': readFileSync(ROOT + 'examples/kestrel-proposal.md', 'utf8'),
  'test/fixtures/manuscripts/lantern-proposal.md': readFileSync(ROOT + 'test/fixtures/manuscripts/lantern-proposal.md', 'utf8'),
  // Without its footnote definitions, and with them.
  'synthetic 6 kB': syntheticMarkdownManuscript(6_000).replace(/^ {0,3}\[[^\]\n]+\]:/gm, 'Note:'),
  'synthetic 6 kB with footnotes': syntheticMarkdownManuscript(6_000),
};
const PIECES = ['\n\n', 'x', ' ', '\n\n```\n', '\n```\n', '\n\n$$\n', '\n$$\n', '\n\n<!-- note\n', ' -->\n', '\n\n- item\n', '\n\n1. step\n', '\n\n> quoted\n', '\n\n    indented\n', '\n\n---\n', '\n\n| a | b |\n|---|---|\n| 1 | 2 |\n', 'z = 2 and 4.5 Gpc. ', '\n\n[ref]: https://example.org\n', '\n\n<pre>\n', '</pre>\n', '$', ' see [the survey][ref] and [ref] ', ' as noted[^n] ', '\n\n[^n]: A note on $z = 2$.\n', '\n\n> [ref]: https://example.org/quoted\n', ']:'];

function plain(source: string, memory?: MarkdownMemory): unknown {
  const r = readMarkdown(source, memory);
  return { ...r, reading: { text: r.reading.text, map: Array.from((r.reading as unknown as { map: Int32Array }).map ?? []) } };
}

describe('Markdown read piece by piece', () => {
  for (const [name, original] of Object.entries(SOURCES)) {
    it(`${name}: equals the whole reading after random edits`, () => {
      fc.assert(
        fc.property(fc.array(fc.tuple(fc.nat(), fc.constantFrom(...PIECES)), { minLength: 1, maxLength: 6 }), (edits) => {
          const memory = new MarkdownMemory();
          let text = original;
          expect(plain(text, memory)).toEqual(plain(text));
          for (const [at, insert] of edits) {
            const p = at % (text.length + 1);
            text = text.slice(0, p) + insert + text.slice(p);
            expect(plain(text, memory)).toEqual(plain(text));
          }
        }),
        { numRuns: 30 },
      );
    }, 120_000);
  }

  it('cuts a long manuscript into many pieces and parses none again when nothing changed', () => {
    const text = SOURCES['synthetic 6 kB'];
    expect(markdownChunks(text)!.length).toBeGreaterThan(10);
    const memory = new MarkdownMemory();
    readMarkdown(text, memory);
    const parsed = memory.stats.parsed;
    readMarkdown(text, memory);
    expect(memory.stats.parsed).toBe(parsed);
    // One edit in the middle parses one piece again.
    const at = text.indexOf(' ', text.length >> 1);
    readMarkdown(text.slice(0, at) + '7' + text.slice(at), memory);
    expect(memory.stats.parsed).toBe(parsed + 1);
  });

  it('resolves references to definitions in other pieces, and parses the whole again only when a piece with definitions changes', () => {
    const text = 'Intro with a [survey][s] and a note.[^n]\n\nMore prose here.\n\nThe end, see [s].\n\n[s]: https://example.org\n\n[^n]: The note at $z = 1$.\n';
    const memory = new MarkdownMemory();
    expect(plain(text, memory)).toEqual(plain(text));
    const parsed = memory.stats.parsed;
    const edited = text.replace('More prose', 'More plain prose');
    expect(plain(edited, memory)).toEqual(plain(edited));
    expect(memory.stats.parsed).toBe(parsed + 1);
    const redefined = edited.replace('[s]: https://example.org', '[t]: https://example.org');
    expect(plain(redefined, memory)).toEqual(plain(redefined));
  });
});
