// Test helpers for the site: a small library built with the real CLI (init, add, release, match), and the
// site built from it into a temp folder. Spectra are seeded Gaussian bands at positions from the band-assignment
// table (Barth 2007; Movasaghi, Rehman & Rehman 2008; Bertie & Lan 1996), so searches and matches are checkable.
import { mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { type Band, bandshelf, ROOT, tempDir, writeSpectrumCsv } from '../cli/bandshelfCli.js';

export const XSS_NAME = '<img src=x onerror=alert(1)>';
export const XSS_NOTES = '"><script>alert(2)</script> and <b>bold</b>';

export interface TestEntry {
  id: string;
  meta: Record<string, unknown>;
  bands: Band[];
}

/** Band positions from the outside-reference table (amide I ~1650, amide II ~1550, water 3404/1643/2125 …). */
export const TEST_ENTRIES: TestEntry[] = [
  {
    id: 'albumin-test',
    meta: {
      name: 'Serum albumin (test)',
      synonyms: ['HSA', 'albumin'],
      class: 'protein',
      technique: 'atr',
      sampleForm: 'dried film',
      tags: ['protein', 'serum'],
      date: '2026-03-02',
    },
    bands: [
      { position: 3300, height: 0.35, fwhm: 120 },
      { position: 2960, height: 0.1, fwhm: 30 },
      { position: 1652, height: 0.9, fwhm: 32 },
      { position: 1545, height: 0.55, fwhm: 30 },
      { position: 1450, height: 0.15, fwhm: 24 },
      { position: 1240, height: 0.12, fwhm: 40 },
    ],
  },
  {
    id: 'water-test',
    meta: {
      name: 'Water (liquid, test)',
      class: 'solvent',
      cas: '7732-18-5',
      formula: 'H2O',
      technique: 'transmission',
      sampleForm: 'liquid',
      tags: ['solvent'],
      date: '2026-01-15',
    },
    bands: [
      { position: 3404, height: 0.9, fwhm: 300 },
      { position: 2125, height: 0.05, fwhm: 180 },
      { position: 1643, height: 0.3, fwhm: 70 },
    ],
  },
  {
    id: 'glucose-test',
    meta: {
      name: 'D-Glucose (test)',
      class: 'carbohydrate',
      formula: 'C6H12O6',
      cas: '50-99-7',
      technique: 'atr',
      sampleForm: 'powder',
      tags: ['sugar', 'serum'],
      date: '2026-02-20',
    },
    bands: [
      { position: 3350, height: 0.3, fwhm: 200 },
      { position: 2930, height: 0.08, fwhm: 40 },
      { position: 1152, height: 0.35, fwhm: 20 },
      { position: 1107, height: 0.45, fwhm: 18 },
      { position: 1080, height: 0.5, fwhm: 20 },
      { position: 1035, height: 0.8, fwhm: 22 },
    ],
  },
  {
    id: 'lipid-test',
    meta: {
      name: 'Phosphatidylcholine (test)',
      class: 'lipid',
      technique: 'atr',
      sampleForm: 'dried film',
      tags: ['lipid', 'serum'],
      date: '2026-04-11',
    },
    bands: [
      { position: 2922, height: 0.8, fwhm: 22 },
      { position: 2852, height: 0.55, fwhm: 18 },
      { position: 1740, height: 0.6, fwhm: 20 },
      { position: 1467, height: 0.2, fwhm: 16 },
      { position: 1235, height: 0.25, fwhm: 30 },
      { position: 1087, height: 0.2, fwhm: 28 },
    ],
  },
  {
    id: 'xss-test',
    meta: {
      name: XSS_NAME,
      class: 'other',
      technique: 'other',
      sampleForm: 'powder',
      tags: ['<b>bold</b>'],
      notes: XSS_NOTES,
      date: '2026-05-05',
    },
    bands: [
      { position: 2500, height: 0.4, fwhm: 40 },
      { position: 1300, height: 0.5, fwhm: 30 },
      { position: 900, height: 0.3, fwhm: 25 },
    ],
  },
];

/** An unknown: albumin and glucose plus a band at 1780 cm⁻¹ no library entry has (it stays unexplained). */
export const UNKNOWN_BANDS: Band[] = [
  ...TEST_ENTRIES[0]!.bands.map((b) => ({ ...b, height: b.height * 0.7 })),
  ...TEST_ENTRIES[2]!.bands.map((b) => ({ ...b, height: b.height * 0.3 })),
  { position: 1780, height: 0.12, fwhm: 14 },
];

export interface SiteFixture {
  dir: string;
  library: string;
  reports: string;
  /** A noisy copy of the glucose entry for the in-browser matcher. */
  glucoseUnknown: string;
  mixtureUnknown: string;
}

/** The repository's demo collection (synthetic), as `npm run demo` ingests it. */
export const DEMO_LIBRARY = join(ROOT, 'library');

/**
 * Creates the library (init, add, release, match with --mixture into a report folder). With `demo`, the demo
 * collection is added too and every demo unknown matched, as `npm run demo` does.
 */
export function buildTestLibrary(options: { withReports?: boolean; demo?: boolean } = {}): SiteFixture {
  const dir = tempDir('bandshelf-site-test-');
  const library = join(dir, 'lib.sqlite');
  const files = join(dir, 'files');
  const reports = join(dir, 'reports');
  const run = (args: string[]) => {
    const r = bandshelf(args);
    if (r.code !== 0) throw new Error(`bandshelf ${args.join(' ')} failed (${r.code}): ${r.stderr}`);
    return r;
  };
  run(['init', '--library', library]);
  mkdirSync(files);
  TEST_ENTRIES.forEach((e, k) => {
    writeSpectrumCsv(join(files, `${e.id}.csv`), e.bands, { seed: 10 + k, noise: 0.0004 });
    writeFileSync(join(files, `${e.id}.meta.json`), JSON.stringify({ id: e.id, synthetic: true, ...e.meta }));
  });
  run(['add', files, '--library', library, '--message', 'test collection']);
  if (options.demo) run(['add', DEMO_LIBRARY, '--library', library, '--message', 'demo collection']);
  run(['release', 'r1', '--library', library, '--message', 'first test release']);
  const glucoseUnknown = writeSpectrumCsv(join(dir, 'unknown-glucose.csv'), TEST_ENTRIES[2]!.bands, {
    seed: 99,
    noise: 0.002,
    offset: 0.05,
  });
  const mixtureUnknown = writeSpectrumCsv(join(dir, 'unknown-mixture.csv'), UNKNOWN_BANDS, {
    seed: 7,
    noise: 0.0005,
  });
  if (options.withReports ?? true) {
    mkdirSync(reports);
    run(['match', mixtureUnknown, '--library', library, '--mixture', '--report', reports]);
    if (options.demo) {
      for (const name of demoUnknowns()) {
        run([
          'match',
          join(DEMO_LIBRARY, 'unknowns', name),
          '--library',
          library,
          '--mixture',
          '--report',
          reports,
        ]);
      }
    }
  }
  return { dir, library, reports, glucoseUnknown, mixtureUnknown };
}

/** The demo unknown spectra (CSV and JCAMP-DX files in library/unknowns). */
export function demoUnknowns(): string[] {
  return readdirSync(join(DEMO_LIBRARY, 'unknowns'))
    .filter((f) => /\.(csv|jdx)$/.test(f))
    .sort();
}

/** Every file under `dir`, relative with `/`, sorted. */
export function listFiles(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string): void => {
    for (const name of readdirSync(d).sort()) {
      const full = join(d, name);
      if (statSync(full).isDirectory()) walk(full);
      else out.push(relative(dir, full).split(sep).join('/'));
    }
  };
  walk(dir);
  return out;
}

export function readText(path: string): string {
  return readFileSync(path, 'utf8');
}
