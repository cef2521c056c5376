// Band-position search: entries with stored peaks near the given positions, by binary search over the band index.
import { BandshelfError } from '../error.js';
import { bandStrength } from './bandStrength.js';
import {
  BAND_TOLERANCE_CM1,
  type BandHit,
  type BandIndex,
  type BandMatch,
  type BandQuery,
  type BandStrength,
} from './types.js';

export interface SearchBandsOptions {
  /**
   * A stored peak matches a query band when |peak − band| ≤ tolerance, cm⁻¹.
   * @default BAND_TOLERANCE_CM1 (4)
   */
  tolerance?: number;
  /**
   * Keep only entries that match every query band.
   * @default false
   */
  requireAll?: boolean;
  /**
   * How many hits to return.
   * @default 20
   */
  top?: number;
}

const STRENGTH_RANK: Record<BandStrength, number> = { w: 0, m: 1, s: 2 };

/**
 * Per-index scratch buffers, so a query costs the peaks it visits and not a pass over every entry. Every query
 * leaves them as it found them (zeros, slots −1).
 */
interface Scratch {
  /** Best peak score of the entry for the band being scanned; 0 = none yet. */
  bandBest: Float32Array;
  /** 4 × bands matched + summed band scores / band count: the ranking key, 0 = untouched. */
  key: Float64Array;
  touched: Int32Array;
  /** Entries met in the band being scanned. */
  bandRows: Int32Array;
  /** Slot of the entry among the returned hits, −1 if not returned. */
  slot: Int32Array;
}

const scratchOf = new WeakMap<BandIndex, Scratch>();

function scratchFor(index: BandIndex): Scratch {
  const rows = index.entries.length;
  let scratch = scratchOf.get(index);
  if (scratch === undefined || scratch.key.length !== rows) {
    scratch = {
      bandBest: new Float32Array(rows),
      key: new Float64Array(rows),
      touched: new Int32Array(rows),
      bandRows: new Int32Array(rows),
      slot: new Int32Array(rows).fill(-1),
    };
    scratchOf.set(index, scratch);
  }
  return scratch;
}

/** Position agreement × strength agreement of one stored peak for one query band (`wanted` −1: no strength). */
function peakScore(error: number, relative: number, wanted: number, inverse: number): number {
  const s = 1 - Math.abs(error) * inverse;
  if (wanted < 0) return s;
  const have = STRENGTH_RANK[bandStrength(relative)];
  return s * (1 - 0.25 * Math.abs(have - wanted));
}

