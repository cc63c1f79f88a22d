/** Stated numbers: values, precision, qualifiers, uncertainties, ranges and units, table-driven. */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { findNumbers, precisionOf } from '../../shared/src/index.js';

type Row = [text: string, expected: Array<Partial<{ text: string; value: number; significantDigits: number; resolution: number; qualifier: string; relation: string | null; unit: string | null; uncertainty: { plus: number; minus: number }; range: { low: number; high: number } }>>];

const TABLE: Row[] = [
  ['D_L = 6.6 Gpc', [{ text: '6.6', value: 6.6, significantDigits: 2, resolution: 0.1, qualifier: 'exact', relation: '=', unit: 'Gpc' }]],
  ['H_0 = 70 km s^-1 Mpc^-1', [{ value: 70, unit: 'km s^-1 Mpc^-1' }]],
  ['about 13,800 Myr ago', [{ value: 13800, significantDigits: 3, resolution: 100, qualifier: 'approximate', relation: 'about', unit: 'Myr' }]],
  ['a volume of 1.2×10^3 Mpc^3', [{ value: 1200, significantDigits: 2, resolution: 100, unit: 'Mpc^3' }]],
  ['1.2e28 cm', [{ value: 1.2e28, resolution: 1e27, unit: 'cm' }]],
  ['age of 13.8 ± 0.2 Gyr', [{ value: 13.8, uncertainty: { plus: 0.2, minus: 0.2 }, unit: 'Gyr' }]],
  ['D_L = 8.3^+0.1_-0.2 Gpc', [{ value: 8.3, uncertainty: { plus: 0.1, minus: 0.2 }, unit: 'Gpc' }]],
  ['at 1.5–2.5 Gyr', [{ value: 2, qualifier: 'range', range: { low: 1.5, high: 2.5 }, unit: 'Gyr' }]],
  ['between 9 and 11 Gyr', [{ value: 10, qualifier: 'range', relation: 'between', range: { low: 9, high: 11 }, unit: 'Gyr' }]],
  ['z ≲ 2', [{ value: 2, qualifier: 'upper-bound', relation: '≲', unit: null }]],
  ['up to 4.4 kpc', [{ value: 4.4, qualifier: 'upper-bound', relation: 'up to', unit: 'kpc' }]],
  ['∼ 3 Gyr', [{ value: 3, qualifier: 'approximate', relation: '∼' }]],
  ['1.0″ corresponds to 8.4 kpc', [{ value: 1, unit: '″' }, { value: 8.4, unit: 'kpc' }]],
  ['scale 8.0 kpc/″', [{ value: 8, unit: 'kpc/″' }]],
  ['100 h^-1 Mpc', [{ value: 100, unit: 'h^-1 Mpc' }]],
  ['100 Mpc/h', [{ value: 100, unit: 'Mpc/h' }]],
  ['w_0 = -1', [{ value: -1, relation: '=' }]],
  ['z=2-3', [{ value: 2.5, qualifier: 'range', range: { low: 2, high: 3 } }]],
  ['H0 and z_1 and 2MASS J1234+56', []],
  ['⟦cite:planck2018⟧', []],
  ['T = 3000 K', [{ value: 3000, significantDigits: 1, resolution: 1000, unit: 'K' }]],
  ['375,000 years old', [{ value: 375000, unit: 'years' }]],
  ['3.2 billion years', [{ value: 3.2, unit: 'billion years' }]],
  ['h = 0.70', [{ value: 0.7, significantDigits: 2, resolution: 0.01 }]],
  ['0.0012', [{ value: 0.0012, significantDigits: 2, resolution: 0.0001 }]],
  ['1.0^^′′ at each', [{ value: 1, unit: '^^′′' }]],
  ['2.1×10^6 Mpc^3 per square degree', [{ value: 2.1e6, unit: 'Mpc^3 per square degree' }]],
];

describe('stated numbers', () => {
  for (const [text, expected] of TABLE) {
    it(JSON.stringify(text), () => {
      const found = findNumbers(text);
      expect(found).toHaveLength(expected.length);
      expected.forEach((e, i) => {
        const n = found[i];
        if (e.text !== undefined) expect(n.text).toBe(e.text);
        if (e.value !== undefined) expect(n.value).toBeCloseTo(e.value, 10);
        if (e.significantDigits !== undefined) expect(n.significantDigits).toBe(e.significantDigits);
        if (e.resolution !== undefined) expect(n.resolution).toBeCloseTo(e.resolution, 12);
        if (e.qualifier !== undefined) expect(n.qualifier).toBe(e.qualifier);
        if (e.relation !== undefined) expect(n.relation).toBe(e.relation);
        if (e.unit !== undefined) expect(n.unit ? n.unit.text.trim() : null).toBe(e.unit);
        if (e.uncertainty !== undefined) expect(n.uncertainty).toEqual(e.uncertainty);
        if (e.range !== undefined) expect(n.range).toEqual(e.range);
      });
    });
  }

  it('parses the units it reads: h-scaled, scales, per-area volumes', () => {
    const unitOf = (t: string) => findNumbers(t)[0].unit!.unit!;
    expect(unitOf('100 h^-1 Mpc').hPower).toBe(-1);
    expect(unitOf('100 Mpc/h').hPower).toBe(-1);
    expect(unitOf('8.0 kpc/″').dimensions).toMatchObject({ length: 1, angle: -1 });
    expect(unitOf('2 Mpc^3 per square degree').dimensions).toMatchObject({ length: 3, angle: -2 });
    expect(unitOf('13 billion years').dimensions).toMatchObject({ time: 1 });
  });

  it('takes the precision from the digits as written (common practice, no source)', () => {
    expect(precisionOf('6.60')).toEqual({ significantDigits: 3, resolution: 0.01 });
    expect(precisionOf('6600')).toEqual({ significantDigits: 2, resolution: 100 });
    expect(precisionOf('0.05')).toEqual({ significantDigits: 1, resolution: 0.01 });
    expect(precisionOf('0')).toEqual({ significantDigits: 1, resolution: 1 });
  });

  it('never throws and keeps every number inside the text (property)', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 120 }), fc.array(fc.constantFrom('1', '.', '5', ' ', '±', '×10^', '-', '–', 'e', 'Gpc', 'h^-1', '/', '″', 'and', 'between ', '⟦', '⟧', '^+', '_-'), { maxLength: 30 }), (junk, parts) => {
        for (const t of [junk, parts.join('')]) {
          for (const n of findNumbers(t)) {
            expect(n.start).toBeGreaterThanOrEqual(0);
            expect(n.end).toBeLessThanOrEqual(t.length);
            expect(Number.isNaN(n.value)).toBe(false);
          }
        }
      }),
      { numRuns: 400 },
    );
  });
});
