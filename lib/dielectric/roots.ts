/**
 * Bracketed root finding and minimisation on a scalar function of one variable.
 */

/**
 * Brent's method (Brent 1973, "zeroin"): a root of fn in [a, b] where fn(a) and fn(b) have opposite signs
 * (or one is zero), to an absolute tolerance `tol` in x.
 * @example brentRoot((x) => x * x - 2, 0, 2, 1e-12) // → 1.41421356237
 */
export function brentRoot(fn: (x: number) => number, a: number, b: number, tol: number, fa = fn(a), fb = fn(b)): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
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
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < (min1 < min2 ? min1 : min2)) {
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
    fb = fn(b);
  }
  return b;
}

/**
 * Golden-section search for the minimum of fn on [a, b] to absolute tolerance `tol` in x.
 * Returns the abscissa and value of the best point found.
 * @example goldenMin((x) => (x - 1) ** 2, 0, 3, 1e-10) // → { x: 1, f: 0 }
 */
export function goldenMin(fn: (x: number) => number, a: number, b: number, tol: number): { x: number; f: number } {
  const r = (Math.sqrt(5) - 1) / 2;
  let x1 = b - r * (b - a);
  let x2 = a + r * (b - a);
  let f1 = fn(x1);
  let f2 = fn(x2);
  while (b - a > tol) {
    if (f1 < f2) {
      b = x2; x2 = x1; f2 = f1;
      x1 = b - r * (b - a);
      f1 = fn(x1);
    } else {
      a = x1; x1 = x2; f1 = f2;
      x2 = a + r * (b - a);
      f2 = fn(x2);
    }
    if (f1 < 0 || f2 < 0) break;
  }
  return f1 < f2 ? { x: x1, f: f1 } : { x: x2, f: f2 };
}
