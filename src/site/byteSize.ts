// A file size for a download link: B, KB or MB (powers of 1024) to three significant digits.
import { formatNumber } from './formatNumber.js';

export function byteSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${formatNumber(bytes / 1024, { significant: 3 })} KB`;
  return `${formatNumber(bytes / (1024 * 1024), { significant: 3 })} MB`;
}
