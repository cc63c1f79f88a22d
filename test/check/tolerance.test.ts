/** Tolerances from what the author wrote, and replacement text in the author's notation. */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { findNumbers, formatLike, judge, statedInterval, readLatex, restate, applyEdits, type StatedNumber } from '../../shared/src/index.js';

function stated(text: string): StatedNumber {
  const n = findNumbers(text);
  if (n.length === 0) throw new Error(`no number in ${text}`);
  return n[0];
}

describe('statedInterval (rounding intervals: common practice, no source)', () => {
  const cases: Array<[string, number, number]> = [
    ['D = 6.6 Gpc', 6.55, 6.65],
    ['D = 6600 Mpc', 6550, 6650],
    ['t = 13.80 Gyr', 13.795, 13.805],
    ['D = 2.1 ± 0.2 Gpc', 1.85, 2.35],
    ['t ≈ 10 Gyr', 5, 15], // approximate: the rounding interval (10 is stated to one digit), at least ± 5 %
    ['t ≈ 13.8 Gyr', 13.8 - 0.69, 13.8 + 0.69],
    ['between 9 and 11 Gyr', 8.5, 11.5],
  ];
  for (const [text, low, high] of cases) {
    it(text, () => {
      const i = statedInterval(stated(text));
      expect(i.low).toBeCloseTo(low, 9);
      expect(i.high).toBeCloseTo(high, 9);
    });
  }
  it('bounds are one-sided', () => {
    expect(statedInterval(stated('less than 7 Gyr'))).toEqual({ low: -Infinity, high: 7.5 });
    expect(statedInterval(stated('more than 7.0 Gyr'))).toEqual({ low: 6.95, high: Infinity });
  });
});

describe('judge', () => {
  it('admits values inside the rounding interval and reports how far outside the others are', () => {
    const n = stated('6.6 Gpc');
    const i = statedInterval(n);
    expect(judge(n, i, 6.62, 0).consistent).toBe(true);
    const off = judge(n, i, 6.8, 0);
    expect(off.consistent).toBe(false);
    expect(off.relativeDifference).toBeCloseTo((6.6 - 6.8) / 6.8, 12);
    expect(off.tolerancesAway).toBeCloseTo(0.2 / 0.05, 9);
  });
  it('says when only the floor admits a value', () => {
    const n = stated('6.60 Gpc');
    const i = statedInterval(n);
    const j = judge(n, i, 6.62, 0.005 * 6.62);
    expect(j.consistent).toBe(true);
    expect(j.onlyByFloor).toBe(true);
  });
});

describe('formatLike keeps the notation', () => {
  const cases: Array<[string, number, string]> = [
    ['6.6', 6.83, '6.8'],
    ['2833', 2914.8, '2915'],
    ['6600', 6832, '6800'],
    ['13,800', 13467, '13,500'],
    ['0.879', 0.87912, '0.879'],
  ];
  for (const [digits, value, want] of cases) {
    it(`${digits} → ${want}`, () => expect(formatLike(stated(digits), digits, value)).toBe(want));
  }
  it('rewrites only the mantissa of a scientific number', () => {
    const n = stated('1.2×10^28');
    expect(formatLike(n, '1.2', 1.46e28)).toBe('1.5');
  });
  it('never rewrites to zero', () => expect(formatLike(stated('0.4'), '0.4', 0.01)).toBeNull());

  it('round-trips: restating a number as its own value changes nothing (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 99_999 }), fc.integer({ min: 0, max: 4 }), (int, decimals) => {
        const digits = (int / 10 ** decimals).toFixed(decimals);
        const n = stated(digits);
        expect(formatLike(n, digits, n.value)).toBe(digits);
      }),
    );
  });
});

describe('restate edits the source in place', () => {
  it('in siunitx and in math, keeping everything around the digits', () => {
    const source = 'We find $D_L = 6.6$\\,Gpc and \\SI{6.6}{\\giga\\parsec}.';
    const doc = readLatex(source);
    const numbers = findNumbers(doc.reading.text);
    const edits = numbers.map((n) => restate(doc, source, n, 6.83));
    expect(edits.every((e) => typeof e !== 'string')).toBe(true);
    expect(applyEdits(source, edits as Array<Exclude<(typeof edits)[number], string>>)).toBe('We find $D_L = 6.8$\\,Gpc and \\SI{6.8}{\\giga\\parsec}.');
  });
  it('refuses numbers that come from a macro, and ranges', () => {
    const source = '\\newcommand{\\dl}{6.6}\nWe find $D_L = \\dl$\\,Gpc, and 1.5--2.5 Gpc.';
    const doc = readLatex(source);
    const numbers = findNumbers(doc.reading.text);
    expect(numbers.map((n) => typeof restate(doc, source, n, 7))).toEqual(['string', 'string']);
  });
});
