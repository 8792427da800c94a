/** Options for the bracketing root finders. */
export interface RootOptions {
  /** Absolute tolerance on x; 1e-9 when omitted. */
  tolerance?: number;
  /** Hard cap on iterations; 200 when omitted. */
  maxIterations?: number;
}

/**
 * Finds x in [lo, hi] with f(x) = 0 by Brent's method (inverse quadratic / secant steps guarded by bisection).
 * f(lo) and f(hi) must have opposite signs or one of them be zero; otherwise a RangeError is thrown.
 * Always terminates within `maxIterations`; the bracket then still contains the root.
 * @example brentRoot((x) => x * x - 2, 0, 2) // 1.41421356...
 */
export function brentRoot(f: (x: number) => number, lo: number, hi: number, options: RootOptions = {}): number {
  const tol = options.tolerance ?? 1e-9;
  const maxIterations = options.maxIterations ?? 200;
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0 || !Number.isFinite(fa) || !Number.isFinite(fb)) {
    throw new RangeError('brentRoot: the interval does not bracket a root');
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < maxIterations; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}

/**
 * Plain bisection on a bracketing interval, for callers that want the simplest guaranteed method.
 * @example bisectRoot((x) => x - 0.25, 0, 1) // 0.25
 */
export function bisectRoot(f: (x: number) => number, lo: number, hi: number, options: RootOptions = {}): number {
  const tol = options.tolerance ?? 1e-9;
  const maxIterations = options.maxIterations ?? 200;
  let a = lo;
  let b = hi;
  let fa = f(a);
  const fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0 || !Number.isFinite(fa) || !Number.isFinite(fb)) {
    throw new RangeError('bisectRoot: the interval does not bracket a root');
  }
  for (let i = 0; i < maxIterations && b - a > tol; i++) {
    const mid = 0.5 * (a + b);
    const fm = f(mid);
    if (fm === 0) return mid;
    if (fa * fm < 0) b = mid;
    else {
      a = mid;
      fa = fm;
    }
  }
  return 0.5 * (a + b);
}
