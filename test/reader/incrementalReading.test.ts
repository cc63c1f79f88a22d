/**
 * Patching a reading after a small plain edit gives exactly what reading the edited source gives:
 * the same reading text, blocks, formulas, sentences, directives and problems, and the same
 * source position for every reading offset — over chains of random edits on the fixture
 * manuscripts. Edits the patch refuses fall back to a full reading.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { patchLatexReading, readLatex } from '../../shared/src/index.js';

const ROOT = new URL('../../', import.meta.url).pathname;
const FILES = ['examples/kestrel-survey.tex', 'test/fixtures/manuscripts/aas-lantern-survey.tex', 'test/fixtures/manuscripts/notations.tex', 'test/fixtures/check/ember-groups.tex', 'test/fixtures/manuscripts/mnras-ember-pairs.tex', 'test/fixtures/manuscripts/named-sets.tex', 'test/fixtures/manuscripts/no-cosmology.tex', 'test/fixtures/check/published-derived.tex'];

type Reading = ReturnType<typeof readLatex>;

function comparable(r: Reading) {
  const positions: number[] = [];
  for (let i = 0; i <= r.reading.text.length; i++) positions.push(r.reading.sourceStart(i), r.reading.sourceEnd(i));
  return {
    text: r.reading.text,
    blocks: r.blocks,
    math: r.math,
    sentences: r.sentences,
    directives: r.directives,
    includes: r.includes,
    problems: r.problems,
    positions,
  };
}

describe('incremental LaTeX reading', () => {
  for (const path of FILES) {
    it(`${path}: patched readings equal full readings along chains of edits`, () => {
      const original = readFileSync(ROOT + path, 'utf8');
      let patchedCount = 0;
      fc.assert(
        fc.property(
          fc.array(fc.tuple(fc.nat(), fc.constantFrom('x', 'ab', ' ', '7', '.', '3.5', ' kpc', 'Gpc', '', '', '(', ',', '=', '/', '0', ' z = 2', '\\', '$', '\n', '-', '{')), { minLength: 1, maxLength: 8 }),
          (edits) => {
            let source = original;
            let reading = readLatex(source);
            for (const [pos, insert] of edits) {
              const p = pos % (source.length + 1);
              const next = insert === '' ? source.slice(0, p) + source.slice(p + 1 + (pos % 3)) : source.slice(0, p) + insert + source.slice(p);
              const patched = patchLatexReading(source, reading, next);
              const fresh = readLatex(next);
              if (patched) {
                patchedCount++;
                expect(comparable(patched)).toEqual(comparable(fresh));
              }
              source = next;
              reading = patched ?? fresh;
            }
          },
        ),
        { numRuns: 60 },
      );
      // Most single plain edits land in plain text and are patched.
      expect(patchedCount).toBeGreaterThan(20);
    }, 60_000);
  }

  it('refuses edits that change what the reader transforms', () => {
    const source = 'We find $D_L = 6.6$\\,Gpc \\cite{a}. % note\nNext.';
    const r = readLatex(source);
    for (const next of [source.replace('6.6', '6.6$'), source.replace('\\cite', '\\cit'), source.replace('% note', '% nota'), source.replace('cite{a}', 'cite{ab}'), source.replace('find', 'find\n\n')]) {
      expect(patchLatexReading(source, r, next)).toBeNull();
    }
    expect(patchLatexReading(source, r, source.replace('find', 'found'))).not.toBeNull();
    // Plain edits that join or split what the reader reads as one token: a dash, $$, a control word.
    const joins = 'The mat-ter-xx era, $a$x$b$ and \\a1b here.';
    const j = readLatex(joins);
    for (const next of [joins.replace('-ter-', '--'), joins.replace('$x$', '$$'), joins.replace('\\a1b', '\\ab')]) {
      expect(patchLatexReading(joins, j, next)).toBeNull();
    }
    expect(patchLatexReading(joins, j, joins.replace('era', 'ear'))).not.toBeNull();
    // Plain text right after a macro that is not a word (\,) is still plain text.
    expect(patchLatexReading(source, r, source.replace('\\,Gpc', '\\,Gp'))).not.toBeNull();
  });
});
