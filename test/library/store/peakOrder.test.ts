// The radix permutation of the peak index equals a plain comparison sort (position, then row) on seeded data.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/demo/seededRandom.js';
import { peakOrder } from '../../../src/library/store/peakOrder.js';

function reference(position: Float64Array): number[] {
  return Array.from(position.keys()).sort((a, b) => position[a]! - position[b]! || a - b);
}

describe('peakOrder', () => {
  it('matches a comparison sort on random positions, with exact ties and near-ties below the quantum', () => {
    const rng = seededRandom(7);
    const n = 20_000;
    const position = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const r = rng.uniform();
      // A third exact repeats of a few values, a third within 1e-7 cm⁻¹ of them, a third anywhere on the grid.
      position[i] =
        r < 0.33 ? 1652 : r < 0.66 ? 1652 + (rng.uniform() - 0.5) * 1e-7 : 600 + 3400 * rng.uniform();
    }
    expect(Array.from(peakOrder(position))).toEqual(reference(position));
  });

  it('falls back to a comparison sort for positions the radix keys cannot hold', () => {
    const position = Float64Array.from([5, -1, 1e9, 5, 0]);
    expect(Array.from(peakOrder(position))).toEqual([1, 4, 0, 3, 2]);
  });

  it('handles an empty list and leaves the input untouched', () => {
    expect(peakOrder(new Float64Array(0)).length).toBe(0);
    const p = Float64Array.from([3, 1, 2]);
    expect(Array.from(peakOrder(p))).toEqual([1, 2, 0]);
    expect(Array.from(p)).toEqual([3, 1, 2]);
  });
});
