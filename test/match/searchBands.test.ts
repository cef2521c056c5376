// Band-position search on a hand-checkable peak table, and against a brute-force scan on seeded random tables.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { BandshelfError } from '../../src/error.js';
import { buildBandIndex } from '../../src/match/buildBandIndex.js';
import { searchBands } from '../../src/match/searchBands.js';
import type { PeakTable } from '../../src/match/types.js';

function tableOf(entries: Record<string, [number, number][]>): PeakTable {
  const ids = Object.keys(entries).sort();
  const flat: [number, number, number][] = [];
  ids.forEach((id, row) => {
    for (const [p, h] of entries[id]!) flat.push([row, p, h]);
  });
  flat.sort((a, b) => a[1] - b[1]);
  return {
    entries: ids.map((id) => ({ id, revision: 1, name: id.toUpperCase(), class: 'protein' })),
    peaks: {
      entry: Uint32Array.from(flat, (f) => f[0]),
      position: Float64Array.from(flat, (f) => f[1]),
      height: Float64Array.from(flat, (f) => f[2]),
      prominence: Float64Array.from(flat, (f) => f[2]),
    },
  };
}

const small = tableOf({
  a: [
    [1652, 1],
    [1545, 0.6],
    [1240, 0.3],
  ],
  b: [
    [1650, 1],
    [1400, 0.5],
  ],
  c: [
    [1655, 0.2],
    [1546, 1],
    [1241, 0.5],
  ],
  d: [[3000, 1]],
});

