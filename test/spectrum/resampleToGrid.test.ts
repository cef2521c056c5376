// Tests of resampling onto the library grid: bin-averages, interpolation, coverage and gaps, all by hand.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';
import { resampleToGrid } from '../../src/spectrum/resampleToGrid.js';
import { mulberry32 } from '../mulberry32.js';

const spectrum = (x: ArrayLike<number>, y: ArrayLike<number>) => ({
  wavenumber: Float64Array.from(x),
  absorbance: Float64Array.from(y),
});
/** 1000, 1002, …, 1010 cm⁻¹, written high → low as the library writes grids. */
const grid = { start: 1010, stop: 1000, step: 2 };
const values = (v: Float64Array) =>
  Array.from(v, (a) => (Number.isNaN(a) ? null : Math.round(a * 1e9) / 1e9));

describe('resampleToGrid', () => {
  it('returns one value per grid point, ascending', () => {
    const out = resampleToGrid(spectrum([1000, 1010], [0, 10]), grid);
    expect(out.length).toBe(6);
    // A straight line in wavenumber: the value is the distance from 1000.
    expect(values(out)).toEqual([0, 2, 4, 6, 8, 10]);
  });

  it('interpolates linearly between sparse points', () => {
    // Triangle 0 → 10 → 0 over 1000 … 1005 … 1010: by hand 0, 4, 8, 8, 4, 0.
    const out = resampleToGrid(spectrum([1000, 1005, 1010], [0, 10, 0]), grid);
    expect(values(out)).toEqual([0, 4, 8, 8, 4, 0]);
  });

  it('bin-averages the source points in each cell [x − 1, x + 1) when the source is denser', () => {
    // y = (x − 1000)² every 0.5 cm⁻¹ from 999 to 1011. The cell of 1002 holds 1001.5, 1002, 1002.5 and, on its
    // edges, 1001 and 1003 at weight ½ (shared with the neighbouring cells):
    // (½·1 + 2.25 + 4 + 6.25 + ½·9) / 4 = 4.375. Cell of 1000: (½·1 + 0.25 + 0 + 0.25 + ½·1) / 4 = 0.375.
    const x = Array.from({ length: 25 }, (_, i) => 999 + 0.5 * i);
    const out = resampleToGrid(
      spectrum(
        x,
        x.map((v) => (v - 1000) ** 2),
      ),
      grid,
    );
    expect(out[0]).toBeCloseTo(0.375, 12);
    expect(out[1]).toBeCloseTo(4.375, 12);
    // Cell of 1010: (½·81 + 90.25 + 100 + 110.25 + ½·121) / 4 = 100.375.
    expect(out[5]).toBeCloseTo(100.375, 12);
  });

  it('averages points in the cell with the plain mean when none lies on an edge', () => {
    // Points at 1001.2, 1001.7, 1002.6 fall inside the cell of 1002 (1001 … 1003): (3 + 6 + 9) / 3 = 6.
    const out = resampleToGrid(spectrum([1000.9, 1001.2, 1001.7, 1002.6, 1003.3], [0, 3, 6, 9, 12]), {
      start: 1002,
      stop: 1002 + 2,
      step: 2,
    });
    expect(out[0]).toBeCloseTo(6, 12);
  });

  it('does not shift bands when the source spacing is exactly half the grid step', () => {
    // 1 cm⁻¹ integer data on the 2 cm⁻¹ grid: a symmetric band keeps its centre and a line is reproduced.
    const x = Array.from({ length: 41 }, (_, i) => 990 + i);
    const line = resampleToGrid(
      spectrum(
        x,
        x.map((v) => v - 1000),
      ),
      grid,
    );
    expect(values(line)).toEqual([0, 2, 4, 6, 8, 10]);
    const band = resampleToGrid(
      spectrum(
        x,
        x.map((v) => Math.exp(-(((v - 1004) / 3) ** 2))),
      ),
      grid,
    );
    expect(band[1]).toBeCloseTo(band[3]!, 12);
  });

  it('bin-averages a 0.1 cm⁻¹ spectrum to the centre values and lowers its noise by √(points per cell)', () => {
    // 20 points per 2 cm⁻¹ cell placed symmetrically about each grid point (offset 0.05 keeps every point off
    // a cell edge), so the mean of a straight line is its value at the grid point.
    const fineGrid = { start: 1100, stop: 1000, step: 2 };
    const n = 1022;
    const x = Float64Array.from({ length: n }, (_, i) => 998.95 + 0.1 * i);
    const line = (v: number) => 0.3 + 0.002 * (v - 1000);
    const rand = mulberry32(7);
    const sigma = 0.01;
    const noisy = x.map(
      (v) => line(v) + sigma * Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand()),
    );
    const clean = resampleToGrid(spectrum(x, x.map(line)), fineGrid);
    const axis = gridAxis(fineGrid);
    for (let i = 0; i < axis.length; i++) expect(clean[i]).toBeCloseTo(line(axis[i]!), 12);
    const averaged = resampleToGrid(spectrum(x, noisy), fineGrid);
    let ss = 0;
    for (let i = 0; i < axis.length; i++) ss += (averaged[i]! - line(axis[i]!)) ** 2;
    const rms = Math.sqrt(ss / axis.length);
    // The mean of 20 independent values has σ/√20 ≈ 0.00224; 51 cells estimate it to about ±10 %.
    expect(rms).toBeGreaterThan(0.7 * (sigma / Math.sqrt(20)));
    expect(rms).toBeLessThan(1.3 * (sigma / Math.sqrt(20)));
  });

  it('leaves grid points outside the source coverage NaN, never extrapolating', () => {
    const out = resampleToGrid(spectrum([1003, 1007], [3, 7]), grid);
    expect(values(out)).toEqual([null, null, 4, 6, null, null]);
  });

  it('covers the ends when the source axis lands on them only up to rounding', () => {
    // A file's axis computed as FIRSTX + i·DELTAX misses the round grid ends by a rounding error.
    const x = Float64Array.from({ length: 6 }, (_, i) => 1000 + 2 * i);
    x[0] = 1000 + 1e-10;
    x[5] = 1010 - 1e-10;
    const out = resampleToGrid(spectrum(x, [5, 4, 3, 2, 1, 0]), grid);
    expect(values(out)).toEqual([5, 4, 3, 2, 1, 0]);
  });

  it('leaves NaN between source points further apart than maxGap (scattered tunable-laser points)', () => {
    const wide = { start: 1040, stop: 1000, step: 2 };
    // 1000 and 1010 are 10 apart (≤ 16, filled); 1010 and 1040 are 30 apart (> 16, not covered).
    const out = resampleToGrid(spectrum([1000, 1010, 1040], [1, 2, 3]), wide);
    const axis = gridAxis(wide);
    for (let i = 0; i < axis.length; i++) {
      const x = axis[i]!;
      if (x <= 1010) expect(out[i]).toBeCloseTo(1 + (x - 1000) / 10, 12);
      else if (x < 1040) expect(out[i]).toBeNaN();
      else expect(out[i]).toBe(3);
    }
    // The same points with a wider allowance are interpolated across.
    const loose = resampleToGrid(spectrum([1000, 1010, 1040], [1, 2, 3]), wide, { maxGap: 40 });
    expect(loose[10]).toBeCloseTo(2 + 10 / 30, 12);
  });

  it('interpolates rather than copies when a cell holds a single off-centre point', () => {
    // 1001.5 lies in the cell of 1002 but is 0.5 away; the line through 1000 (0) and 1001.5 (3) gives 4 at
    // 1002 only by extrapolation, so 1002 uses the next neighbour 1004 (5) instead: 3 + 2·(0.5/2.5) = 3.4.
    const out = resampleToGrid(spectrum([1000, 1001.5, 1004], [0, 3, 5]), {
      start: 1004,
      stop: 1000,
      step: 2,
    });
    expect(values(out)).toEqual([0, 3.4, 5]);
  });

  it('reproduces a source that lies exactly on the grid', () => {
    const axis = gridAxis(grid);
    const y = Float64Array.from([0.1, 0.5, 0.2, 0.9, 0.4, 0.3]);
    expect(Array.from(resampleToGrid(spectrum(axis, y), grid))).toEqual(Array.from(y));
  });

  it('refuses an unsorted source and a non-positive maxGap with typed errors', () => {
    expect(() => resampleToGrid(spectrum([1005, 1000], [1, 2]), grid)).toThrow(BandshelfError);
    expect(() => resampleToGrid(spectrum([1000, 1005], [1, 2]), grid, { maxGap: 0 })).toThrow(BandshelfError);
  });

  it('does not modify its input', () => {
    const s = spectrum([1000, 1005, 1010], [0, 10, 0]);
    resampleToGrid(s, grid);
    expect(Array.from(s.absorbance)).toEqual([0, 10, 0]);
  });
});
