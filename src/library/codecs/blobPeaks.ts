// Unpacks a peaks blob (Float64 quadruples) into Peak objects for display and reports.
import type { Peak } from '../../spectrum/types.js';
import { blobFloat64 } from './blobFloat64.js';

export function blobPeaks(blob: Uint8Array): Peak[] {
  const v = blobFloat64(blob, { what: 'the peaks blob' });
  const peaks: Peak[] = [];
  for (let i = 0; i + 3 < v.length; i += 4) {
    peaks.push({ position: v[i]!, height: v[i + 1]!, prominence: v[i + 2]!, fwhm: v[i + 3]! });
  }
  return peaks;
}
