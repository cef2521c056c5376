// Makes every file of the synthetic demo collection in library/ from the compound table, reproducibly from one seed.
import { writeJcampDx } from '../formats/writeJcampDx.js';
import { penetrationDepth } from '../spectrum/penetrationDepth.js';
import { type Band, bandProfile } from './bandProfile.js';
import { type DemoCompound, demoCompounds } from './demoCompounds.js';
import { type SeededRandom, seededRandom } from './seededRandom.js';
import { timeDomainDemoFiles } from './timeDomainDemo.js';

export interface DemoFile {
  /** Path relative to library/. */
  path: string;
  content: string;
}

export interface GenerateDemoLibraryOptions {
  /** @default 20261201 */
  seed?: number;
}

/** The ways the demo's benches write their files, used in turn so every reader path gets exercised. */
const FILE_STYLES = [
  'jcamp-difdup',
  'csv-percent-t',
  'jcamp-affn',
  'csv-micrometres',
  'jcamp-sqz',
  'csv-decimal-comma',
  'jcamp-dif',
  'jcamp-pac',
] as const;
type FileStyle = (typeof FILE_STYLES)[number];

const CONTRIBUTOR = 'Alder Row biofluid group (fictitious)';
const SYNTHETIC_NOTE =
  'Synthetic demo spectrum: bands placed at published or recalled assignment positions, invented widths and heights, seeded noise and baseline. Not a measurement.';

function axis(hi: number, lo: number, step: number): Float64Array {
  const n = Math.floor((hi - lo) / step + 1e-9) + 1;
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = lo + i * step;
  return x;
}

/** Adds a sloped, gently curved baseline and white noise, as a bench would record it. */
function measure(x: Float64Array, clean: Float64Array, rng: SeededRandom, noise: number): Float64Array {
  const offset = 0.01 + 0.05 * rng.uniform();
  const slope = (rng.uniform() - 0.3) * 0.08;
  const curve = (rng.uniform() - 0.5) * 0.04;
  const y = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) {
    const t = (x[i]! - 600) / 3400;
    y[i] = clean[i]! + offset + slope * t + curve * t * t + noise * rng.normal();
  }
  return y;
}

/** The transmission absorbance as a single-reflection diamond ATR at 45° would weight it (sample index 1.5). */
function atrWeighted(x: Float64Array, absorbance: Float64Array): Float64Array {
  const atReference = penetrationDepth(1000);
  return absorbance.map((a, i) => (a * penetrationDepth(x[i]!)) / atReference);
}

function fmt(v: number, digits: number): string {
  return Number(v.toFixed(digits)).toString();
}

function delimited(x: Float64Array, y: Float64Array, style: FileStyle, title: string): string {
  const lines: string[] = [
    `# ${title}`,
    '# synthetic demo spectrum (bandshelf demo generator); not a measurement',
  ];
  if (style === 'csv-percent-t') {
    lines.push('wavenumber_cm-1,%T');
    // High to low, as many benches export.
    for (let i = x.length - 1; i >= 0; i--) lines.push(`${fmt(x[i]!, 3)},${fmt(100 * 10 ** -y[i]!, 5)}`);
  } else if (style === 'csv-micrometres') {
    lines.push('wavelength_um,absorbance');
    for (let i = x.length - 1; i >= 0; i--) lines.push(`${fmt(1e4 / x[i]!, 6)},${fmt(y[i]!, 6)}`);
  } else {
    lines.push('wavenumber_cm-1;absorbance');
    for (let i = 0; i < x.length; i++)
      lines.push(`${fmt(x[i]!, 2).replace('.', ',')};${fmt(y[i]!, 6).replace('.', ',')}`);
  }
  return `${lines.join('\n')}\n`;
}

function extensionFor(style: FileStyle): string {
  return style.startsWith('jcamp') ? 'jdx' : 'csv';
}

function sidecar(compound: DemoCompound, style: FileStyle, extra: Record<string, unknown> = {}): string {
  const isJcamp = style.startsWith('jcamp');
  const meta: Record<string, unknown> = {
    id: compound.id,
    name: compound.name,
    class: compound.class,
    ...(compound.synonyms ? { synonyms: compound.synonyms } : {}),
    // JCAMP-DX files carry formula and CAS in their own labels; the reader brings them in where the sidecar is silent.
    ...(!isJcamp && compound.formula ? { formula: compound.formula } : {}),
    ...(!isJcamp && compound.cas ? { cas: compound.cas } : {}),
    technique: style === 'csv-micrometres' ? 'transmission' : 'atr',
    sampleForm: compound.class === 'solvent' ? 'liquid' : 'dried film',
    resolution: 4,
    contributor: CONTRIBUTOR,
    date: '2026-11-02',
    licence: 'CC0-1.0',
    source: compound.source,
    tags: ['synthetic', 'demo', compound.class],
    notes: SYNTHETIC_NOTE,
    synthetic: true,
    ...extra,
  };
  return `${JSON.stringify(meta, null, 2)}\n`;
}

