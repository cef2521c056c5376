// Packs peaks as little-endian Float64 quadruples (position, height, prominence, fwhm), sorted by position.
import type { Peak } from '../../spectrum/types.js';

export function peaksBlob(peaks: readonly Peak[]): Buffer {
  const sorted = [...peaks].sort((a, b) => a.position - b.position);
  const out = Buffer.allocUnsafe(sorted.length * 32);
  sorted.forEach((p, i) => {
    out.writeDoubleLE(p.position, i * 32);
    out.writeDoubleLE(p.height, i * 32 + 8);
    out.writeDoubleLE(p.prominence, i * 32 + 16);
    out.writeDoubleLE(p.fwhm, i * 32 + 24);
  });
  return out;
}
