// The in-browser matcher's binary matrix: int16 per row with a float32 scale, NaN kept, correlations preserved.
import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { BandshelfError } from '../../src/error.js';
import { decodeSearchMatrix } from '../../src/site/decodeSearchMatrix.js';
import { encodeSearchMatrix } from '../../src/site/encodeSearchMatrix.js';

describe('encodeSearchMatrix / decodeSearchMatrix', () => {
  it('hand-checkable: a 2 × 3 matrix', () => {
    const processed = Float32Array.from([1, -0.5, Number.NaN, 0, 0, 0]);
    const bytes = encodeSearchMatrix({ processed, rows: 2, cols: 3 });
    expect(bytes.byteLength).toBe(16 + 2 * 4 + 6 * 2);
    expect(String.fromCharCode(...bytes.subarray(0, 4))).toBe('BSM1');
    const view = new DataView(bytes.buffer);
    expect(view.getFloat32(16, true)).toBeCloseTo(1 / 32767, 12);
    expect(view.getInt16(24, true)).toBe(32767);
    const scale = view.getFloat32(16, true);
    expect(view.getInt16(26, true)).toBe(Math.round(-0.5 / scale));
    expect(view.getInt16(28, true)).toBe(-32768); // not covered
    const back = decodeSearchMatrix(bytes);
    expect(back.rows).toBe(2);
    expect(back.cols).toBe(3);
    expect(back.matrix[0]).toBeCloseTo(1, 6);
    expect(back.matrix[1]).toBeCloseTo(-0.5, 4);
    expect(Number.isNaN(back.matrix[2])).toBe(true);
    expect(Array.from(back.matrix.subarray(3))).toEqual([0, 0, 0]);
  });

  it('reads the same values from bytes at an odd offset (no aligned Int16Array view there) as at an even one', () => {
    // The hand-checkable matrix above, decoded once in place and once from a copy shifted by one byte.
    const bytes = encodeSearchMatrix({
      processed: Float32Array.from([1, -0.5, Number.NaN, 0.25, 0, -1]),
      rows: 2,
      cols: 3,
    });
    const shifted = new Uint8Array(bytes.byteLength + 1);
    shifted.set(bytes, 1);
    const odd = decodeSearchMatrix(shifted.subarray(1));
    expect(Array.from(odd.matrix)).toEqual(Array.from(decodeSearchMatrix(bytes).matrix));
    expect(odd.matrix[3]).toBeCloseTo(0.25, 4);
  });

  it('keeps every value within half a quantisation step, and Pearson r within 1e-4 (simple-statistics as reference)', () => {
    const rng = seededRandom(42);
    const rows = 20;
    const cols = 1701;
    const processed = new Float32Array(rows * cols);
    for (let i = 0; i < processed.length; i++) processed[i] = 0.02 * rng.normal() + (i % cols) / cols / 50;
    const back = decodeSearchMatrix(encodeSearchMatrix({ processed, rows, cols }));
    for (let r = 0; r < rows; r++) {
      const row = Array.from(processed.subarray(r * cols, (r + 1) * cols));
      const step = Math.max(...row.map(Math.abs)) / 32767;
      const decoded = Array.from(back.matrix.subarray(r * cols, (r + 1) * cols));
      // Half a step, plus the float32 rounding of the decoded product.
      for (let c = 0; c < cols; c++) {
        expect(Math.abs(decoded[c]! - row[c]!)).toBeLessThanOrEqual(
          step * 0.5 * 1.0001 + Math.abs(row[c]!) * 1.2e-7,
        );
      }
      const other = Array.from(processed.subarray(((r + 1) % rows) * cols, (((r + 1) % rows) + 1) * cols));
      // General-purpose reference library: simple-statistics' sampleCorrelation.
      expect(Math.abs(sampleCorrelation(decoded, other) - sampleCorrelation(row, other))).toBeLessThan(1e-4);
    }
  });

  it('refuses what is not a matrix file with BAD_FORMAT', () => {
    expect(() => decodeSearchMatrix(new Uint8Array([1, 2, 3]))).toThrow(BandshelfError);
    const bytes = encodeSearchMatrix({ processed: new Float32Array(4), rows: 2, cols: 2 });
    try {
      decodeSearchMatrix(bytes.subarray(0, bytes.byteLength - 2), { file: 'm.bin' });
      expect.unreachable();
    } catch (error) {
      expect((error as BandshelfError).code).toBe('BAD_FORMAT');
      expect((error as BandshelfError).file).toBe('m.bin');
    }
  });
});
