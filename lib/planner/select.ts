/**
 * Selection of the k-th smallest value (0-based) of the first n entries of an array. Small k uses a bounded
 * max-heap of the k + 1 smallest values seen (one comparison per value for most values); larger k uses Hoare's
 * quickselect with a median-of-three pivot, which reorders the array. Both return the exact k-th smallest.
 */

let heap = new Float64Array(64);

function heapSelect(a: Float64Array, n: number, k: number): number {
  const size = k + 1;
  if (heap.length < size) heap = new Float64Array(2 * size);
  const h = heap;
  for (let i = 0; i < size; i++) {
    let c = i;
    const v = a[i];
    while (c > 0) {
      const parent = (c - 1) >> 1;
      if (h[parent] >= v) break;
      h[c] = h[parent];
      c = parent;
    }
    h[c] = v;
  }
  for (let i = size; i < n; i++) {
    const v = a[i];
    if (v >= h[0]) continue;
    let c = 0;
    for (;;) {
      const l = 2 * c + 1;
      if (l >= size) break;
      const r = l + 1;
      const big = r < size && h[r] > h[l] ? r : l;
      if (h[big] <= v) break;
      h[c] = h[big];
      c = big;
    }
    h[c] = v;
  }
  return h[0];
}

function quickSelect(a: Float64Array, n: number, k: number): number {
  let lo = 0;
  let hi = n - 1;
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    const x = a[lo];
    const y = a[mid];
    const z = a[hi];
    const pivot = x < y ? (y < z ? y : x < z ? z : x) : x < z ? x : y < z ? z : y;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k];
  }
  return a[k];
}

/**
 * The k-th smallest (0-based) of a[0 … n−1]. May reorder the array.
 * @example kthSmallest(new Float64Array([5, 1, 4, 2, 3]), 5, 1) // → 2
 */
export function kthSmallest(a: Float64Array, n: number, k: number): number {
  return k < n >> 3 ? heapSelect(a, n, k) : quickSelect(a, n, k);
}
