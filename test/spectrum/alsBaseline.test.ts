// Tests of the asymmetric least-squares baseline on synthetic protein-like bands with a known baseline.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { alsBaseline } from '../../src/spectrum/alsBaseline.js';
import { mulberry32 } from '../mulberry32.js';

// Amide I / amide II / amide III-like Gaussian bands on a sloped, curved baseline, 1 cm⁻¹ sampling, seeded
// noise.
function syntheticFilm(noise: number, seed = 42) {
  const rnd = mulberry32(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
  const bands: [number, number, number][] = [
    [1652, 30, 1.0],
    [1545, 35, 0.6],
    [1450, 20, 0.15],
    [1240, 40, 0.3],
    [1080, 30, 0.25],
  ];
  const n = 801;
  const wavenumber = new Float64Array(n);
  const absorbance = new Float64Array(n);
  const baseline = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = 1000 + i;
    const t = (x - 1000) / 800;
    wavenumber[i] = x;
    baseline[i] = 0.2 + 0.3 * t + 0.15 * t * t;
    let s = 0;
    for (const [c, w, h] of bands) s += h * Math.exp(-4 * Math.LN2 * ((x - c) / w) ** 2);
    absorbance[i] = baseline[i]! + s + noise * gauss();
  }
  return { spectrum: { wavenumber, absorbance }, baseline };
}

const maxError = (a: Float64Array, b: Float64Array) =>
  a.reduce((m, v, i) => Math.max(m, Math.abs(v - b[i]!)), 0);

describe('alsBaseline', () => {
  it('returns a straight line unchanged (the second-difference penalty does not see it)', () => {
    const wavenumber = Float64Array.from({ length: 50 }, (_, i) => 1000 + 2 * i);
    const absorbance = wavenumber.map((x) => 0.5 - 1e-4 * x);
    const z = alsBaseline({ wavenumber, absorbance });
    for (let i = 0; i < 50; i++) expect(z[i]).toBeCloseTo(absorbance[i]!, 7);
  });

  it('removes a quadratic baseline under protein-like bands to within 4 % of the strongest band', () => {
    const { spectrum, baseline } = syntheticFilm(0.002);
    // Stated tolerance: with the recipe defaults (λ = 1e5, p = 0.01) the fit rides up to ≈ 3.5 % under the
    // overlapping amide bands; 0.04 absorbance units on a 1.0 band.
    expect(maxError(alsBaseline(spectrum), baseline)).toBeLessThan(0.04);
    // A stiffer λ follows this gentle baseline more closely (≈ 1 %).
    expect(maxError(alsBaseline(spectrum, { lambda: 1e7 }), baseline)).toBeLessThan(0.015);
  });

  it('sits below the bands: almost every point above the fit is a band or noise', () => {
    const { spectrum } = syntheticFilm(0.002, 9);
    const z = alsBaseline(spectrum);
    let below = 0;
    for (let i = 0; i < z.length; i++) if (spectrum.absorbance[i]! < z[i]!) below++;
    // p = 0.01 puts the fit near the lower envelope of the noise: about a fifth of the points fall below it
    // here, against about half for a symmetric fit.
    expect(below / z.length).toBeLessThan(0.3);
  });

  it('does not modify the input', () => {
    const { spectrum } = syntheticFilm(0.002);
    const copy = spectrum.absorbance.slice();
    alsBaseline(spectrum, { iterations: 3 });
    expect(spectrum.absorbance).toEqual(copy);
  });

  it('refuses bad parameters and too few points', () => {
    const s = { wavenumber: Float64Array.from([1, 2, 3, 4]), absorbance: Float64Array.from([1, 2, 1, 2]) };
    const code = (run: () => unknown) => {
      try {
        run();
      } catch (e) {
        return e instanceof BandshelfError ? `${e.code}:${e.field ?? ''}` : 'other';
      }
      return 'none';
    };
    expect(code(() => alsBaseline(s, { p: 1 }))).toBe('BAD_RECIPE:p');
    expect(code(() => alsBaseline(s, { iterations: 0 }))).toBe('BAD_RECIPE:iterations');
    expect(code(() => alsBaseline(s, { lambda: -1 }))).toBe('BAD_RECIPE:lambda');
    expect(
      code(() =>
        alsBaseline({ wavenumber: Float64Array.from([1, 2]), absorbance: Float64Array.from([1, 2]) }),
      ),
    ).toBe('TOO_FEW_POINTS:');
  });
});