function jcampForm(style: FileStyle): 'affn' | 'pac' | 'sqz' | 'dif' | 'difdup' {
  return style.replace('jcamp-', '') as 'affn' | 'pac' | 'sqz' | 'dif' | 'difdup';
}

function referenceFile(compound: DemoCompound, index: number, rng: SeededRandom): DemoFile[] {
  const style = FILE_STYLES[index % FILE_STYLES.length]!;
  // Benches differ in range and point spacing: 1.93 cm⁻¹ (a common FTIR spacing), 1, 2 and 4 cm⁻¹.
  const steps = [1.9285, 1, 2, 4];
  const step = steps[index % steps.length]!;
  const lo = index % 3 === 0 ? 400 : 600;
  const x = axis(4000, lo, step);
  const scale = 0.35 + 0.6 * rng.uniform();
  const profile = bandProfile(x, compound.bands, { scale, lorentzianFraction: 0.4 + 0.3 * rng.uniform() });
  // The sidecar says ATR for every style but one: those spectra carry the diamond crystal's penetration-depth
  // weighting (Harrick's d_p ∝ λ, 1 at 1000 cm⁻¹), so the recipe's ATR step has something to undo.
  const clean = style === 'csv-micrometres' ? profile : atrWeighted(x, profile);
  const y = measure(x, clean, rng, 0.0015);
  const base = `${String(index + 1).padStart(2, '0')}-${compound.id}`;
  const title = `${compound.name} (synthetic)`;
  const content = style.startsWith('jcamp')
    ? writeJcampDx(
        { wavenumber: x, absorbance: y },
        {
          form: jcampForm(style),
          title,
          meta: {
            origin: CONTRIBUTOR,
            owner: 'public domain (synthetic)',
            resolution: 4,
            state: compound.class === 'solvent' ? 'liquid' : 'solid film',
            samplingProcedure: 'ATR, diamond, single reflection (synthetic)',
            ...(compound.cas ? { cas: compound.cas } : {}),
            ...(compound.formula ? { formula: compound.formula } : {}),
          },
        },
      )
    : delimited(x, y, style, title);
  return [
    { path: `${base}.${extensionFor(style)}`, content },
    { path: `${base}.meta.json`, content: sidecar(compound, style) },
  ];
}

function find(id: string): DemoCompound {
  const compound = demoCompounds.find((c) => c.id === id);
  if (!compound) throw new Error(`demo compound ${id} is not in the table`);
  return compound;
}

/** Area under a spectrum on a uniform axis, used to set each component's share of the signal. */
function area(y: Float64Array, step: number): number {
  let s = 0;
  for (let i = 0; i < y.length; i++) s += y[i]!;
  return s * step;
}

interface MixturePart {
  id: string;
  share: number;
}

/** Mixes compounds so each contributes `share` of the total integrated absorbance. */
function mix(
  x: Float64Array,
  step: number,
  parts: MixturePart[],
  total: number,
  extra: Band[] = [],
): Float64Array {
  const out = new Float64Array(x.length);
  for (const part of parts) {
    const profile = bandProfile(x, find(part.id).bands);
    const k = (part.share * total) / area(profile, step);
    for (let i = 0; i < x.length; i++) out[i] = out[i]! + k * profile[i]!;
  }
  if (extra.length > 0) {
    const e = bandProfile(x, extra);
    for (let i = 0; i < x.length; i++) out[i] = out[i]! + e[i]!;
  }
  return out;
}

const SERUM_FILM: MixturePart[] = [
  { id: 'albumin-human', share: 0.5 },
  { id: 'igg-human', share: 0.22 },
  { id: 'triolein', share: 0.08 },
  { id: 'phosphatidylcholine', share: 0.05 },
  { id: 'cholesteryl-oleate', share: 0.04 },
  { id: 'glucose', share: 0.05 },
  { id: 'urea', share: 0.03 },
  { id: 'sodium-lactate', share: 0.03 },
];

/** A nitrile stretch of a compound that is deliberately not in the library: the band the matcher must leave unexplained. */
const UNLISTED_NITRILE: Band[] = [{ position: 2228, fwhm: 12, height: 0.04 }];

export const SPIKED_MIXTURE: MixturePart[] = [
  { id: 'albumin-human', share: 0.6 },
  { id: 'triolein', share: 0.2 },
  { id: 'glucose', share: 0.15 },
  { id: 'paracetamol', share: 0.05 },
];

