// subtractScaled: the fitted scale and its standard error, and a given scale; on generated spectra, a given
// scale subtracts exactly and a fitted one recovers the scale of an exact model.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { fitReferences } from '../../src/spectrum/fitReferences.js';
import { interpolateAtWavenumbers } from '../../src/spectrum/interpolateAtWavenumbers.js';
import { subtractScaled } from '../../src/spectrum/subtractScaled.js';
import type { Spectrum } from '../../src/spectrum/types.js';
import { mulberry32 } from '../mulberry32.js';

const x = Float64Array.from({ length: 1201 }, (_, i) => 1000 + i);
// An invented water-like reference: a broad band near 2130 cm⁻¹ and a bend near 1640 cm⁻¹.
const water = x.map(
  (v) => 0.3 * Math.exp(-0.5 * ((v - 2130) / 120) ** 2) + Math.exp(-0.5 * ((v - 1640) / 30) ** 2),
);
const solute = x.map((v) => 0.2 * Math.exp(-0.5 * ((v - 1450) / 10) ** 2));
const of = (y: Float64Array): Spectrum => ({ wavenumber: x, absorbance: y });

describe('subtractScaled', () => {
  it('fits the scale in the window and leaves the solute (exact without noise, by construction)', () => {
    const y = x.map((_, i) => 0.8 * water[i]! + solute[i]! + 0.01);
    const r = subtractScaled(of(y), of(water), { window: { min: 1900, max: 2300 } });
    expect(r.scale).toBeCloseTo(0.8, 9);
    // The axis ends at 2200 cm⁻¹: 1900–2200 inclusive is 301 points.
    expect(r.points).toBe(301);
    const at1450 = x.indexOf(1450);
    expect(r.spectrum.absorbance[at1450]).toBeCloseTo(0.2 + 0.01, 9);
  });

  it('reports the standard error of fitReferences for the same fit (the one owner of that OLS)', () => {
    const u = mulberry32(4);
    const y = x.map((_, i) => 0.8 * water[i]! + solute[i]! + 0.001 * (u() - 0.5));
    const r = subtractScaled(of(y), of(water));
    const fit = fitReferences(of(y), [of(water)], [{ min: 1900, max: 2300 }]);
    expect(r.standardError).toBe(fit.standardErrors[0]);
    expect(r.standardError).toBeGreaterThan(0);
    // The scale lies within a few standard errors of the truth 0.8.
    expect(Math.abs(r.scale - 0.8)).toBeLessThan(5 * r.standardError!);
  });

  it('subtracts a given scale with no standard error, only where the reference covers', () => {
    const short: Spectrum = { wavenumber: x.slice(0, 600), absorbance: water.slice(0, 600) };
    const r = subtractScaled(of(water), short, { scale: 0.5 });
    expect(r.standardError).toBeNull();
    expect(r.spectrum.wavenumber.length).toBe(600);
    expect(r.spectrum.absorbance[10]).toBeCloseTo(0.5 * water[10]!, 12);
  });
});

describe('subtractScaled on generated spectra (fast-check, seeded)', () => {
  // What `bandshelf subtract` feeds it: an unknown and a reference on axes of their own, a scale given or fitted.
  const SEED = 20_261_206;
  const RUNS = 1000;
  const axisArb = fc
    .record({
      n: fc.integer({ min: 2, max: 300 }),
      start: fc.integer({ min: 1000, max: 1800 }),
      step: fc.constantFrom(0.5, 1, 2, 4),
    })
    .map(({ n, start, step }) => Float64Array.from({ length: n }, (_, i) => start + i * step));
  const valuesArb = fc.array(
    fc.integer({ min: -3000, max: 3000 }).map((v) => v / 1000),
    {
      minLength: 300,
      maxLength: 300,
    },
  );
  const spectrumArb = fc
    .tuple(axisArb, valuesArb)
    .map(([w, v]): Spectrum => ({ wavenumber: w, absorbance: w.map((_, i) => v[i]!) }));

  it(`a given scale subtracts exactly scale × the interpolated reference, or refuses with a stable code (${RUNS} cases, seed ${SEED})`, () => {
    fc.assert(
      fc.property(spectrumArb, spectrumArb, fc.double({ min: -10, max: 10, noNaN: true }), (u, r, k) => {
        let result: ReturnType<typeof subtractScaled>;
        try {
          result = subtractScaled(u, r, { scale: k });
        } catch (error) {
          // The reference may not reach the unknown at all.
          expect(error).toBeInstanceOf(BandshelfError);
          expect(['SMALL_OVERLAP', 'TOO_FEW_POINTS', 'NOT_A_SPECTRUM', 'BAD_OPTION']).toContain(
            (error as BandshelfError).code,
          );
          return;
        }
        expect(result.scale).toBe(k);
        expect(result.standardError).toBeNull();
        const ref = interpolateAtWavenumbers(r, result.spectrum.wavenumber, { maxGap: 16 });
        result.spectrum.wavenumber.forEach((w, i) => {
          const at = u.wavenumber.indexOf(w);
          expect(at, 'the output stays on the unknown’s own wavenumbers').toBeGreaterThanOrEqual(0);
          expect(result.spectrum.absorbance[i]!).toBeCloseTo(u.absorbance[at]! - k * ref[i]!, 9);
        });
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });

  it(`a fitted scale recovers k from unknown = k × reference + offset + slope (${RUNS} cases, seed ${SEED})`, () => {
    // Least squares with the offset and slope columns is exact when the model holds exactly (no noise).
    const referenceArb = fc
      .tuple(fc.integer({ min: 2, max: 8 }), fc.double({ min: 1800, max: 2400, noNaN: true }))
      .map(([bands, centre]) => {
        const w = Float64Array.from({ length: 701 }, (_, i) => 1700 + i);
        // A broad band plus narrower ones: never a straight line, so the scale is identifiable.
        const y = w.map(
          (v) =>
            Math.exp(-0.5 * ((v - centre) / 120) ** 2) +
            Array.from(
              { length: bands },
              (_, b) => 0.3 * Math.exp(-0.5 * ((v - 1750 - 80 * b) / 9) ** 2),
            ).reduce((s, x) => s + x, 0),
        );
        return { wavenumber: w, absorbance: y } satisfies Spectrum;
      });
    fc.assert(
      fc.property(
        referenceArb,
        fc.double({ min: -5, max: 5, noNaN: true }),
        fc.double({ min: -1, max: 1, noNaN: true }),
        fc.double({ min: -1e-3, max: 1e-3, noNaN: true }),
        (r, k, a, b) => {
          const u: Spectrum = {
            wavenumber: r.wavenumber,
            absorbance: r.absorbance.map((y, i) => k * y + a + b * (r.wavenumber[i]! - 2000)),
          };
          const result = subtractScaled(u, r, { window: { min: 1900, max: 2300 } });
          expect(result.scale).toBeCloseTo(k, 6);
          expect(result.points).toBe(401);
        },
      ),
      { seed: SEED, numRuns: RUNS },
    );
  });
});
