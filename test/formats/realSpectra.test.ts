// Every real infrared file in ../shared/real-spectra/ (origins and licences in its PROVENANCE.md) read against the
// independent decoding in its expected.json: points, first/last x and y at sampled indexes, in the file's own units.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { readSpectrumFile } from '../../src/formats/readSpectrumFile.js';
import type { ParsedSpectrum } from '../../src/formats/types.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const folder = join(root, '..', 'shared', 'real-spectra');
const present = existsSync(join(folder, 'expected.json'));
if (!present)
  console.warn(`real-spectra tests skipped: ${folder} is absent (CI places shared/ beside the checkout)`);

interface ExpectedBlock {
  y_units: string;
  x_units: string;
  points_decoded: number;
  x_first: number;
  x_last: number;
  y_at: Record<string, number>;
}
const expected: Record<string, { blocks: ExpectedBlock[] }> = present
  ? JSON.parse(readFileSync(join(folder, 'expected.json'), 'utf8')).files
  : {};

/** Files whose independent decoding is not what a right reading gives; each is asserted on its own below. */
const INCONSISTENT = new Set([
  'text/manarom_transmittance.txt', // x given per line, unevenly: the decoding spread x evenly (PROVENANCE.md)
  'jcamp/manarom_JCAMP_test_file.jdx', // single-beam counts under YUNITS=TRANSMITTANCE: refused
  'jcamp/manarom_JCAMPDX5.jdx', // ARBITRARY UNITS: needs an explicit y unit
]);

function read(name: string, options: Parameters<typeof readSpectrumFile>[1] = {}): ParsedSpectrum[] {
  return readSpectrumFile(readFileSync(join(folder, name)), { file: name, ...options });
}

/** x of the file's own unit back from cm⁻¹ (the readers convert µm and nm). */
function ownX(p: ParsedSpectrum, wavenumber: number): number {
  if (p.source.xUnit === 'um') return 1e4 / wavenumber;
  if (p.source.xUnit === 'nm') return 1e7 / wavenumber;
  return wavenumber;
}

/** y of the file's own unit back from absorbance (A = −log10 T, T% = 100·10^−A). */
function ownY(p: ParsedSpectrum, absorbance: number): number {
  if (p.source.yUnit === 'transmittance') return 10 ** -absorbance;
  if (p.source.yUnit === 'percent-transmittance') return 100 * 10 ** -absorbance;
  return absorbance;
}

function close(actual: number, wanted: number, tolerance = 1e-9): boolean {
  return Math.abs(actual - wanted) <= tolerance * Math.max(Math.abs(wanted), 1e-300) || actual === wanted;
}

const infrared = Object.keys(expected).filter((f) => !f.startsWith('nonir/') && !INCONSISTENT.has(f));