/** First index whose position is > value. */
function upperBound(sorted: Float64Array, value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! <= value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** First index whose position is ≥ value. */
function lowerBound(sorted: Float64Array, value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * Ranks entries by the number of query bands they have a peak for, then by `score`: per query band
 * (1 − |error| / (2 × tolerance)) × strength agreement (1 same class, 0.75 adjacent, 0.5 strong vs weak; 1 when the
 * band has no strength), averaged over all query bands; ties go to the smaller mean |error|, then the id.
 * The index itself is not changed; reusable scratch buffers live beside it in a WeakMap.
 */
export function searchBands(
  index: BandIndex,
  bands: readonly BandQuery[],
  options: SearchBandsOptions = {},
): BandHit[] {
  const tolerance = options.tolerance ?? BAND_TOLERANCE_CM1;
  const requireAll = options.requireAll ?? false;
  const top = options.top ?? 20;
  checkQuery(bands, tolerance, top);
  const windows: Windows = { from: new Int32Array(bands.length), to: new Int32Array(bands.length) };
  for (let j = 0; j < bands.length; j++) {
    windows.from[j] = lowerBound(index.position, bands[j]!.position - tolerance);
    windows.to[j] = upperBound(index.position, bands[j]!.position + tolerance);
  }
  const scratch = scratchFor(index);
  const selected = entriesWorthScoring(index, windows, requireAll ? bands.length : 0, top);
  const touched = accumulateKeys(index, bands, windows, selected, scratch, 1 / (2 * tolerance));
  const slots = topKeys(scratch, touched, top, requireAll ? 4 * bands.length : 0);
  return exactHits(index, bands, windows, slots, scratch, 1 / (2 * tolerance));
}

/** Each query band's range of peak indices in the sorted index: [from, to). */
interface Windows {
  from: Int32Array;
  to: Int32Array;
}

function checkQuery(bands: readonly BandQuery[], tolerance: number, top: number): void {
  if (!(Number.isFinite(tolerance) && tolerance > 0)) {
    throw new BandshelfError(
      'BAD_OPTION',
      `the tolerance must be a positive number of cm⁻¹, not ${tolerance}`,
      {
        field: 'tolerance',
      },
    );
  }
  if (!(Number.isInteger(top) && top > 0)) {
    throw new BandshelfError('BAD_OPTION', `top must be a positive whole number, not ${top}`, {
      field: 'top',
    });
  }
  if (bands.length === 0)
    throw new BandshelfError('BAD_OPTION', 'give at least one band position', { field: 'bands' });
  for (const band of bands) {
    if (!Number.isFinite(band.position)) {
      throw new BandshelfError('BAD_OPTION', `a band position must be a number, not ${band.position}`, {
        field: 'bands',
      });
    }
  }
}

function popcount(v: number): number {
  let c = v - ((v >>> 1) & 0x55555555);
  c = (c & 0x33333333) + ((c >>> 2) & 0x33333333);
  return (Math.imul((c + (c >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24) & 0xff;
}

/**
 * Stage 1: one bit per entry and band (a few kB, cache-resident), counted in bit-sliced planes, so counting matched
 * bands costs little. Returns the bit set of entries whose matched-band count can still reach the top `top`
 * (`required` > 0: exactly those matching that many bands).
 */
function entriesWorthScoring(index: BandIndex, windows: Windows, required: number, top: number): Int32Array {
  const { entry } = index;
  const n = windows.from.length;
  const words = (index.entries.length + 31) >>> 5;
  const bits = new Uint32Array(words * n);
  for (let j = 0; j < n; j++) {
    const base = j * words;
    for (let k = windows.from[j]!; k < windows.to[j]!; k++) {
      const row = entry[k]!;
      bits[base + (row >>> 5)]! |= 1 << (row & 31);
    }
  }
  // Bit-sliced counters: plane l holds bit l of each entry's matched-band count.
  let levels = 1;
  while (1 << levels <= n) levels++;
  const planes = new Int32Array(words * levels);
  for (let j = 0; j < n; j++) {
    for (let w = 0; w < words; w++) {
      let carry = bits[j * words + w]!;
      for (let l = 0; l < levels && carry !== 0; l++) {
        const at = l * words + w;
        const t = planes[at]! & carry;
        planes[at]! ^= carry;
        carry = t;
      }
    }
  }
  const atLeast = (m: number, w: number): number => {
    // Entries whose count ≥ m: compare the planes with m from the top bit down.
    let greater = 0;
    let equal = -1;
    for (let l = levels - 1; l >= 0; l--) {
      const plane = planes[l * words + w]!;
      if ((m >>> l) & 1) equal &= plane;
      else {
        greater |= equal & plane;
        equal &= ~plane;
      }
    }
    return greater | equal;
  };
  // The lowest band count that still has to be scored: the top-k can only come from counts ≥ it.
  let floor = required > 0 ? required : 1;
  if (required === 0) {
    for (let m = n; m >= 1; m--) {
      let have = 0;
      for (let w = 0; w < words; w++) have += popcount(atLeast(m, w));
      if (have >= top) {
        floor = m;
        break;
      }
    }
  }
  const selected = new Int32Array(words);
  for (let w = 0; w < words; w++) selected[w] = atLeast(floor, w);
  return selected;
}

/**
 * Stage 2: ranking keys for the selected entries only, one sweep per band keeping each entry's best peak; the few
 * selected entries of the window are then added to their keys once and cleared. Returns how many entries of
 * `scratch.touched` now hold a key.
 */
function accumulateKeys(
  index: BandIndex,
  bands: readonly BandQuery[],
  windows: Windows,
  selected: Int32Array,
  scratch: Scratch,
  inverse: number,
): number {
  const { position, entry, relative } = index;
  const { bandBest, key, touched, bandRows } = scratch;
  const perBand = 1 / bands.length;
  let touchedCount = 0;
  for (let j = 0; j < bands.length; j++) {
    const band = bands[j]!;
    const wanted = band.strength === undefined ? -1 : STRENGTH_RANK[band.strength];
    let inBand = 0;
    for (let k = windows.from[j]!; k < windows.to[j]!; k++) {
      const row = entry[k]!;
      if ((selected[row >>> 5]! & (1 << (row & 31))) === 0) continue;
      const s = peakScore(position[k]! - band.position, relative[k]!, wanted, inverse);
      const before = bandBest[row]!;
      if (before === 0) bandRows[inBand++] = row;
      if (s > before) bandBest[row] = s;
    }
    for (let i = 0; i < inBand; i++) {
      const row = bandRows[i]!;
      if (key[row] === 0) touched[touchedCount++] = row;
      key[row] = key[row]! + 4 + bandBest[row]! * perBand;
      bandBest[row] = 0;
    }
  }
  return touchedCount;
}

/** Bounded top-k by key (bands matched dominate: scores add at most 1); clears the keys it reads. */
function topKeys(scratch: Scratch, touchedCount: number, top: number, needed: number): Int32Array {
  const { key, touched } = scratch;
  const slotRow = new Int32Array(top);
  const slotKey = new Float64Array(top);
  let filled = 0;
  for (let i = 0; i < touchedCount; i++) {
    const row = touched[i]!;
    const value = key[row]!;
    key[row] = 0;
    if (value < needed) continue;
    if (filled === top && value <= slotKey[filled - 1]!) continue;
    let at = filled < top ? filled++ : filled - 1;
    // Equal keys keep the earlier row (ids are sorted), so ranking is deterministic.
    while (at > 0 && slotKey[at - 1]! < value) {
      slotKey[at] = slotKey[at - 1]!;
      slotRow[at] = slotRow[at - 1]!;
      at--;
    }
    slotKey[at] = value;
    slotRow[at] = row;
  }
  return slotRow.subarray(0, filled);
}

/** Second pass over the same windows for the returned entries only: exact scores and the matched peaks. */
function exactHits(
  index: BandIndex,
  bands: readonly BandQuery[],
  windows: Windows,
  slotRow: Int32Array,
  scratch: Scratch,
  inverse: number,
): BandHit[] {
  const { position, entry, relative } = index;
  const { slot } = scratch;
  const filled = slotRow.length;
  const perBand = 1 / bands.length;
  const returned = new Int32Array((index.entries.length + 31) >>> 5);
  for (let i = 0; i < filled; i++) {
    const row = slotRow[i]!;
    slot[row] = i;
    returned[row >>> 5]! |= 1 << (row & 31);
  }
  const matchesOf: BandMatch[][] = Array.from({ length: filled }, () => []);
  const scoreOf = new Float64Array(filled);
  const bestK = new Int32Array(filled);
  const bestS = new Float64Array(filled);
  for (let j = 0; j < bands.length && filled > 0; j++) {
    const band = bands[j]!;
    const wanted = band.strength === undefined ? -1 : STRENGTH_RANK[band.strength];
    bestK.fill(-1);
    bestS.fill(0);
    for (let k = windows.from[j]!; k < windows.to[j]!; k++) {
      const row = entry[k]!;
      if ((returned[row >>> 5]! & (1 << (row & 31))) === 0) continue;
      const at = slot[row]!;
      const s = peakScore(position[k]! - band.position, relative[k]!, wanted, inverse);
      if (s > bestS[at]!) {
        bestS[at] = s;
        bestK[at] = k;
      }
    }
    for (let at = 0; at < filled; at++) {
      const k = bestK[at]!;
      if (k < 0) continue;
      scoreOf[at] = scoreOf[at]! + bestS[at]! * perBand;
      matchesOf[at]!.push({
        query: j,
        position: position[k]!,
        error: position[k]! - band.position,
        relative: relative[k]!,
        strength: bandStrength(relative[k]!),
      });
    }
  }
  for (let i = 0; i < filled; i++) slot[slotRow[i]!] = -1;
  const hits = Array.from(slotRow, (row, i): BandHit => {
    const e = index.entries[row]!;
    const matches = matchesOf[i]!;
    const meanError = matches.reduce((sum, m) => sum + Math.abs(m.error), 0) / Math.max(1, matches.length);
    return {
      row,
      id: e.id,
      revision: e.revision,
      name: e.name,
      class: e.class,
      matched: matches.length,
      score: scoreOf[i]!,
      meanError,
      matches,
    };
  });
  // Equal keys: smaller mean error first, then id (the bounded insert above kept row order only).
  hits.sort(
    (a, b) =>
      b.matched - a.matched ||
      b.score - a.score ||
      a.meanError - b.meanError ||
      (a.id < b.id ? -1 : a.id > b.id ? 1 : 0),
  );
  return hits;
}
