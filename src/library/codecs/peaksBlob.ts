// Packs peaks as little-endian Float64 quadruples (position, height, prominence, fwhm), sorted by position: the
// one statement of the peak blob layout, which blobPeaks and the state reader read back.
import type { Peak } from '../../spectrum/types.js';

/** Byte offset of each field inside one stored peak, in storage order. */
export const PEAK_FIELD_OFFSETS = { position: 0, height: 8, prominence: 16, fwhm: 24 } as const;

/** Bytes per stored peak: four Float64 values. */
export const PEAK_BYTES = 32;

export function peaksBlob(peaks: readonly Peak[]): Buffer {
  const sorted = [...peaks].sort((a, b) => a.position - b.position);
  const out = Buffer.allocUnsafe(sorted.length * PEAK_BYTES);
  sorted.forEach((p, i) => {
    for (const [field, offset] of Object.entries(PEAK_FIELD_OFFSETS)) {
      out.writeDoubleLE(p[field as keyof typeof PEAK_FIELD_OFFSETS], i * PEAK_BYTES + offset);
    }
  });
  return out;
}
