// The CSV writer: header, and an exact write → read round trip.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { readDelimited } from '../../src/formats/readDelimited.js';
import { writeCsv } from '../../src/formats/writeCsv.js';
import { mulberry32 } from '../mulberry32.js';

describe('writeCsv', () => {
  it('writes the unit header and one row per point', () => {
    const text = writeCsv({
      wavenumber: Float64Array.from([1000, 1002]),
      absorbance: Float64Array.from([0.5, -0.25]),
    });
    expect(text).toBe('wavenumber_cm-1,absorbance\n1000,0.5\n1002,-0.25\n');
    expect(
      writeCsv(
        { wavenumber: Float64Array.from([1, 2]), absorbance: Float64Array.from([3, 4]) },
        { header: false },
      ),
    ).toBe('1,3\n2,4\n');
  });

  it('round-trips seeded random doubles exactly, tiny and huge magnitudes included', () => {
    const random = mulberry32(2024);
    const n = 500;
    const wavenumber = new Float64Array(n);
    const absorbance = new Float64Array(n);
    let x = 400 + random();
    for (let i = 0; i < n; i++) {
      x += 1e-6 + random() * 10;
      wavenumber[i] = x;
      // Magnitudes from 1e-300 to 1e37 and both signs: the text must carry every bit. (Readers refuse ordinates
      // beyond ±3.4e38, the Float32 range of a stored processed vector.)
      absorbance[i] = (random() - 0.5) * 10 ** Math.floor(random() * 338 - 300);
    }
    const [back] = readDelimited(writeCsv({ wavenumber, absorbance }), { file: 'r.csv' });
    expect(back).toBeDefined();
    expect(back!.warnings).toEqual([]);
    expect(Array.from(back!.spectrum.wavenumber)).toEqual(Array.from(wavenumber));
    expect(Array.from(back!.spectrum.absorbance)).toEqual(Array.from(absorbance));
  });

  it('refuses non-finite values rather than writing text no reader accepts', () => {
    const bad = {
      wavenumber: Float64Array.from([1, 2]),
      absorbance: Float64Array.from([1, Number.POSITIVE_INFINITY]),
    };
    expect(() => writeCsv(bad)).toThrow(BandshelfError);
  });
});
