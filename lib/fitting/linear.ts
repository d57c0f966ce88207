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
