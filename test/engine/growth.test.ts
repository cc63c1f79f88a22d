/** The linear growth factor and rate from the growth ODE. */
import { describe, expect, it } from 'vitest';
import { growthFactor, growthRate, growthRateApproximation, integrateAdaptiveForTest } from './growthHelpers.js';
import { build, relativeError } from '../helpers/cosmology.js';

describe('growth of structure', () => {
  it('Einstein–de Sitter without radiation: D = a and f = 1 exactly (Peebles 1980, §11)', () => {
    const eds = build({ H0: 70, Omega_m: 1, Omega_Lambda: 0 });
    for (const z of [0, 0.5, 2, 10, 1000]) {
      expect(relativeError(growthFactor(eds, z), 1 / (1 + z))).toBeLessThan(1e-8);
      expect(Math.abs(growthRate(eds, z) - 1)).toBeLessThan(1e-8);
    }
  });

  it('ΛCDM and open models without radiation match the integral solution D ∝ E ∫ da/(aE)³ (Heath 1977, quoted from memory)', () => {
    for (const input of [
      { H0: 70, Omega_m: 0.3, flat: true },
      { H0: 70, Omega_m: 0.3, Omega_Lambda: 0 },
      { H0: 70, Omega_m: 0.25, Omega_Lambda: 0.9 },
    ]) {
      const c = build(input);
      const heath = (z: number) => {
        const a = 1 / (1 + z);
        const integral = integrateAdaptiveForTest((s) => 1 / (s * c.expansion.e(1 / s)) ** 3, 0, a);
        return c.expansion.e(1 / a) * integral;
      };
      const norm = heath(0);
      for (const z of [0.1, 0.5, 1, 3, 10]) expect(relativeError(growthFactor(c, z), heath(z) / norm)).toBeLessThan(1e-9);
    }
  });

  it('growth rate is close to Ωm(z)^0.55 in flat ΛCDM (Linder 2005: γ ≈ 0.55, good to a few tenths of a per cent)', () => {
    const c = build({ H0: 67.66, Omega_m: 0.311, T_CMB: 2.7255, flat: true });
    for (const z of [0, 0.3, 0.8, 1.5, 3]) expect(relativeError(growthRate(c, z), growthRateApproximation(c, z))).toBeLessThan(0.01);
  });

  it('D(0) = 1 and D decreases with redshift', () => {
    const c = build({ H0: 70, Omega_m: 0.3, w0: -0.9, wa: 0.1, T_CMB: 2.7255, m_nu: 0.1, flat: true });
    expect(growthFactor(c, 0)).toBeCloseTo(1, 12);
    let prev = 1;
    for (const z of [0.1, 0.5, 1, 2, 5, 20, 100]) {
      const d = growthFactor(c, z);
      expect(d).toBeLessThan(prev);
      prev = d;
    }
  });

  it('refuses redshifts beyond its table with a clear error', () => {
    const c = build({ H0: 70, Omega_m: 0.3, flat: true });
    expect(() => growthFactor(c, 1e6)).toThrow(/tabulated up to/);
  });
});
