// Partial coverage on the library grid: scattered tunable-laser points keep their holes, comb-fine spectra are
// bin-averaged, and a field-resolved spectrum is not covered outside its reference's power range.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/demo/seededRandom.js';
import { recipeSchema } from '../../../src/schema/recipe.js';
import { gridAxis } from '../../../src/spectrum/gridAxis.js';
import { resampleToGrid } from '../../../src/spectrum/resampleToGrid.js';
import { traceToSpectrum } from '../../../src/spectrum/trace/traceToSpectrum.js';
import type { Trace } from '../../../src/spectrum/trace/types.js';

const grid = { start: 4000, stop: 600, step: 2 };
const axis = gridAxis(grid);

describe('tunable-laser spectrum: scattered points over 1750–1000 cm⁻¹ with a 40 cm⁻¹ hole', () => {
  // Points every 1–3 cm⁻¹ (seeded), none between 1400 and 1360 cm⁻¹.
  const uniform = seededRandom(42).uniform;
  const xs: number[] = [];
  for (let x = 1000; x <= 1750; x += 1 + 2 * uniform()) if (x <= 1360 || x >= 1400) xs.push(x);
  const wavenumber = Float64Array.from(xs);
  // A straight line is reproduced exactly by linear interpolation and by a symmetric average, up to the offset of the
  // points' mean from the cell centre (≤ 1 cm⁻¹ × slope).
  const slope = 1e-3;
  const line = (x: number) => 0.2 + slope * (x - 1000);
  const absorbance = wavenumber.map(line);
  const { maxGap } = recipeSchema.parse({}).resample;
  const out = resampleToGrid({ wavenumber, absorbance }, grid, { maxGap });
  const first = wavenumber[0]!;
  const last = wavenumber[wavenumber.length - 1]!;
  const holeLo = xs.filter((x) => x <= 1360).at(-1)!;
  const holeHi = xs.find((x) => x >= 1400)!;

  it('leaves NaN outside the coverage and strictly inside the hole', () => {
    for (let k = 0; k < axis.length; k++) {
      const x = axis[k]!;
      const inHole = x > holeLo && x < holeHi;
      if (x < first || x > last || inHole) expect(Number.isNaN(out[k]!), `${x} cm⁻¹`).toBe(true);
      else {
        expect(Number.isFinite(out[k]!), `${x} cm⁻¹`).toBe(true);
        expect(Math.abs(out[k]! - line(x))).toBeLessThanOrEqual(slope * 1.0001);
      }
    }
    // The hole spans ≥ 40 cm⁻¹, so at least 19 grid points are not covered inside it.
    const holePoints = Array.from(axis).filter((x) => x > holeLo && x < holeHi).length;
    expect(holePoints).toBeGreaterThanOrEqual(19);
  });

  it('leaves more uncovered when maxGap is below the widest ordinary spacing', () => {
    const strict = resampleToGrid({ wavenumber, absorbance }, grid, { maxGap: 2 });
    const covered = (v: Float64Array) => v.filter((y) => Number.isFinite(y)).length;
    expect(covered(strict)).toBeLessThan(covered(out));
    expect(covered(strict)).toBeGreaterThan(0);
  });

  it('keeps a band at its position', () => {
    const band = wavenumber.map((x) => 0.8 / (1 + ((x - 1650) / 10) ** 2));
    const resampled = resampleToGrid({ wavenumber, absorbance: band }, grid, { maxGap });
    let peak = -1;
    for (let k = 0; k < axis.length; k++)
      if (Number.isFinite(resampled[k]!) && (peak < 0 || resampled[k]! > resampled[peak]!)) peak = k;
    expect(Math.abs(axis[peak]! - 1650)).toBeLessThanOrEqual(2);
  });
});

describe('frequency-comb-like spectrum at 0.05 cm⁻¹ spacing', () => {
  const n = Math.round((1800 - 1000) / 0.05) + 1;
  const wavenumber = Float64Array.from({ length: n }, (_, i) => 1000 + i * 0.05);

  it('bin-averages a straight line exactly onto the 2 cm⁻¹ grid', () => {
    // The average of a line over a cell symmetric about x is its value at x.
    const absorbance = wavenumber.map((x) => 0.1 + 2e-4 * x);
    const out = resampleToGrid({ wavenumber, absorbance }, grid);
    for (let k = 0; k < axis.length; k++) {
      const x = axis[k]!;
      if (x < 1000 || x > 1800) expect(Number.isNaN(out[k]!)).toBe(true);
      // The two end cells hold points on one side only, so their mean sits half a cell inwards.
      else if (x === 1000 || x === 1800) expect(Math.abs(out[k]! - (0.1 + 2e-4 * x))).toBeLessThan(2e-4);
      else expect(out[k]!).toBeCloseTo(0.1 + 2e-4 * x, 9);
    }
  });

  it('averages the noise down by about √40 (40 points per 2 cm⁻¹ cell)', () => {
    // Averaging m independent samples divides the noise standard deviation by √m (common practice).
    const { normal } = seededRandom(9);
    const sigma = 0.01;
    const absorbance = wavenumber.map(() => 0.5 + sigma * normal());
    const out = resampleToGrid({ wavenumber, absorbance }, grid);
    const inside = Array.from(out).filter((v, k) => Number.isFinite(v) && axis[k]! > 1000 && axis[k]! < 1800);
    const mean = inside.reduce((a, b) => a + b, 0) / inside.length;
    const sd = Math.sqrt(inside.reduce((a, b) => a + (b - mean) ** 2, 0) / (inside.length - 1));
    expect(sd / (sigma / Math.sqrt(40))).toBeGreaterThan(0.8);
    expect(sd / (sigma / Math.sqrt(40))).toBeLessThan(1.2);
  });
});

describe('field-resolved spectrum on the grid', () => {
  it('is not covered outside the reference power range', () => {
    const n = 4096;
    const time = Float64Array.from({ length: n }, (_, i) => i * 2);
    const pulse = (t: number) =>
      Math.exp((-2 * Math.LN2 * (t - 1000) ** 2) / 900) * Math.cos(2 * Math.PI * 0.05 * (t - 1000));
    const reference: Trace = { time, field: time.map(pulse) };
    const sample: Trace = { time, field: reference.field.map((v) => 0.5 * v) };
    const result = traceToSpectrum(sample, reference, {});
    const out = resampleToGrid(result.spectrum, grid);
    for (let k = 0; k < axis.length; k++) {
      const x = axis[k]!;
      if (x < result.coverage.min || x > result.coverage.max)
        expect(Number.isNaN(out[k]!), `${x}`).toBe(true);
      // A 2-fold field attenuation is log10(4) = 0.602 absorbance units (common practice).
      else expect(out[k]!).toBeCloseTo(Math.log10(4), 9);
    }
    expect(result.coverage.min).toBeGreaterThan(600);
    expect(result.coverage.max).toBeLessThan(4000);
  });
});
