// Benjamini–Hochberg adjusted p-values (q-values) controlling the false-discovery rate over many tests.

/**
 * q_(i) = min over j ≥ i of p_(j) · m / j, capped at 1, returned in the input order (Benjamini & Hochberg,
 * J. R. Stat. Soc. B 57:289, 1995). Rejecting every test with q ≤ α controls the false-discovery rate at α for
 * independent or positively dependent tests. NaN p-values (untested points) stay NaN and do not count in m.
 */
export function benjaminiHochberg(pValues: ArrayLike<number>): Float64Array {
  const q = new Float64Array(pValues.length).fill(Number.NaN);
  const order: number[] = [];
  for (let i = 0; i < pValues.length; i++) if (!Number.isNaN(pValues[i]!)) order.push(i);
  order.sort((x, y) => pValues[x]! - pValues[y]!);
  const m = order.length;
  let running = 1;
  for (let rank = m; rank >= 1; rank--) {
    const index = order[rank - 1]!;
    running = Math.min(running, (pValues[index]! * m) / rank);
    q[index] = running;
  }
  return q;
}
