// The permutation that sorts a flat peak list by position (ties by entry row), fast enough for millions of peaks:
// a stable LSD radix sort on positions quantised to 1e-5 cm⁻¹, then an insertion pass that restores exact order
// among positions closer than the quantum.

export interface PeakOrderOptions {
  /** Quantisation of positions for the radix passes, cm⁻¹.
   * @default 1e-5 */
  quantum?: number;
}

export function peakOrder(position: Float64Array, options: PeakOrderOptions = {}): Uint32Array {
  const n = position.length;
  const scale = 1 / (options.quantum ?? 1e-5);
  let order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const keys = new Uint32Array(n);
  let radixable = true;
  for (let i = 0; i < n; i++) {
    const q = Math.round(position[i]! * scale);
    if (!(q >= 0 && q <= 0xffffffff)) {
      radixable = false;
      break;
    }
    keys[i] = q;
  }
  if (!radixable) {
    // Negative, huge or NaN positions: a comparison sort handles what the quantised keys cannot.
    return order.sort((a, b) => position[a]! - position[b]! || a - b);
  }
  // Three stable counting passes of 11, 11 and 10 bits cover the 32-bit keys; equal keys keep row order.
  let next = new Uint32Array(n);
  const counts = new Uint32Array(2048);
  for (const [shift, bits] of [
    [0, 11],
    [11, 11],
    [22, 10],
  ] as const) {
    const mask = (1 << bits) - 1;
    counts.fill(0);
    for (let i = 0; i < n; i++) counts[(keys[order[i]!]! >>> shift) & mask]!++;
    let sum = 0;
    for (let b = 0; b <= mask; b++) {
      const c = counts[b]!;
      counts[b] = sum;
      sum += c;
    }
    for (let i = 0; i < n; i++) {
      const j = order[i]!;
      next[counts[(keys[j]! >>> shift) & mask]!++] = j;
    }
    [order, next] = [next, order];
  }
  // Positions within one quantum of each other may still be out of exact order: fix them locally.
  for (let i = 1; i < n; i++) {
    const j = order[i]!;
    const p = position[j]!;
    let k = i - 1;
    while (k >= 0 && (position[order[k]!]! > p || (position[order[k]!]! === p && order[k]! > j))) {
      order[k + 1] = order[k]!;
      k--;
    }
    order[k + 1] = j;
  }
  return order;
}
