/** Extreme but legal inputs give finite answers (or a clear error), never NaN or a hang. */
import { describe, expect, it } from 'vitest';
import {
  age,
  angularSizeArcsec,
  comovingDistance,
  comovingVolumeBetween,
  comovingVolumePerSquareDegree,
  comovingVolume,
  evaluateColumns,
  lookbackTime,
  properKpcPerArcsec,
  properSizeKpc,
  QUANTITIES,
  SQUARE_DEGREE_SR,
} from '../../shared/src/index.js';
import { build, preset, relativeError } from '../helpers/cosmology.js';

describe('extreme redshifts', () => {
  for (const name of ['planck-2018', 'flat-70-0.3']) {
    it(`${name}: distances converge to the particle horizon and ages to zero as z → 10³⁰⁰`, () => {
      const c = preset(name);
      const horizon = comovingDistance(c, 1e300);
      expect(Number.isFinite(horizon)).toBe(true);
      expect(relativeError(comovingDistance(c, 1e9), horizon)).toBeLessThan(1e-4);
      expect(age(c, 1e300)).toBeGreaterThanOrEqual(0);
      expect(relativeError(lookbackTime(c, 1e300), age(c, 0))).toBeLessThan(1e-12);
    });
  }

  it('every catalogued quantity is a number or explicitly undefined (NaN) at z = 0, 1e-300 and 1e300', () => {
    const c = preset('planck-2018');
    const cols = evaluateColumns(c, [0, 1e-300, 1e300], QUANTITIES.map((q) => q.key));
    for (const [key, col] of cols.columns) for (const v of col) expect(Number.isNaN(v) || Number.isFinite(v), key).toBe(true);
    expect(cols.columns.get('comovingDistance')![2]).toBeGreaterThan(14000);
  });
});

describe('angular and physical sizes, volumes', () => {
  const c = build({ H0: 70, Omega_m: 0.3, flat: true });
  it('size ↔ angle at z are inverse to each other (small-angle, Hogg 1999 eq. 18)', () => {
    const kpc = properSizeKpc(c, 1.5, 2.5);
    expect(relativeError(kpc, 2.5 * properKpcPerArcsec(c, 1.5))).toBeLessThan(1e-15);
    expect(relativeError(angularSizeArcsec(c, 1.5, kpc), 2.5)).toBeLessThan(1e-14);
  });
  it('volume between two redshifts is the difference; per square degree is the all-sky volume over 41 253 deg²', () => {
    expect(relativeError(comovingVolumeBetween(c, 1, 2), comovingVolume(c, 2) - comovingVolume(c, 1))).toBeLessThan(1e-15);
    expect(relativeError((4 * Math.PI) / SQUARE_DEGREE_SR, 41252.96124941928)).toBeLessThan(1e-12);
    expect(relativeError(comovingVolumePerSquareDegree(c, 1) * 41252.96124941928, comovingVolume(c, 1))).toBeLessThan(1e-12);
  });
});
