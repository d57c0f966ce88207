/**
 * Small dense helpers for the 1- and 2-parameter fits: normal matrix, its inverse and its
 * conditioning. Matrices are row-major number[][].
 */

/**
 * JᵀJ for a Jacobian given as rows (one row per point, one column per parameter).
 * @example normalMatrix([[1, 0], [0, 2]]) // [[1, 0], [0, 4]]
 */
export function normalMatrix(jacobian: number[][], p: number): number[][] {
  const a = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (const row of jacobian) {
    for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) a[i][j] += row[i] * row[j];
  }
  return a;
}

/**
 * Inverse of a symmetric 1×1 or 2×2 matrix, or null when it is singular (a zero pivot or a
 * correlation of exactly ±1).
 * @example invertSymmetric([[4]]) // [[0.25]]
 */
export function invertSymmetric(a: number[][]): number[][] | null {
  if (a.length === 1) return a[0][0] > 0 ? [[1 / a[0][0]]] : null;
  const det = a[0][0] * a[1][1] - a[0][1] * a[1][0];
  if (!(a[0][0] > 0 && a[1][1] > 0 && det > 0)) return null;
  return [
    [a[1][1] / det, -a[0][1] / det],
    [-a[1][0] / det, a[0][0] / det],
  ];
}

/**
 * Reciprocal condition number of a symmetric positive matrix after scaling it to unit
 * diagonal (1 = orthogonal parameters, 0 = one parameter is a multiple of the other).
 * For 2×2 it is (1 − |ρ|)/(1 + |ρ|) with ρ the off-diagonal of the scaled matrix.
 * @example scaledReciprocalCondition([[1, 0.5], [0.5, 1]]) // 1/3
 */
export function scaledReciprocalCondition(a: number[][]): number {
  if (a.length === 1) return a[0][0] > 0 ? 1 : 0;
  if (!(a[0][0] > 0 && a[1][1] > 0)) return 0;
  const rho = Math.min(1, Math.abs(a[0][1]) / Math.sqrt(a[0][0] * a[1][1]));
  return (1 - rho) / (1 + rho);
}

/**
 * Inverse of a small square matrix by Gauss–Jordan elimination with partial pivoting, or null when a pivot falls
 * below 1e-13 of the largest diagonal entry (numerically singular).
 * @example invertMatrix([[2, 0], [0, 4]]) // [[0.5, 0], [0, 0.25]]
 */
export function invertMatrix(a: number[][]): number[][] | null {
  const n = a.length;
  const m = a.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  const scale = Math.max(...a.map((row, i) => Math.abs(row[i])), 0);
  if (!(scale > 0)) return null;
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[piv][c])) piv = r;
    if (!(Math.abs(m[piv][c]) > 1e-13 * scale)) return null;
    [m[c], m[piv]] = [m[piv], m[c]];
    const d = m[c][c];
    for (let k = 0; k < 2 * n; k++) m[c][k] /= d;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = m[r][c];
      if (f !== 0) for (let k = 0; k < 2 * n; k++) m[r][k] -= f * m[c][k];
    }
  }
  return m.map((row) => row.slice(n));
}
