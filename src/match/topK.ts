// The k best of a score array by partial selection (a bounded heap), without sorting the whole array.

export interface TopKOptions {
  /**
   * How many indices to return (fewer when fewer values are finite).
   * @default 10
   */
  k?: number;
  /**
   * `desc`: largest first (correlations); `asc`: smallest first (distances).
   * @default 'desc'
   */
  order?: 'desc' | 'asc';
}

/**
 * Indices of the k best finite values, best first; NaN and ±Infinity never rank. Ties go to the lower index,
 * so the result equals a stable full sort's first k. O(n log k), and close to O(n) when most values lose to the
 * heap's weakest member at a single comparison.
 */
export function topK(values: ArrayLike<number>, options: TopKOptions = {}): Uint32Array {
  const k = Math.max(0, Math.floor(options.k ?? 10));
  const sign = (options.order ?? 'desc') === 'desc' ? 1 : -1;
  if (k === 0) return new Uint32Array(0);
  // A min-heap on (sign·value, −index): its root is the weakest kept member.
  const heapValue = new Float64Array(k);
  const heapIndex = new Uint32Array(k);
  let size = 0;
  // a is weaker than b: a smaller value, or an equal value at a later index.
  const weaker = (va: number, ia: number, vb: number, ib: number) => va < vb || (va === vb && ia > ib);
  const siftDown = (start: number) => {
    let i = start;
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let m = i;
      if (l < size && weaker(heapValue[l]!, heapIndex[l]!, heapValue[m]!, heapIndex[m]!)) m = l;
      if (r < size && weaker(heapValue[r]!, heapIndex[r]!, heapValue[m]!, heapIndex[m]!)) m = r;
      if (m === i) return;
      const tv = heapValue[i]!;
      const ti = heapIndex[i]!;
      heapValue[i] = heapValue[m]!;
      heapIndex[i] = heapIndex[m]!;
      heapValue[m] = tv;
      heapIndex[m] = ti;
      i = m;
    }
  };
  const n = values.length;
  for (let idx = 0; idx < n; idx++) {
    const raw = values[idx]!;
    if (!Number.isFinite(raw)) continue;
    const v = sign * raw;
    if (size < k) {
      // Sift up.
      let i = size++;
      while (i > 0) {
        const p = (i - 1) >> 1;
        if (!weaker(v, idx, heapValue[p]!, heapIndex[p]!)) break;
        heapValue[i] = heapValue[p]!;
        heapIndex[i] = heapIndex[p]!;
        i = p;
      }
      heapValue[i] = v;
      heapIndex[i] = idx;
    } else if (weaker(heapValue[0]!, heapIndex[0]!, v, idx)) {
      heapValue[0] = v;
      heapIndex[0] = idx;
      siftDown(0);
    }
  }
  // Pop weakest first into the back of the result.
  const out = new Uint32Array(size);
  for (let j = size - 1; j >= 0; j--) {
    out[j] = heapIndex[0]!;
    size--;
    if (size > 0) {
      heapValue[0] = heapValue[size]!;
      heapIndex[0] = heapIndex[size]!;
      siftDown(0);
    }
  }
  return out;
}
