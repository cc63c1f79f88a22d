/**
 * Root finding and maximisation on a bracket, for inverting monotonic branches of the
 * background quantities. Brent's method (Brent 1973, "Algorithms for Minimization without
 * Derivatives", ch. 4) and golden-section search (ch. 5, in its simplest form).
 */

/**
 * A root of f in [a, b], where f(a) and f(b) differ in sign; null when they do not.
 * Converges to |Δx| ≤ tol·(1 + |x|).
 */
export function brentRoot(f: (x: number) => number, a: number, b: number, tol = 1e-14): number | null {
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0 || !Number.isFinite(fa) || !Number.isFinite(fb)) return null;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol * (1 + Math.abs(b));
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      if (2 * p < Math.min(3 * xm * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}

/** The x in [a, b] that maximises a unimodal f, by golden-section search to |Δx| ≤ tol. */
export function goldenMaximum(f: (x: number) => number, a: number, b: number, tol = 1e-10): number {
  const r = (Math.sqrt(5) - 1) / 2;
  let x1 = b - r * (b - a);
  let x2 = a + r * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  while (Math.abs(b - a) > tol * (1 + Math.abs(a) + Math.abs(b))) {
    if (f1 < f2) {
      a = x1; x1 = x2; f1 = f2;
      x2 = a + r * (b - a); f2 = f(x2);
    } else {
      b = x2; x2 = x1; f2 = f1;
      x1 = b - r * (b - a); f1 = f(x1);
    }
  }
  return 0.5 * (a + b);
}