describe.skipIf(!present)('real infrared files (../shared/real-spectra, expected.json)', () => {
  it.each(infrared)('%s reads as its independent decoding', (name) => {
    const blocks = expected[name]!.blocks;
    const parsed = read(name);
    expect(parsed.length, name).toBe(blocks.length);
    blocks.forEach((want, b) => {
      const p = parsed[b]!;
      const { wavenumber, absorbance } = p.spectrum;
      const n = wavenumber.length;
      expect(n, `${name} block ${b + 1}: points`).toBe(want.points_decoded);
      // The reader orders by ascending wavenumber; file index i sits at n−1−i when the file runs the other way.
      const fileFirstIsLow =
        ownX(p, wavenumber[0]!) === Math.min(ownX(p, wavenumber[0]!), ownX(p, wavenumber[n - 1]!));
      const ascendingInFile = want.x_first < want.x_last === fileFirstIsLow;
      const at = (i: number) => (ascendingInFile ? i : n - 1 - i);
      expect(close(ownX(p, wavenumber[at(0)]!), want.x_first), `${name}: first x`).toBe(true);
      expect(close(ownX(p, wavenumber[at(n - 1)]!), want.x_last), `${name}: last x`).toBe(true);
      for (const [index, y] of Object.entries(want.y_at)) {
        const i = at(Number(index));
        if (p.saturated?.[i]) continue; // clipped at the absorbance ceiling: not the file's value by design
        const got = ownY(p, absorbance[i]!);
        expect(close(got, y), `${name}: y[${index}] = ${got}, expected ${y}`).toBe(true);
      }
    });
  });

  it.each(Object.keys(expected).filter((f) => f.startsWith('nonir/')))(
    '%s (not infrared) is refused with one line',
    (name) => {
      let error: unknown;
      try {
        read(name);
      } catch (e) {
        error = e;
      }
      expect(error, name).toBeInstanceOf(BandshelfError);
      expect(String((error as Error).message)).not.toContain('\n');
    },
  );

  it('text/manarom_transmittance.txt (uneven x written per line) keeps the x values given, never spread evenly', () => {
    // The file (Manarom/JCAMPDXir.jl, MIT) writes one (x, y) per line in µm, spaced 0.0001 and 0.0002 in turn.
    const text = readFileSync(join(folder, 'text/manarom_transmittance.txt'), 'latin1').split(/\r?\n/);
    const rows = text.filter((l) => /^\s*[0-9.]/.test(l)).map((l) => l.trim().split(/\s+/).map(Number));
    const [p] = read('text/manarom_transmittance.txt');
    const { wavenumber, absorbance } = p!.spectrum;
    expect(wavenumber.length).toBe(rows.length);
    // Ascending wavenumber is descending µm: file row i sits at n−1−i.
    const n = rows.length;
    for (const i of [0, 1, 2, Math.floor(n / 2), n - 1]) {
      expect(close(1e4 / wavenumber[n - 1 - i]!, rows[i]![0]!)).toBe(true);
      expect(close(10 ** -absorbance[n - 1 - i]!, rows[i]![1]!)).toBe(true);
    }
    expect(p!.warnings.map((w) => w.message).join('\n')).toMatch(/not evenly spaced/);
  });

  it('jcamp/SPECFILE.DX: the last line’s Y-check value is a check, not a 1802nd point', () => {
    // expected.json: NPOINTS=1801 and 1801 points decoded, LASTX=4000 (jcamp-dx.org official test data).
    const [p] = read('jcamp/SPECFILE.DX');
    expect(p!.spectrum.wavenumber.length).toBe(1801);
    expect(p!.spectrum.wavenumber.at(-1)).toBe(4000);
  });

  it('jcamp/manarom_JCAMP_test_file.jdx (counts up to 2.8e7 under YUNITS=TRANSMITTANCE) is refused in one line', () => {
    let error: unknown;
    try {
      read('jcamp/manarom_JCAMP_test_file.jdx');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(BandshelfError);
    expect((error as Error).message).toMatch(/single-beam|interferogram/);
    expect((error as Error).message).not.toContain('\n');
  });

  it('jcamp/manarom_JCAMPDX5.jdx (ARBITRARY UNITS) asks for the y unit, and reads with it', () => {
    let error: unknown;
    try {
      read('jcamp/manarom_JCAMPDX5.jdx');
    } catch (e) {
      error = e;
    }
    expect((error as Error).message).toMatch(/--y-unit/);
    const want = expected['jcamp/manarom_JCAMPDX5.jdx']!.blocks[0]!;
    const [p] = read('jcamp/manarom_JCAMPDX5.jdx', { yUnit: 'absorbance' });
    expect(p!.spectrum.wavenumber.length).toBe(want.points_decoded);
  });

  it.each(['jcamp/pacdec1.jdx', 'jcamp/BRUKER1.JCM', 'jcamp/fixinc1.jdx'])(
    '%s (%T straying past 100 or below 0 under YUNITS=TRANSMITTANCE) reads as percent, with the warning',
    (name) => {
      // y_min/y_max in expected.json: pacdec1 reaches 101.9 %, BRUKER1 dips to −0.29, fixinc1 reaches 112.9.
      const [p] = read(name);
      expect(p!.source.yUnit).toBe('percent-transmittance');
      expect(p!.warnings.map((w) => w.message).join('\n')).toMatch(/read as percent/);
    },
  );

  it('files with T ≤ 0 in a saturated band read with those points clipped, marked and warned about', () => {
    // BRUKER1.JCM: y_min −0.29 %T in expected.json (jcamp-dx.org official test data).
    const [p] = read('jcamp/BRUKER1.JCM');
    expect(p!.saturated).toBeDefined();
    const count = p!.saturated!.reduce((a, b) => a + b, 0);
    expect(count).toBeGreaterThan(0);
    expect(p!.warnings.map((w) => w.message).join('\n')).toMatch(
      new RegExp(`${count} points? at or beyond the absorbance ceiling 4`),
    );
    for (let i = 0; i < p!.spectrum.absorbance.length; i++)
      expect(p!.spectrum.absorbance[i]! <= 4).toBe(true);
  });

  it('the biodiesel blend series reads as absorbance and its ester C=O band (≈1745 cm⁻¹) grows with the blend', () => {
    // text/plotftir_biodiesel_*.csv: NRCan/PlotFTIR data set (GPL-3), file names carry the labelled blend in %;
    // the ester carbonyl stretch near 1745 cm⁻¹ is common practice (fatty acid methyl esters).
    const series: [string, number][] = [
      ['0', 0],
      ['0_25', 0.25],
      ['0_50', 0.5],
      ['1_0', 1],
      ['2_5', 2.5],
      ['5_0', 5],
      ['7_5', 7.5],
      ['10_0', 10],
    ];
    const heights = series.map(([label]) => {
      const [p] = read(`text/plotftir_biodiesel_${label}.csv`);
      expect(p!.source.yUnit).toBe('absorbance');
      const { wavenumber, absorbance } = p!.spectrum;
      let peak = Number.NEGATIVE_INFINITY;
      let base = Number.POSITIVE_INFINITY;
      for (let i = 0; i < wavenumber.length; i++) {
        const w = wavenumber[i]!;
        if (w >= 1730 && w <= 1760) peak = Math.max(peak, absorbance[i]!);
        if ((w >= 1790 && w <= 1810) || (w >= 1680 && w <= 1700)) base = Math.min(base, absorbance[i]!);
      }
      return peak - base;
    });
    for (let k = 1; k < heights.length; k++)
      expect(heights[k]!, series[k]![0]).toBeGreaterThan(heights[k - 1]!);
  });
});
