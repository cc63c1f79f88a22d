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
  it('equals toPrecision(12) in value for any double (property)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (v) => {
        const s = written(v);
        expect(Number(s)).toBe(Number(v.toPrecision(12)));
      }),
      { numRuns: 3000 },
    );
  });
  it('writes rows under a header', () => {
    const bytes = columnsToCsv('z,d', [Float64Array.from([0.5, 1]), Float64Array.from([2832.94, NaN])]);
    expect(new TextDecoder().decode(bytes)).toBe('z,d\n0.5,2832.94\n1,\n');
  });
});
