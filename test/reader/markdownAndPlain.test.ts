/** The Markdown and plain-text readers. */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readMarkdown, readPlainText } from '../../shared/src/index.js';

describe('Markdown', () => {
  const src = [
    '---', 'title: A proposal', 'cosmology: planck-2018', '---', '',
    '# Science case', '',
    'The host lies at $z = 6.41$ where $D_L \\approx 62.3$ Gpc, and the light left **12.6 Gyr** ago.[^1]', 'See `code 42`.', '',
    '| Target | $z$ | $D_L$ (Gpc) |', '|---|---|---|', '| E | 6.41 | 62.3 |', '',
    '$$', 't_0 = 13.8\\,\\mathrm{Gyr}', '$$', '',
    '```', 'D_L = 99', '```', '',
    '[^1]: Computed for $H_0 = 70$.', '',
  ].join('\n');
  const r = readMarkdown(src);
  const blocks = r.blocks.map((b) => [b.kind, r.reading.text.slice(b.start, b.end)]);

  it('reads prose with math through the LaTeX reader, skips code, and keeps the front matter', () => {
    expect(blocks).toContainEqual(['paragraph', 'The host lies at z = 6.41 where D_L ≈ 62.3 Gpc, and the light left 12.6 Gyr ago.\nSee .']);
    expect(r.reading.text).not.toContain('99');
    expect(r.frontMatter).toEqual({ title: 'A proposal', cosmology: 'planck-2018' });
    expect(r.directives[0].text).toBe('planck-2018');
  });
  it('makes headings, table cells with headers, display math and footnotes into blocks', () => {
    expect(blocks[0]).toEqual(['heading', 'Science case']);
    const cell = r.blocks.find((b) => b.kind === 'table-cell' && r.reading.text.slice(b.start, b.end) === '62.3');
    expect(cell?.cell).toMatchObject({ row: 1, column: 2, header: 'D_L (Gpc)' });
    expect(blocks).toContainEqual(['paragraph', 't_0 = 13.8 Gyr']);
    expect(blocks).toContainEqual(['footnote', 'Computed for H_0 = 70.']);
  });
  it('maps numbers inside math back to their characters in the Markdown source', () => {
    const i = r.reading.text.indexOf('62.3');
    const { start, end } = r.reading.sourceRange(i, i + 4);
    expect(src.slice(start, end)).toBe('62.3');
  });
  it('reports front matter that is not YAML, and still reads the rest', () => {
    const bad = readMarkdown('---\ncosmology: [unclosed\n---\n\nText at $z=1$.\n');
    expect(bad.problems[0].message).toMatch(/front matter is not valid YAML/);
    expect(bad.reading.text).toContain('Text at z=1.');
  });
  it('never throws, and maps every reading offset inside the source (property)', () => {
    const mdish = fc.array(fc.constantFrom('#', ' ', '\n', '\n\n', '$', '$$', '|', '---', '`', '```', '[^1]', ': ', '*', '1.5', 'Gpc', '<!-- comove: H0=70 -->', '\\', '{', '}', 'z = 2', '-'), { maxLength: 50 }).map((p) => p.join(''));
    fc.assert(
      fc.property(fc.oneof(mdish, fc.string({ maxLength: 150 })), (text) => {
        const rd = readMarkdown(text);
        for (let i = 0; i < rd.reading.text.length; i += 5) {
          const { start, end } = rd.reading.sourceRange(i, i + 1);
          expect(start).toBeGreaterThanOrEqual(0);
          expect(end).toBeLessThanOrEqual(text.length);
        }
      }),
      { numRuns: 200 },
    );
  });
});

describe('plain text', () => {
  it('joins lines and hyphenated words, splits paragraphs, keeps Unicode', () => {
    const r = readPlainText('We adopt H0 = 70 km s−1 Mpc−1.\nThe dis-\ntance is 6.6 Gpc at z ≈ 1.\n\nSecond ¶ with Ωm = 0.3.');
    expect(r.blocks.map((b) => r.reading.text.slice(b.start, b.end))).toEqual([
      'We adopt H0 = 70 km s−1 Mpc−1. The distance is 6.6 Gpc at z ≈ 1.',
      'Second ¶ with Ωm = 0.3.',
    ]);
    expect(r.sentences).toHaveLength(3);
  });
  it('never throws and maps offsets inside the source (property)', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 200 }), (text) => {
        const r = readPlainText(text);
        for (let i = 0; i < r.reading.text.length; i += 3) {
          const { start, end } = r.reading.sourceRange(i, i + 1);
          expect(end).toBeLessThanOrEqual(text.length);
          expect(start).toBeLessThanOrEqual(end);
        }
      }),
      { numRuns: 300 },
    );
  });
});
