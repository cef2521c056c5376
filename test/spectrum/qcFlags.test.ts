// Tests of the ingest QC flags on invented serum-like films: each flag's trigger, level, figure and wording.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import type { Grid } from '../../src/schema/recipe.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';
import { qcFlags } from '../../src/spectrum/qcFlags.js';
import type { Spectrum } from '../../src/spectrum/types.js';
import { mulberry32 } from '../mulberry32.js';

const grid: Grid = { start: 4000, stop: 600, step: 2 };
const exclude = [{ min: 2280, max: 2400 }];

// A dried-serum-like film (invented): amide A, CH₂ stretch, amide I/II/III, carbohydrate C–O bands.
const serumBands: [number, number, number][] = [
  [3300, 200, 0.3],
  [2925, 30, 0.15],
  [1652, 30, 1.0],
  [1545, 35, 0.6],
  [1240, 40, 0.3],
  [1080, 30, 0.25],
];

interface FilmOptions {
  noise?: number;
  seed?: number;
  from?: number;
  to?: number;
  step?: number;
  scale?: number;
  bands?: [number, number, number][];
  keep?: (x: number) => boolean;
}

function film(options: FilmOptions = {}): Spectrum {
  const { noise = 2e-4, seed = 1, from = 600, to = 4000, step = 1, scale = 1, bands = serumBands } = options;
  const rnd = mulberry32(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
  const x: number[] = [];
  const y: number[] = [];
  for (let i = 0; from + i * step <= to + 1e-9; i++) {
    const v = from + i * step;
    let s = 0.02 + 1e-5 * (v - 600);
    for (const [c, w, h] of bands) s += scale * h * Math.exp(-4 * Math.LN2 * ((v - c) / w) ** 2);
    const value = s + noise * gauss();
    if (options.keep && !options.keep(v)) continue;
    x.push(v);
    y.push(value);
  }
  return { wavenumber: Float64Array.from(x), absorbance: Float64Array.from(y) };
}

// The processed vector's coverage pattern, which is all qcFlags reads from it: finite inside the data's
// range, NaN outside it and in the exclusion windows.
function processedOf(s: Spectrum): Float64Array {
  const lo = s.wavenumber[0]!;
  const hi = s.wavenumber.at(-1)!;
  return gridAxis(grid).map((x) =>
    x < lo || x > hi || exclude.some((w) => x >= w.min && x <= w.max) ? Number.NaN : 0.01,
  );
}

const flagsOf = (s: Spectrum, options = {}) => qcFlags(s, processedOf(s), grid, { exclude, ...options });
const codes = (s: Spectrum, options = {}) => flagsOf(s, options).map((f) => `${f.code}:${f.level}`);

describe('qcFlags', () => {
  it('raises nothing for a clean full-range film', () => {
    expect(flagsOf(film())).toEqual([]);
  });

  it('reads an unsorted original the same as a sorted one', () => {
    const s = film({ scale: 2.5 });
    const reversed = {
      wavenumber: s.wavenumber.slice().reverse(),
      absorbance: s.absorbance.slice().reverse(),
    };
    expect(qcFlags(reversed, processedOf(s), grid, { exclude })).toEqual(flagsOf(s));
  });

  it('warns (does not block) about an absorbance above the saturation limit, judged inside the crop window', () => {
    const flags = flagsOf(film({ scale: 2.4 }));
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ code: 'saturation', level: 'warning' });
    expect(flags[0]!.value).toBeCloseTo(2.4 + 0.02 + 1e-5 * 1052, 2);
    expect(flags[0]!.message).toMatch(
      /^The maximum absorbance 2\.4\d at 165\d\.0 cm⁻¹ exceeds the saturation limit of 2: band heights/,
    );
    expect(codes(film({ scale: 2.4 }), { saturationLimit: 3 })).toEqual([]);
    // A crop window that leaves the 165x cm⁻¹ band out leaves nothing to warn about.
    expect(codes(film({ scale: 2.4 }), { crop: { min: 1800, max: 3000 } })).not.toContain('saturation');
  });

  it('warns about a clipped, flat-topped band but not about the round top of a broad one', () => {
    const clipped = film({ scale: 1.5 });
    const top = clipped.absorbance.map((v) => Math.min(v, 1.2));
    const flags = flagsOf({ wavenumber: clipped.wavenumber, absorbance: top });
    expect(flags.map((f) => `${f.code}:${f.level}`)).toEqual(['saturation:warning']);
    // The 30 cm⁻¹ band of height ≈ 1.5 exceeds 1.2 over 2·15·√(ln(1.5/1.2)/ln 2) ≈ 17 cm⁻¹: 17 points at 1
    // cm⁻¹.
    expect(flags[0]!.value).toBeGreaterThanOrEqual(16);
    expect(flags[0]!.value).toBeLessThanOrEqual(18);
    // A 400 cm⁻¹ wide band (liquid water's O–H stretch is about that broad) sampled every 0.5 cm⁻¹ without
    // noise stays within 1e-4 of its top for only ≈ 5 cm⁻¹.
    const broad = film({ noise: 0, step: 0.5, bands: [[3404, 400, 1.0]] });
    expect(codes(broad)).toEqual([]);
  });

  it('warns about negative absorbance after the baseline beyond the tolerance', () => {
    const s = film();
    const corrected = (dip: number) => ({
      wavenumber: s.wavenumber,
      absorbance: s.absorbance.map((v, i) => (i === 900 ? dip : v)),
    });
    const flags = flagsOf(s, { baselineCorrected: corrected(-0.05) });
    expect(flags).toEqual([
      {
        code: 'negative-absorbance',
        level: 'warning',
        message:
          'After baseline correction the absorbance falls to -0.05 at 1500.0 cm⁻¹, more than 2 % of the maximum below zero.',
        value: -0.05,
      },
    ]);
    // −0.01 on a maximum near 1.03 is within 2 %.
    expect(codes(s, { baselineCorrected: corrected(-0.01) })).toEqual([]);
  });

  it('warns about a low SNR and stays silent where the noise window is not covered', () => {
    const noisy = film({ noise: 0.02, seed: 4 });
    const flags = flagsOf(noisy);
    const low = flags.find((f) => f.code === 'low-snr');
    expect(low?.level).toBe('warning');
    // Range ≈ 1.05 + noise excursions over noise ≈ 0.02: an SNR of about 50–60.
    expect(low!.value).toBeGreaterThan(40);
    expect(low!.value).toBeLessThan(70);
    expect(low!.message).toContain('RMS in 1900.0–2000.0 cm⁻¹), below 100.');
    const tunable = film({ noise: 0.02, from: 1000, to: 1750 });
    expect(codes(tunable)).not.toContain('low-snr:warning');
    expect(codes(film({ noise: 0.02, seed: 4 }), { minSnr: 10 })).not.toContain('low-snr:warning');
  });

  it('counts single-point spikes and leaves sharp real bands alone', () => {
    const s = film({ seed: 6 });
    const spiked = s.absorbance.slice();
    const at = (x: number) => s.wavenumber.indexOf(x);
    spiked[at(1800)]! += 0.02;
    spiked[at(2600)]! += 0.03;
    spiked[at(3500)]! += 0.015;
    spiked[at(1100)]! -= 0.02;
    const flags = flagsOf({ wavenumber: s.wavenumber, absorbance: spiked });
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ code: 'spikes', level: 'warning', value: 4 });
    expect(flags[0]!.message).toMatch(
      /^4 single-point spikes found; the largest, 0\.0(29|30)\d* absorbance units, at 2600\.0 cm⁻¹\.$/,
    );
    // Water-vapour-like lines 3 cm⁻¹ wide on 1 cm⁻¹ sampling are narrow but not spikes.
    const lines: [number, number, number][] = [];
    for (let c = 1400.3; c < 1900; c += 23.7) lines.push([c, 3, 0.05]);
    expect(codes(film({ seed: 7, bands: [...serumBands, ...lines] }))).toEqual([]);
  });

  it('warns about gaps in the source data outside the exclusion windows', () => {
    const holed = film({ keep: (x) => x <= 1420 || x >= 1460 });
    const flags = flagsOf(holed);
    expect(flags).toEqual([
      {
        code: 'coverage-gap',
        level: 'warning',
        message:
          '1 gap wider than 16 cm⁻¹ between data points; the widest is 40 cm⁻¹ (1420.0–1460.0 cm⁻¹), left not covered.',
        value: 40,
      },
    ]);
    expect(codes(holed, { maxGap: 50 })).toEqual([]);
    // An instrument that blanks the CO₂ region leaves a gap the recipe excludes anyway.
    expect(codes(film({ keep: (x) => x < 2290 || x > 2390 }))).toEqual([]);
  });

  it('warns about point spacing coarser than twice the grid step', () => {
    const coarse = flagsOf(film({ step: 8 }));
    expect(coarse.map((f) => f.code)).toEqual(['coarse-spacing']);
    expect(coarse[0]!.value).toBe(8);
    expect(coarse[0]!.message).toBe(
      'The median point spacing is 8 cm⁻¹, coarser than 2 × the grid step of 2 cm⁻¹.',
    );
    expect(codes(film({ step: 4 }))).toEqual([]);
  });

  it('warns about narrow coverage, counting the grid outside the exclusion windows', () => {
    const tunable = film({ from: 1000, to: 1750 });
    const flags = flagsOf(tunable);
    expect(flags.map((f) => f.code)).toEqual(['narrow-coverage']);
    // 1000–1750 cm⁻¹ at 2 cm⁻¹ is 376 grid points of the 1701 − 61 outside the CO₂ window.
    expect(flags[0]!.value).toBeCloseTo(376 / 1640, 12);
    expect(flags[0]!.message).toBe(
      'The spectrum covers 22.9 % of the library grid 600.0–4000.0 cm⁻¹ (data over 1000.0–1750.0 cm⁻¹), below 90 %; matching uses the overlap only.',
    );
    expect(codes(tunable, { minCoverage: 0.2 })).toEqual([]);
  });

  it('raises an error, not a warning, for a spectrum that covers none of the grid', () => {
    // 4100–4500 cm⁻¹ lies wholly above the 4000 cm⁻¹ end of the grid: nothing could ever be matched.
    const outside = film({ from: 4100, to: 4500, bands: [[4300, 30, 0.5]] });
    const flags = qcFlags(outside, new Float64Array(1701).fill(Number.NaN), grid, { exclude });
    const coverage = flags.filter((f) => f.code === 'narrow-coverage');
    expect(coverage).toEqual([
      {
        code: 'narrow-coverage',
        level: 'error',
        message:
          'The spectrum covers none of the library grid 600.0–4000.0 cm⁻¹ outside the excluded windows; it cannot be matched.',
        value: 0,
      },
    ]);
  });

  it('warns about a low dynamic range of a field-resolved reference', () => {
    expect(codes(film(), { dynamicRangeOrders: 2.5 })).toEqual(['low-dynamic-range:warning']);
    expect(codes(film(), { dynamicRangeOrders: 4 })).toEqual([]);
  });

  it('refuses a processed vector that does not fit the grid', () => {
    expect(() => qcFlags(film(), new Float64Array(10), grid)).toThrow(BandshelfError);
  });
});