function unknownFiles(rng: SeededRandom): DemoFile[] {
  const files: DemoFile[] = [];
  const step = 2;
  const x = axis(4000, 600, step);

  // u01: a single compound from another bench (descending %T CSV) — the top hit should be caffeine.
  const caffeine = measure(
    x,
    bandProfile(x, find('caffeine').bands, { scale: 0.7, lorentzianFraction: 0.55 }),
    rng,
    0.003,
  );
  files.push({
    path: 'unknowns/u01-single-compound.csv',
    content: delimited(x, caffeine, 'csv-percent-t', 'Unknown u01 (synthetic)'),
  });

  // u02: four components, the drug spiked at 5 % of the integrated signal, noise and a sloped baseline.
  const spiked = measure(x, mix(x, step, SPIKED_MIXTURE, 180), rng, 0.002);
  files.push({
    path: 'unknowns/u02-spiked-mixture.jdx',
    content: writeJcampDx(
      { wavenumber: x, absorbance: spiked },
      { form: 'difdup', title: 'Unknown u02 (synthetic)', meta: {} },
    ),
  });

  // u03: a dried serum film with a band from a compound outside the library.
  const serum = measure(x, mix(x, step, SERUM_FILM, 220, UNLISTED_NITRILE), rng, 0.0015);
  files.push({
    path: 'unknowns/u03-serum-film.csv',
    content: delimited(x, serum, 'csv-decimal-comma', 'Unknown u03 (synthetic)'),
  });

  const truth = {
    note: 'Synthetic ground truth of the demo unknowns. Shares are fractions of the integrated absorbance.',
    unknowns: {
      'u01-single-compound.csv': { components: [{ id: 'caffeine', share: 1 }] },
      'u02-spiked-mixture.jdx': { components: SPIKED_MIXTURE, spiked: 'paracetamol' },
      'u03-serum-film.csv': {
        components: SERUM_FILM,
        unlistedBands: UNLISTED_NITRILE.map((b) => b.position),
      },
      'u04-tunable-laser.csv': {
        components: [{ id: 'aspirin', share: 1 }],
        coverage: { min: 1000, max: 1750 },
      },
    },
  };
  files.push({ path: 'unknowns/truth.json', content: `${JSON.stringify(truth, null, 2)}\n` });
  return files;
}

function biofluidReference(rng: SeededRandom): DemoFile[] {
  const step = 2;
  const x = axis(4000, 600, step);
  const y = measure(x, mix(x, step, SERUM_FILM, 200), rng, 0.0015);
  const compound: DemoCompound = {
    id: 'pooled-serum-film',
    name: 'Pooled serum, dried film',
    class: 'biofluid',
    source: 'synthetic mixture of the demo proteins, lipids and metabolites',
    bands: [],
  };
  const cal: DemoCompound = {
    id: 'albumin-glucose-mix',
    name: 'Albumin–glucose calibration mixture (4:1)',
    class: 'mixture',
    source: 'synthetic mixture of the demo albumin and glucose entries',
    bands: [],
  };
  const calY = measure(
    x,
    mix(
      x,
      step,
      [
        { id: 'albumin-human', share: 0.8 },
        { id: 'glucose', share: 0.2 },
      ],
      150,
    ),
    rng,
    0.0015,
  );
  return [
    {
      path: '40-pooled-serum-film.csv',
      content: delimited(x, y, 'csv-decimal-comma', `${compound.name} (synthetic)`),
    },
    {
      path: '40-pooled-serum-film.meta.json',
      content: sidecar(compound, 'csv-decimal-comma', {
        sampleForm: 'dried film',
        preparation: 'air-dried 5 µL drop (synthetic)',
      }),
    },
    {
      path: '41-albumin-glucose-mix.jdx',
      content: writeJcampDx(
        { wavenumber: x, absorbance: calY },
        { form: 'difdup', title: `${cal.name} (synthetic)`, meta: {} },
      ),
    },
    { path: '41-albumin-glucose-mix.meta.json', content: sidecar(cal, 'jcamp-difdup') },
  ];
}

/** All demo files, in a fixed order; the same seed gives the same bytes. */
export function generateDemoLibrary(options: GenerateDemoLibraryOptions = {}): DemoFile[] {
  const rng = seededRandom(options.seed ?? 20261201);
  const files: DemoFile[] = [];
  demoCompounds.forEach((compound, index) => {
    files.push(...referenceFile(compound, index, rng));
  });
  files.push(...biofluidReference(rng));
  files.push(...unknownFiles(rng));
  files.push(...timeDomainDemoFiles(rng, (id) => find(id).bands));
  return files;
}