describe('searchBands', () => {
  it('ranks by bands matched, then by position agreement (values worked by hand)', () => {
    const index = buildBandIndex(small);
    const hits = searchBands(index, [{ position: 1652 }, { position: 1545 }, { position: 1240 }]);
    expect(hits.map((h) => h.id)).toEqual(['a', 'c', 'b']);
    expect(hits.map((h) => h.matched)).toEqual([3, 3, 1]);
    // score = mean over query bands of 1 − |error| / (2 × 4): a exact; c errors 3, 1, 1; b one band, error 2.
    expect(hits[0]!.score).toBeCloseTo(1, 12);
    expect(hits[1]!.score).toBeCloseTo((0.625 + 0.875 + 0.875) / 3, 12);
    expect(hits[2]!.score).toBeCloseTo(0.75 / 3, 12);
    expect(hits[1]!.meanError).toBeCloseTo(5 / 3, 12);
    expect(hits[1]!.matches.map((m) => m.error).sort()).toEqual([1, 1, 3]);
  });

  it('keeps only full matches with requireAll and respects the tolerance', () => {
    const index = buildBandIndex(small);
    const bands = [{ position: 1652 }, { position: 1545 }, { position: 1240 }];
    expect(searchBands(index, bands, { requireAll: true }).map((h) => h.id)).toEqual(['a', 'c']);
    // At 2 cm⁻¹ tolerance c's 1655 band (3 away) no longer counts.
    const tight = searchBands(index, bands, { tolerance: 2 });
    expect(tight.find((h) => h.id === 'c')!.matched).toBe(2);
  });

  it('uses relative strengths s/m/w when given', () => {
    const index = buildBandIndex(small);
    const hits = searchBands(index, [
      { position: 1652, strength: 's' },
      { position: 1545, strength: 'w' },
      { position: 1240, strength: 'm' },
    ]);
    // a: s=s (1), 0.6 is s vs w (×0.5), 0.3 is m=m → (1 + 0.5 + 1)/3.
    expect(hits[0]!.id).toBe('a');
    expect(hits[0]!.score).toBeCloseTo(2.5 / 3, 12);
    // c: 0.2 is w vs s (0.625 × 0.5), 1.0 is s vs w (0.875 × 0.5), 0.5 is m=m (0.875).
    expect(hits[1]!.score).toBeCloseTo((0.3125 + 0.4375 + 0.875) / 3, 12);
    expect(hits[0]!.matches.map((m) => m.strength)).toEqual(['s', 's', 'm']);
  });

  it('takes the closest of several peaks of one entry in a window and sorts an unsorted table', () => {
    const table = tableOf({ e: [[1000, 1]], f: [[1003, 1]] });
    const unsorted: PeakTable = {
      entries: table.entries,
      peaks: {
        entry: Uint32Array.from([0, 0, 1]),
        position: Float64Array.from([1003.5, 1000.5, 998]),
        height: Float64Array.from([1, 0.5, 1]),
        prominence: Float64Array.from([1, 0.5, 1]),
      },
    };
    const index = buildBandIndex(unsorted);
    expect(Array.from(index.position)).toEqual([998, 1000.5, 1003.5]);
    const hits = searchBands(index, [{ position: 1000 }]);
    expect(hits.map((h) => [h.id, h.matches[0]!.position])).toEqual([
      ['e', 1000.5],
      ['f', 998],
    ]);
    // The input table is left as it was.
    expect(Array.from(unsorted.peaks.position)).toEqual([1003.5, 1000.5, 998]);
  });

  it('agrees with a brute-force scan on seeded random tables', () => {
    const random = seededRandom(77);
    for (let trial = 0; trial < 5; trial++) {
      const spec: Record<string, [number, number][]> = {};
      for (let e = 0; e < 300; e++) {
        spec[`x${String(e).padStart(3, '0')}`] = Array.from({ length: 8 }, () => [
          Math.round((1000 + random.uniform() * 200) * 10) / 10,
          0.05 + random.uniform(),
        ]);
      }
      const table = tableOf(spec);
      const index = buildBandIndex(table);
      const bands = [{ position: 1050 }, { position: 1100, strength: 's' as const }, { position: 1170 }];
      const tol = 3;
      const hits = searchBands(index, bands, { tolerance: tol, top: 300 });
      // Brute force: for every entry and band, the best peak score by exhaustive search.
      const expected = table.entries
        .map((entry, row) => {
          const peaks: [number, number][] = spec[entry.id]!;
          const top = Math.max(...peaks.map((p) => p[1]));
          let matched = 0;
          let total = 0;
          for (const band of bands) {
            let best = -1;
            for (const [p, h] of peaks) {
              if (Math.abs(p - band.position) > tol) continue;
              let s = 1 - Math.abs(p - band.position) / (2 * tol);
              if (band.strength) {
                const r = h / top;
                const have = r >= 0.6 ? 2 : r >= 0.25 ? 1 : 0;
                s *= 1 - 0.25 * Math.abs(have - 2);
              }
              best = Math.max(best, s);
            }
            if (best >= 0) {
              matched++;
              total += best;
            }
          }
          return { row, id: entry.id, matched, score: total / bands.length };
        })
        .filter((e) => e.matched > 0);
      expect(hits.length).toBe(expected.length);
      const byId = new Map(hits.map((h) => [h.id, h]));
      for (const e of expected) {
        expect(byId.get(e.id)!.matched).toBe(e.matched);
        expect(byId.get(e.id)!.score).toBeCloseTo(e.score, 12);
      }
      // A short top list is cut from the best tiers first: it must equal the head of the full ranking.
      const ranked = [...expected].sort((a, b) => b.matched - a.matched || b.score - a.score);
      for (const top of [1, 5, 40]) {
        const short = searchBands(index, bands, { tolerance: tol, top });
        expect(short.map((h) => [h.matched, h.score.toFixed(9)])).toEqual(
          ranked.slice(0, top).map((e) => [e.matched, e.score.toFixed(9)]),
        );
      }
      expect(searchBands(index, bands, { tolerance: tol, requireAll: true, top: 300 }).length).toBe(
        expected.filter((e) => e.matched === bands.length).length,
      );
      for (let i = 1; i < hits.length; i++) {
        const a = hits[i - 1]!;
        const b = hits[i]!;
        expect(a.matched > b.matched || (a.matched === b.matched && a.score >= b.score)).toBe(true);
      }
    }
  });

  it('rejects empty band lists, non-finite positions and bad tolerances', () => {
    const index = buildBandIndex(small);
    expect(() => searchBands(index, [])).toThrow(BandshelfError);
    expect(() => searchBands(index, [{ position: Number.NaN }])).toThrow(/must be a number/);
    expect(() => searchBands(index, [{ position: 1650 }], { tolerance: 0 })).toThrow(/tolerance/);
  });
});
