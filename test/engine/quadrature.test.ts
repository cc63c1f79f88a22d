/** Gauss–Legendre rules and the adaptive integrator. */
import { describe, expect, it } from 'vitest';
import { gaussLegendreRule, integrateAdaptive, integrateFixed } from '../../shared/src/cosmology/quadrature.js';

describe('quadrature', () => {
  it('the n-point rule integrates polynomials of degree 2n − 1 exactly and its weights sum to 2', () => {
    for (const n of [2, 5, 8, 10]) {
      const rule = gaussLegendreRule(n);
      expect(rule.weights.reduce((a, b) => a + b, 0)).toBeCloseTo(2, 14);
      const deg = 2 * n - 1;
      // ∫_0^1 x^deg dx = 1/(deg+1)
      expect(integrateFixed((x) => x ** deg, 0, 1, rule)).toBeCloseTo(1 / (deg + 1), 14);
    }
  });
  it('the 2-point nodes are ±1/√3 (Abramowitz & Stegun 1964, Table 25.4)', () => {
    const { nodes } = gaussLegendreRule(2);
    expect(nodes[1]).toBeCloseTo(1 / Math.sqrt(3), 15);
  });
  it('the adaptive integrator finds a narrow peak far from the middle of a long interval', () => {
    // ∫_0^700 e^(−(x−3)) dx over [3, 700] plus the rise: a sharply decaying integrand like the distance integral's tail.
    const v = integrateAdaptive((x) => Math.exp(-Math.abs(x - 3) * 10), 0, 700);
    expect(v).toBeCloseTo(0.2 - Math.exp(-30) / 10 - Math.exp(-6970) / 10, 12);
  });
  it('handles endpoint singularities of the square-root kind to high accuracy', () => {
    expect(integrateAdaptive((x) => Math.sqrt(x), 0, 1)).toBeCloseTo(2 / 3, 10);
  });
});
