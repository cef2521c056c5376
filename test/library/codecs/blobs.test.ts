// Blob packing of the stored vectors: Float64 originals exact, Float32 processed with NaN kept, peaks sorted.
import { describe, expect, it } from 'vitest';
import { blobFloat32 } from '../../../src/library/codecs/blobFloat32.js';
import { blobFloat64 } from '../../../src/library/codecs/blobFloat64.js';
import { blobPeaks } from '../../../src/library/codecs/blobPeaks.js';
import { float32Blob } from '../../../src/library/codecs/float32Blob.js';
import { float64Blob } from '../../../src/library/codecs/float64Blob.js';
import { peaksBlob } from '../../../src/library/codecs/peaksBlob.js';

describe('blob packing', () => {
  it('round-trips Float64 exactly, little-endian', () => {
    const v = Float64Array.from([0, -0, 1 / 3, 1e-300, -1.5e300, 4000]);
    const blob = float64Blob(v);
    expect(blob.byteLength).toBe(48);
    // 1.0 is 0x3FF0000000000000 in IEEE 754 binary64 (common practice); byte 7 is the high byte in little-endian.
    expect([...float64Blob(Float64Array.from([1]))]).toEqual([0, 0, 0, 0, 0, 0, 0xf0, 0x3f]);
    expect(Array.from(blobFloat64(blob))).toEqual(Array.from(v));
    // A Buffer slice with an odd byte offset still decodes (no alignment assumption).
    const shifted = Buffer.concat([Buffer.from([9]), blob]).subarray(1);
    expect(Array.from(blobFloat64(shifted))).toEqual(Array.from(v));
  });

  it('stores processed values as Float32 and keeps NaN for "not covered"', () => {
    const v = Float64Array.from([Number.NaN, 0.1, -2.5, Number.NaN]);
    const back = blobFloat32(float32Blob(v));
    expect(Number.isNaN(back[0]!)).toBe(true);
    expect(back[1]).toBe(Math.fround(0.1));
    expect(back[2]).toBe(-2.5);
    expect(Number.isNaN(back[3]!)).toBe(true);
  });

  it('packs peaks sorted by position without changing the input', () => {
    const peaks = [
      { position: 1650.2, height: 1, prominence: 0.9, fwhm: 20 },
      { position: 1080.5, height: 0.4, prominence: 0.3, fwhm: 12 },
    ];
    const back = blobPeaks(peaksBlob(peaks));
    expect(back.map((p) => p.position)).toEqual([1080.5, 1650.2]);
    expect(back[1]).toEqual(peaks[0]);
    expect(peaks[0]!.position).toBe(1650.2);
  });

  it('refuses a blob whose length is not whole values', () => {
    expect(() => blobFloat64(new Uint8Array(7))).toThrow(/7 bytes/);
  });
});
