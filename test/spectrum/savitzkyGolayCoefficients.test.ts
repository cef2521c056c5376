// Tests of the Savitzky–Golay weights against the published convolution tables and a direct least-squares fit.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { savitzkyGolayCoefficients } from '../../src/spectrum/savitzkyGolayCoefficients.js';

/** Published integers divided by the normaliser, as the tables print them. */
const table = (integers: number[], normaliser: number) => integers.map((v) => v / normaliser);

function expectClose(actual: Float64Array, expected: number[], tolerance = 1e-12): void {
  expect(actual.length).toBe(expected.length);
  for (let i = 0; i < expected.length; i++)
    expect(actual[i]).toBeCloseTo(expected[i]!, -Math.log10(tolerance));
}

/**
 * An independent route to the same weights: solve the normal equations of a Vandermonde least-squares fit
 * (Gaussian elimination with partial pivoting) and differentiate the fitted polynomial at `at`.
 */
function viaNormalEquations(window: number, order: number, derivative: number, at: number): number[] {
  const m = (window - 1) / 2;
  const p = order + 1;
  const ata = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let i = -m; i <= m; i++) {
    for (let r = 0; r < p; r++) for (let c = 0; c < p; c++) ata[r]![c]! += i ** (r + c);
  }
  // g_k = d^derivative/du^derivative of u^k at `at`.
  const g = new Array<number>(p).fill(0);
  for (let k = derivative; k < p; k++) {
    let falling = 1;
    for (let j = 0; j < derivative; j++) falling *= k - j;
    g[k] = falling * at ** (k - derivative);
  }
  // Solve (AᵀA) z = g; then weight_i = Σ_k z_k i^k (AᵀA is symmetric).
  const aug = ata.map((row, r) => [...row, g[r]!]);
  for (let col = 0; col < p; col++) {
    let pivot = col;
    for (let r = col + 1; r < p; r++) if (Math.abs(aug[r]![col]!) > Math.abs(aug[pivot]![col]!)) pivot = r;
    [aug[col], aug[pivot]] = [aug[pivot]!, aug[col]!];
    for (let r = 0; r < p; r++) {
      if (r === col) continue;
      const f = aug[r]![col]! / aug[col]![col]!;
      for (let c = col; c <= p; c++) aug[r]![c]! -= f * aug[col]![c]!;
    }
  }
  const z = aug.map((row, r) => row[p]! / row[r]!);
  const weights: number[] = [];
  for (let i = -m; i <= m; i++) {
    let w = 0;
    for (let k = 0; k < p; k++) w += z[k]! * i ** k;
    weights.push(w);
  }
  return weights;
}

describe('savitzkyGolayCoefficients', () => {
  // Savitzky & Golay, Anal. Chem. 36:1627 (1964), as corrected by Steinier, Termonia & Deltour,
  // Anal. Chem. 44:1906 (1972): smoothing tables (quadratic/cubic give the same centre weights).
  it('matches the published 5-point quadratic/cubic smoothing weights −3 12 17 12 −3 / 35', () => {
    expectClose(savitzkyGolayCoefficients(5, 2), table([-3, 12, 17, 12, -3], 35));
    expectClose(savitzkyGolayCoefficients(5, 3), table([-3, 12, 17, 12, -3], 35));
  });
  it('matches the published 7-point smoothing weights −2 3 6 7 6 3 −2 / 21', () => {
    expectClose(savitzkyGolayCoefficients(7, 2), table([-2, 3, 6, 7, 6, 3, -2], 21));
  });
  it('matches the published 9-point smoothing weights −21 14 39 54 59 54 39 14 −21 / 231', () => {
    expectClose(savitzkyGolayCoefficients(9, 2), table([-21, 14, 39, 54, 59, 54, 39, 14, -21], 231));
  });
  it('matches the published 11-point smoothing weights −36 9 44 69 84 89 84 69 44 9 −36 / 429', () => {
    expectClose(savitzkyGolayCoefficients(11, 3), table([-36, 9, 44, 69, 84, 89, 84, 69, 44, 9, -36], 429));
  });

  // Same source; these derivative rows are from memory (tagged [memory] in the shared reference list).
  it('matches the quadratic first-derivative weights −2 −1 0 1 2 / 10 and −3 … 3 / 28 (from memory)', () => {
    expectClose(savitzkyGolayCoefficients(5, 2, 1), table([-2, -1, 0, 1, 2], 10));
    expectClose(savitzkyGolayCoefficients(7, 2, 1), table([-3, -2, -1, 0, 1, 2, 3], 28));
  });
  it('matches the cubic 5-point first-derivative weights 1 −8 0 8 −1 / 12 (from memory)', () => {
    expectClose(savitzkyGolayCoefficients(5, 3, 1), table([1, -8, 0, 8, -1], 12));
  });
  it('matches the quadratic 5-point second-derivative weights 2 −1 −2 −1 2 / 7 (from memory)', () => {
    expectClose(savitzkyGolayCoefficients(5, 2, 2), table([2, -1, -2, -1, 2], 7));
  });

  it('agrees with a direct normal-equation least-squares fit for every window, order, derivative and point', () => {
    for (const window of [3, 5, 7, 9, 15, 25]) {
      for (let order = 0; order < Math.min(window, 6); order++) {
        for (let derivative = 0; derivative <= order; derivative++) {
          const m = (window - 1) / 2;
          for (const at of [0, -m, m, 1 - m, 0.5]) {
            const expected = viaNormalEquations(window, order, derivative, at);
            const actual = savitzkyGolayCoefficients(window, order, derivative, { at });
            const scale = Math.max(...expected.map(Math.abs));
            for (let i = 0; i < window; i++)
              expect(Math.abs(actual[i]! - expected[i]!)).toBeLessThan(1e-9 * scale);
          }
        }
      }
    }
  });

  it('meets the invariants: a line is kept, d/dx of x is 1, d²/dx² of x² is 2 (at the centre and the ends)', () => {
    for (const window of [5, 9, 21, 51]) {
      const m = (window - 1) / 2;
      for (const at of [0, -m, m]) {
        const smooth = savitzkyGolayCoefficients(window, 2, 0, { at });
        const first = savitzkyGolayCoefficients(window, 2, 1, { at });
        const second = savitzkyGolayCoefficients(window, 3, 2, { at });
        let line = 0;
        let slope = 0;
        let curvature = 0;
        for (let i = -m; i <= m; i++) {
          line += smooth[i + m]! * (3 + 0.5 * i);
          slope += first[i + m]! * i;
          curvature += second[i + m]! * i * i;
        }
        expect(line).toBeCloseTo(3 + 0.5 * at, 10);
        expect(slope).toBeCloseTo(1, 10);
        expect(curvature).toBeCloseTo(2, 10);
      }
    }
  });

  it('refuses an even window, an order not below the window and a derivative above the order', () => {
    expect(() => savitzkyGolayCoefficients(6, 2)).toThrow(BandshelfError);
    expect(() => savitzkyGolayCoefficients(5, 5)).toThrow(BandshelfError);
    expect(() => savitzkyGolayCoefficients(5, 2, 3)).toThrow(BandshelfError);
    expect(() => savitzkyGolayCoefficients(5, 2, 0, { at: 3 })).toThrow(BandshelfError);
  });
});
