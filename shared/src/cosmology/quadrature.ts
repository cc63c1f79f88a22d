/**
 * Numerical integration: Gauss–Legendre rules and an adaptive integrator built on them.
 * Nodes and weights are computed (Newton iteration on the Legendre three-term recurrence,
 * Abramowitz & Stegun 1964, §25.4.29 and §22.7.10), not copied from tables.
 */

/** Nodes on [−1, 1] and their weights. */
export interface QuadratureRule {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

/** P_n(x) and its derivative, from the three-term recurrence (Abramowitz & Stegun 1964, §22.7.10). */
function legendre(n: number, x: number): [value: number, derivative: number] {
  let p0 = 1;
  let p1 = x;
  for (let k = 2; k <= n; k++) {
    const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
    p0 = p1;
    p1 = p2;
  }
  return [p1, (n * (x * p1 - p0)) / (x * x - 1)];
}

/** The n-point Gauss–Legendre rule on [−1, 1], exact for polynomials of degree 2n − 1. */
export function gaussLegendreRule(n: number): QuadratureRule {
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    for (let iter = 0; iter < 100; iter++) {
      const [p, dp] = legendre(n, x);
      const dx = p / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    const dp = legendre(n, x)[1];
    const w = 2 / ((1 - x * x) * dp * dp);
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    weights[i] = w;
    weights[n - 1 - i] = w;
  }
  return { nodes, weights };
}

/** Eight-point rule used for the tabulation panels. */
export const GAUSS_LEGENDRE_8: QuadratureRule = gaussLegendreRule(8);
/** Ten-point rule used by the adaptive integrator. */
const GAUSS_LEGENDRE_10: QuadratureRule = gaussLegendreRule(10);

/** ∫_a^b f with one application of a fixed rule. */
export function integrateFixed(f: (x: number) => number, a: number, b: number, rule: QuadratureRule = GAUSS_LEGENDRE_8): number {
  const half = 0.5 * (b - a);
  const mid = 0.5 * (a + b);
  let s = 0;
  for (let i = 0; i < rule.nodes.length; i++) s += rule.weights[i] * f(mid + half * rule.nodes[i]);
  return s * half;
}

export interface AdaptiveOptions {
  /** Relative tolerance on the whole integral (default 1e-12). */
  readonly relTol?: number;
  /** Absolute tolerance (default 0). */
  readonly absTol?: number;
  /** Maximum bisection depth (default 50). */
  readonly maxDepth?: number;
  /** Maximum number of panels, a bound on the work whatever the integrand (default 20 000). */
  readonly maxPanels?: number;
}

/** Panels the interval is split into before adapting, so that a narrow peak is not missed. */
const INITIAL_PANELS = 8;

/**
 * Adaptive ∫_a^b f. The interval is first split into 8 panels; a panel is accepted when its
 * 10-point Gauss–Legendre value agrees with the sum over its two halves to within its share
 * (by width) of the tolerance on the running estimate of the whole integral; otherwise it is
 * halved. The work is bounded by maxDepth and maxPanels. For the smooth integrands of
 * cosmology this converges to near machine precision.
 */
export function integrateAdaptive(f: (x: number) => number, a: number, b: number, options: AdaptiveOptions = {}): number {
  if (a === b) return 0;
  const relTol = options.relTol ?? 1e-12;
  const absTol = options.absTol ?? 0;
  const maxDepth = options.maxDepth ?? 50;
  const maxPanels = options.maxPanels ?? 20_000;
  const totalWidth = Math.abs(b - a);
  const stack: Array<[number, number, number, number]> = [];
  let estimate = 0;
  for (let i = INITIAL_PANELS - 1; i >= 0; i--) {
    const lo = a + ((b - a) * i) / INITIAL_PANELS;
    const hi = i === INITIAL_PANELS - 1 ? b : a + ((b - a) * (i + 1)) / INITIAL_PANELS;
    const value = integrateFixed(f, lo, hi, GAUSS_LEGENDRE_10);
    estimate += value;
    stack.push([lo, hi, value, 0]);
  }
  let panels = INITIAL_PANELS;
  let sum = 0;
  while (stack.length) {
    const [lo, hi, value, depth] = stack.pop()!;
    const mid = 0.5 * (lo + hi);
    const left = integrateFixed(f, lo, mid, GAUSS_LEGENDRE_10);
    const right = integrateFixed(f, mid, hi, GAUSS_LEGENDRE_10);
    const refined = left + right;
    const share = (Math.max(absTol, relTol * Math.abs(estimate)) * Math.abs(hi - lo)) / totalWidth;
    if (Math.abs(refined - value) <= share || depth >= maxDepth || panels >= maxPanels) {
      sum += refined;
    } else {
      estimate += refined - value;
      panels++;
      stack.push([mid, hi, right, depth + 1], [lo, mid, left, depth + 1]);
    }
  }
  return sum;
}
