/**
 * The editor's caches change nothing but speed: after any sequence of edits, extraction with the
 * sentence cache and the reading memory (patched LaTeX readings) gives exactly the claims of a
 * fresh extraction (and the same declarations), and an unchanged document is read from the caches alone.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { extractProject, ReadingMemory, SentenceCache, type Claim } from '../../shared/src/index.js';

const ROOT = new URL('../../', import.meta.url).pathname;
const FILES = ['examples/kestrel-survey.tex', 'examples/kestrel-proposal.md', 'test/fixtures/manuscripts/aas-lantern-survey.tex', 'test/fixtures/manuscripts/notations.tex', 'test/fixtures/editing/tables.tex'];

function claims(uri: string, text: string, cache?: SentenceCache, memory?: ReadingMemory): unknown[] {
  const f = extractProject({ uri, text }, () => null, cache ? { sentenceCache: () => cache, readingMemory: memory } : {}).files[0];
  return [...f.claims.map((c: Claim) => ({ ...c, value: { ...c.value } })), f.declarations, f.declarationProblems, f.skips];
}

describe('sentence cache', () => {
  for (const path of FILES) {
    it(`${path}: identical claims after random edits, and all hits when nothing changed`, () => {
      const original = readFileSync(ROOT + path, 'utf8');
      fc.assert(
        fc.property(
          fc.array(
            fc.tuple(fc.nat(), fc.constantFrom('', 'x', ' ', '0', '.', '\n\n', ' Gpc', ' z = 2', '$', '}', 'luminosity distance ', ' & ', ' \\\\ ', '\\caption{At $z = 1$.}', ' we adopt H_0 = 68 and Omega_m = 0.31. '), fc.boolean()),
            { minLength: 1, maxLength: 6 },
          ),
          (edits) => {
            const cache = new SentenceCache();
            const memory = new ReadingMemory();
            let text = original;
            claims(path, text, cache, memory);
            for (const [at, insert, extract] of edits) {
              const p = at % (text.length + 1);
              // An empty insert deletes a character instead.
              text = insert === '' ? text.slice(0, p) + text.slice(p + 1) : text.slice(0, p) + insert + text.slice(p);
              // Some edits are not extracted at once: the next run then sees several changes.
              if (extract) expect(claims(path, text, cache, memory)).toEqual(claims(path, text));
            }
            expect(claims(path, text, cache, memory)).toEqual(claims(path, text));
          },
        ),
        { numRuns: 25 },
      );
      const cache = new SentenceCache();
      claims(path, original, cache);
      claims(path, original, cache);
      expect(cache.stats.misses).toBe(0);
      expect(cache.stats.hits).toBeGreaterThan(2);
    });
  }
});
