/** The CSV number writer against Number.prototype.toPrecision(12). */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { columnsToCsv, writeNumber } from '../../cli/src/csvWriter.js';

function written(v: number): string {
  const b = new Uint8Array(64);
  const len = writeNumber(b, 0, v, new Uint8Array(12));
  return new TextDecoder().decode(b.subarray(0, len));
}

describe('CSV numbers', () => {
  it('writes 12 significant digits, trailing zeros trimmed, in plain or exponent notation', () => {
    expect(written(0)).toBe('0');
    expect(written(1)).toBe('1');
    expect(written(6607.6576117749355)).toBe('6607.65761177');
    expect(written(-1)).toBe('-1');
    expect(written(0.5)).toBe('0.5');
    expect(written(0.0000913896115012)).toBe('0.0000913896115012');
    expect(written(2.85320091612148e-29)).toBe('2.85320091612e-29');
    expect(written(26550755712.25319)).toBe('26550755712.3');
    expect(written(1e21)).toBe('1e21');
    expect(written(NaN)).toBe('');
    expect(written(Infinity)).toBe('Infinity');
  });
  it('is the value to 12 significant digits, within one unit of the last digit of toPrecision(12) (property)', () => {
    // The division by a power of ten may round a near-tie the other way than toPrecision, by one
    // unit in the 12th digit (1e-11 relative): far below the engine's accuracy.
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (v) => {
        const s = written(v);
        const mantissaDigits = s.replace(/^-/, '').split('e')[0].replace('.', '').replace(/^0+/, '');
        expect(mantissaDigits.length).toBeLessThanOrEqual(12);
        if (v === 0) {
          expect(Number(s)).toBe(0);
          return;
        }
        const unit = 10 ** (Math.floor(Math.log10(Math.abs(v))) - 11);
        expect(Math.abs(Number(s) - Number(v.toPrecision(12)))).toBeLessThanOrEqual(unit * 1.01) // 1 % slack for the rounding of the subtraction itself;
      }),
      { numRuns: 20000 },
    );
  });
  it('writes rows under a header', () => {
    const bytes = columnsToCsv('z,d', [Float64Array.from([0.5, 1]), Float64Array.from([2832.94, NaN])]);
    expect(new TextDecoder().decode(bytes)).toBe('z,d\n0.5,2832.94\n1,\n');
  });
});
