// Reads the search box as a band-position query when every word is a band (`1652`, `1652:s 1545:m`), as
// `bandshelf bands` reads its arguments; any other word makes it a text search (null).
import { parseBandQuery } from '../../match/parseBandQuery.js';
import type { BandQuery } from '../../match/types.js';

export interface BandQueryOfOptions {
  /** Most bands read; a longer list is a text search.
   * @default 20 */
  maxBands?: number;
}

export function bandQueryOf(text: string, options: BandQueryOfOptions = {}): BandQuery[] | null {
  const words = text
    .split(/[\s,;]+/)
    .map((w) => w.trim())
    .filter((w) => w !== '');
  if (words.length === 0 || words.length > (options.maxBands ?? 20)) return null;
  const bands: BandQuery[] = [];
  for (const word of words) {
    try {
      bands.push(parseBandQuery(word));
    } catch {
      return null;
    }
  }
  return bands;
}
