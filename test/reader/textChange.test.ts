/**
 * textChange finds the one stretch that differs between two versions of a text: what it reports
 * as shared really is shared, the shared start and end never overlap, and the shared start is as
 * long as it can be (the chunked comparison must not stop early).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { textChange } from '../../shared/src/reader/textChange.js';

describe('textChange', () => {
  it('reports a shared start and end that are shared, maximal at the start, and do not overlap', () => {
    fc.assert(
      fc.property(fc.string({ unit: fc.constantFrom('a', 'b', 'Ω', ' ', '\n'), maxLength: 1200 }), fc.nat(), fc.nat(40), fc.string({ maxLength: 40 }), (text, at, removed, inserted) => {
        const p = at % (text.length + 1);
        const after = text.slice(0, p) + inserted + text.slice(p + removed);
        const { prefix, suffix } = textChange(text, after);
        expect(prefix + suffix).toBeLessThanOrEqual(Math.min(text.length, after.length));
        expect(after.slice(0, prefix)).toBe(text.slice(0, prefix));
        expect(after.slice(after.length - suffix)).toBe(text.slice(text.length - suffix));
        // Maximal start: the next characters differ (or one text ends there).
        if (prefix < Math.min(text.length, after.length)) expect(after[prefix]).not.toBe(text[prefix]);
      }),
      { numRuns: 300 },
    );
  });

  it('finds a one-character edit deep inside a long text (past many chunks)', () => {
    const text = 'The pair lies at z = 0.73. '.repeat(4000);
    const after = text.slice(0, 54_321) + 'x' + text.slice(54_321);
    expect(textChange(text, after)).toEqual({ prefix: 54_321, suffix: text.length - 54_321 });
    expect(textChange(text, text)).toEqual({ prefix: text.length, suffix: 0 });
  });
});
