// Unpacks a peaks blob (the layout peaksBlob writes) into Peak objects for display and reports.
import { BandshelfError } from '../../error.js';
import type { Peak } from '../../spectrum/types.js';
import { PEAK_BYTES, PEAK_FIELD_OFFSETS } from './peaksBlob.js';

export function blobPeaks(blob: Uint8Array): Peak[] {
  if (blob.byteLength % 8 !== 0) {
    throw new BandshelfError('CHECK_FAILED', `the peaks blob has ${blob.byteLength} bytes`);
  }
  const view = new DataView(blob.buffer, blob.byteOffset, blob.byteLength);
  const at = (o: number) => view.getFloat64(o, true);
  const peaks: Peak[] = [];
  for (let o = 0; o + PEAK_BYTES <= blob.byteLength; o += PEAK_BYTES) {
    peaks.push({
      position: at(o + PEAK_FIELD_OFFSETS.position),
      height: at(o + PEAK_FIELD_OFFSETS.height),
      prominence: at(o + PEAK_FIELD_OFFSETS.prominence),
      fwhm: at(o + PEAK_FIELD_OFFSETS.fwhm),
    });
  }
  return peaks;
}
