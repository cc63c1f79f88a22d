/**
 * The tables against direct adaptive quadrature (the goal: within 1e-7 relative;
 * measured about 1e-11, so we assert 1e-9 to catch any regression long before the goal).
 */
import { describe, expect, it } from 'vitest';
import { ageIntegral, comovingIntegral, lookbackIntegral, TABLE_Z_MAX, type ParameterInput } from '../../shared/src/index.js';
import { build, relativeError } from '../helpers/cosmology.js';

const MODELS: Array<[string, ParameterInput]> = [
  ['Planck 2018 with massive neutrinos', { H0: 67.66, omega_b: 0.02242, omega_c: 0.11933, T_CMB: 2.7255, N_eff: 3.046, m_nu: 0.06, flat: true }],
  ['flat, no radiation', { H0: 70, Omega_m: 0.3, flat: true }],
  ['open with radiation', { H0: 70, Omega_m: 0.3, Omega_Lambda: 0.5, T_CMB: 2.7255 }],
  ['closed, heavy neutrinos', { H0: 60, Omega_m: 1.2, Omega_Lambda: 0.2, T_CMB: 2.7255, m_nu: 0.3 }],
  ['w0–wa dark energy', { H0: 70, Omega_m: 0.3, w0: -0.8, wa: -0.5, T_CMB: 2.7255, flat: true }],
  ['low-density open', { H0: 70, Omega_m: 0.05, Omega_Lambda: 0 }],
];

/** Redshifts spread over the table: a uniform sweep in ln(1+z) plus tiny and ordinary values. */
function redshifts(): number[] {
  const zs: number[] = [];
  for (let i = 0; i <= 400; i++) zs.push(Math.expm1((Math.log1p(TABLE_Z_MAX) * (i + 0.37)) / 401));
  for (let k = -6; k <= 1; k += 0.25) zs.push(10 ** k);
  return zs;
}

describe('background table versus direct quadrature', () => {
  for (const [name, input] of MODELS) {
    it(`${name}: comoving distance, lookback time and age within 1e-9 relative`, () => {
      const c = build(input);
      let worst = 0;
      for (const z of redshifts()) {
        const x = Math.log1p(z);
        worst = Math.max(
          worst,
          relativeError(c.table.comovingAt(x), comovingIntegral(c.expansion, 0, x)),
          relativeError(c.table.lookbackAt(x), lookbackIntegral(c.expansion, 0, x)),
          relativeError(c.table.ageAt(x), ageIntegral(c.expansion, x)),
        );
      }
      expect(worst).toBeLessThan(1e-9);
    });
  }

  it('hands over to direct quadrature beyond the table without a jump', () => {
    const c = build(MODELS[0][1]);
    const x = c.table.xMax;
    expect(relativeError(c.table.comovingAt(x * (1 + 1e-12)), c.table.comovingAt(x))).toBeLessThan(1e-10);
    expect(relativeError(c.table.ageAt(x * (1 + 1e-12)), c.table.ageAt(x))).toBeLessThan(1e-9);
  });

  it('inverts its own interpolant: values round-trip to 1e-14, and ln(1+z) to 1e-11 where it is well conditioned', () => {
    const c = build(MODELS[0][1]);
    for (const z of [1e-5, 0.01, 0.7, 3, 1100, 15000]) {
      const x = Math.log1p(z);
      for (const [at, inv] of [
        [(v: number) => c.table.comovingAt(v), (v: number) => c.table.xForComoving(v)],
        [(v: number) => c.table.lookbackAt(v), (v: number) => c.table.xForLookback(v)],
        [(v: number) => c.table.ageAt(v), (v: number) => c.table.xForAge(v)],
      ] as const) {
        const value = at(x);
        const back = inv(value)!;
        expect(relativeError(at(back), value)).toBeLessThan(1e-14);
        // Near the top of the table the lookback time hardly changes with z (slope 1/E ~ 1e-7),
        // so ln(1+z) is fixed only to ε·value/slope there; below z = 1100 it is well conditioned.
        if (z <= 1100) expect(Math.abs(back - x)).toBeLessThan(1e-11);
      }
    }
  });
});
