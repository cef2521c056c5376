// The smallest and largest finite value of an array (NaN and ±Infinity skipped), as the readers' unit checks use it.

/** `{ min: Infinity, max: -Infinity }` when no value is finite. */
export function finiteRange(values: ArrayLike<number>): { min: number; max: number } {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!Number.isFinite(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}
