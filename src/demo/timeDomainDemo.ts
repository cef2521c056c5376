// Synthetic demo files for the instruments beyond FTIR: field-resolved traces, a tunable-laser and a fine-spaced spectrum.
//
// Everything here is invented (the fictitious "Alder Row" benches) and labelled synthetic. The field-resolved
// measurements are built the way the light makes them: a few-cycle reference pulse, and a sample field equal to the
// reference multiplied in the frequency domain by a causal transmission exp(−(ln 10 / 2)·χ(f)), where χ is a sum of
// complex Lorentzians. Re χ is then exactly the absorbance −log10(|E_s|²/|E_r|²) the reader should recover, and the
// molecular response in time is the free-induction decay of each band (dephasing time T₂ = 1 / (π c FWHM)).
import FFT from 'fft.js';
import type { Band } from './bandProfile.js';
import { bandProfile } from './bandProfile.js';
import { type SeededRandom, seededRandom } from './seededRandom.js';

export interface TimeDomainDemoFile {
  /** Path relative to the demo's `library/` folder. */
  path: string;
  content: string;
}

/** One synthetic measurement: which demo compound's bands it carries and what the entry is called. */
export interface TimeDomainDemoMeasurement {
  /** The demo compound whose bands are used (passed to `bandsOf`). */
  compound: string;
  /** Entry id and name of the new library entry. */
  id: string;
  name: string;
  class: string;
}

export interface TimeDomainDemoOptions {
  /**
   * Delay step of the traces, fs: 2 fs samples up to 250 THz (8339 cm⁻¹), well above the mid-infrared.
   * @default 2
   */
  step?: number;
  /**
   * Samples per trace (8.2 ps at 2 fs, long enough for the free-induction decay of an 8 cm⁻¹ band to fade).
   * @default 4096
   */
  points?: number;
  /**
   * The two field-resolved measurements; the second is recorded as three repeated scans with timing jitter.
   * @default paracetamol and D-glucose
   */
  fieldResolved?: [TimeDomainDemoMeasurement, TimeDomainDemoMeasurement];
  /**
   * The compound of the tunable-laser unknown (1750–1000 cm⁻¹, scattered points).
   * @default 'aspirin'
   */
  tunableLaser?: string;
  /**
   * The fine-spaced (0.1 cm⁻¹) library entry.
   * @default ethanol
   */
  fineSpaced?: TimeDomainDemoMeasurement;
}

const CONTRIBUTOR = 'Alder Row biofluid group (fictitious)';
const NOTE =
  'Synthetic demo data made by the bandshelf demo generator from invented parameters (band positions from the demo compound table). Not a measurement.';
/** cm⁻¹ per THz (ν̃ = f / c). */
const PER_THZ = 1e12 / 29_979_245_800;

const DEFAULT_FIELD_RESOLVED: [TimeDomainDemoMeasurement, TimeDomainDemoMeasurement] = [
  {
    compound: 'paracetamol',
    id: 'paracetamol-field-resolved',
    name: 'Paracetamol, field-resolved (synthetic)',
    class: 'drug',
  },
  {
    compound: 'glucose',
    id: 'glucose-field-resolved',
    name: 'D-Glucose, field-resolved (synthetic)',
    class: 'carbohydrate',
  },
];
const DEFAULT_FINE: TimeDomainDemoMeasurement = {
  compound: 'ethanol',
  id: 'ethanol-fine-spaced',
  name: 'Ethanol, 0.1 cm⁻¹ point spacing (synthetic)',
  class: 'solvent',
};

function fmt(v: number, digits: number): string {
  return Number(v.toFixed(digits)).toString();
}

function sidecar(m: TimeDomainDemoMeasurement, extra: Record<string, unknown>): string {
  const meta = {
    id: m.id,
    name: m.name,
    class: m.class,
    contributor: CONTRIBUTOR,
    date: '2026-11-09',
    licence: 'CC0-1.0',
    source: 'synthetic; band positions from the demo compound table',
    tags: ['synthetic', 'demo', m.class],
    notes: NOTE,
    synthetic: true,
    ...extra,
  };
  return `${JSON.stringify(meta, null, 2)}\n`;
}

interface PulseShape {
  /** Peak time, fs. */
  t0: number;
  /** Intensity FWHM, fs. */
  tau: number;
  /** Carrier, THz. */
  carrier: number;
  /** Carrier-envelope phase, rad. */
  phase: number;
}

/**
 * The sample and reference fields of one scan on a padded axis, built in the frequency domain: the reference
 * pulse's spectrum, times the sample's transmission, each delayed by `jitter` fs. Returns the first `points`
 * samples of each.
 */
function scanFields(
  bands: readonly Band[],
  scale: number,
  pulse: PulseShape,
  step: number,
  points: number,
  jitter: { sample: number; reference: number },
): { sample: Float64Array; reference: Float64Array } {
  let size = 2;
  while (size < 4 * points) size *= 2;
  const fft = new FFT(size);
  const data = new Float64Array(2 * size);
  for (let i = 0; i < size; i++) {
    const t = i * step - pulse.t0;
    data[2 * i] =
      Math.exp((-2 * Math.LN2 * t * t) / (pulse.tau * pulse.tau)) *
      Math.cos(2 * Math.PI * pulse.carrier * 1e-3 * t + pulse.phase);
  }
  const ref = new Float64Array(2 * size);
  fft.transform(ref, data);
  const sam = new Float64Array(2 * size);
  // The sample also slows the pulse by 25 fs and reflects a little (a flat 0.04 absorbance offset).
  const sampleDelay = 25;
  const offset = 0.04;
  const half = (Math.LN10 / 2) * scale;
  for (let k = 0; k < size; k++) {
    const f = (k <= size / 2 ? k : k - size) * (1000 / (size * step)); // THz, signed
    let chiRe = (offset / scale) * 1;
    let chiIm = 0;
    for (const band of bands) {
      const fk = band.position / PER_THZ;
      const g = band.fwhm / 2 / PER_THZ;
      // h·γ/(γ + i(f − f_k)) + h·γ/(γ + i(f + f_k)): causal, Hermitian, Re = Lorentzian of height h at ±f_k.
      for (const d of [f - fk, f + fk]) {
        const den = g * g + d * d;
        chiRe += (band.height * g * g) / den;
        chiIm += (-band.height * g * d) / den;
      }
    }
    const mag = Math.exp(-half * chiRe);
    const phi = -half * chiIm;
    const re = ref[2 * k]!;
    const im = ref[2 * k + 1]!;
    // Nyquist bin kept real so the inverse transform stays real.
    const delayS = k === size / 2 ? 0 : -2 * Math.PI * f * 1e-3 * (sampleDelay + jitter.sample);
    const delayR = k === size / 2 ? 0 : -2 * Math.PI * f * 1e-3 * jitter.reference;
    const cs = mag * Math.cos(phi + delayS);
    const ss = mag * Math.sin(phi + delayS);
    sam[2 * k] = re * cs - im * ss;
    sam[2 * k + 1] = re * ss + im * cs;
    const cr = Math.cos(delayR);
    const sr = Math.sin(delayR);
    ref[2 * k] = re * cr - im * sr;
    ref[2 * k + 1] = re * sr + im * cr;
  }
  const outS = new Float64Array(2 * size);
  const outR = new Float64Array(2 * size);
  fft.inverseTransform(outS, sam);
  fft.inverseTransform(outR, ref);
  const sample = new Float64Array(points);
  const reference = new Float64Array(points);
  for (let i = 0; i < points; i++) {
    sample[i] = outS[2 * i]!;
    reference[i] = outR[2 * i]!;
  }
  return { sample, reference };
}

function traceCsv(title: string, unit: 'fs' | 'ps', step: number, field: Float64Array): string {
  const lines = [
    `# ${title}`,
    '# synthetic field-resolved trace (bandshelf demo generator); not a measurement',
    unit === 'fs' ? 'delay_fs,field' : 'time_ps,E',
  ];
  for (let i = 0; i < field.length; i++) {
    const t = i * step;
    lines.push(`${unit === 'fs' ? fmt(t, 3) : fmt(t / 1000, 6)},${Number(field[i]!.toPrecision(7))}`);
  }
  return `${lines.join('\n')}\n`;
}

/**
 * The demo's field-resolved measurements (sample and reference traces plus one sidecar each naming them under
 * `timeDomain`), the tunable-laser unknown `unknowns/u04-tunable-laser.csv`, and the fine-spaced library entry.
 * `bandsOf(id)` gives a demo compound's bands (heights relative to its strongest band). The same random source state
 * gives the same bytes.
 */
export function timeDomainDemoFiles(
  random: SeededRandom | number,
  bandsOf: (compound: string) => readonly Band[],
  options: TimeDomainDemoOptions = {},
): TimeDomainDemoFile[] {
  const rng = typeof random === 'number' ? seededRandom(random) : random;
  const step = options.step ?? 2;
  const points = options.points ?? 4096;
  const measurements = options.fieldResolved ?? DEFAULT_FIELD_RESOLVED;
  const files: TimeDomainDemoFile[] = [];
  const pulse: PulseShape = { t0: 1200, tau: 18, carrier: 52, phase: 0.3 };
  // Noise of each scan relative to the peak field: about 6 orders of spectral dynamic range.
  const noise = 1.5e-4;

  measurements.forEach((m, index) => {
    const bands = bandsOf(m.compound);
    const repeats = index === 0 ? 1 : 3;
    const unit: 'fs' | 'ps' = index === 0 ? 'fs' : 'ps';
    const sampleNames: string[] = [];
    const referenceNames: string[] = [];
    for (let r = 0; r < repeats; r++) {
      // Scan-to-scan timing jitter of a few hundred attoseconds, as a delay stage and laser drift give.
      const jitter =
        repeats === 1
          ? { sample: 0, reference: 0 }
          : { sample: 0.3 * rng.normal(), reference: 0.3 * rng.normal() };
      const { sample, reference } = scanFields(bands, 0.5, pulse, step, points, jitter);
      let peak = 0;
      for (const v of reference) peak = Math.max(peak, Math.abs(v));
      for (let i = 0; i < points; i++) {
        sample[i] = sample[i]! + noise * peak * rng.normal();
        reference[i] = reference[i]! + noise * peak * rng.normal();
      }
      const suffix = repeats === 1 ? '' : `-${r + 1}`;
      const sampleName = `${m.id}-sample${suffix}.csv`;
      const referenceName = `${m.id}-reference${suffix}.csv`;
      sampleNames.push(sampleName);
      referenceNames.push(referenceName);
      files.push({
        path: `time-domain/${sampleName}`,
        content: traceCsv(`${m.name}: sample scan ${r + 1}`, unit, step, sample),
      });
      files.push({
        path: `time-domain/${referenceName}`,
        content: traceCsv(`${m.name}: reference scan ${r + 1} (empty cell)`, unit, step, reference),
      });
    }
    files.push({
      path: `time-domain/${m.id}.meta.json`,
      content: sidecar(m, {
        technique: 'field-resolved',
        sampleForm: 'dried film on a diamond window',
        tags: ['synthetic', 'demo', m.class, 'field-resolved'],
        timeDomain: { sample: sampleNames, reference: referenceNames },
      }),
    });
  });

  // Tunable-laser unknown: scattered points every 1–3 cm⁻¹ from 1750 down to 1000 cm⁻¹, as a swept laser logs them.
  const tunable = options.tunableLaser ?? 'aspirin';
  const xs: number[] = [];
  for (let x = 1750; x >= 1000; x -= 1 + 2 * rng.uniform()) xs.push(x);
  const tx = Float64Array.from(xs);
  const ty = bandProfile(tx, bandsOf(tunable), { scale: 0.6, lorentzianFraction: 0.5 });
  const tlLines = [
    '# Unknown u04, tunable-laser bench (synthetic)',
    '# synthetic demo spectrum (bandshelf demo generator); not a measurement',
    'wavenumber_cm-1,absorbance',
  ];
  for (let i = 0; i < tx.length; i++)
    tlLines.push(`${fmt(tx[i]!, 3)},${fmt(ty[i]! + 0.02 + 0.003 * rng.normal(), 6)}`);
  files.push({ path: 'unknowns/u04-tunable-laser.csv', content: `${tlLines.join('\n')}\n` });

  // Fine-spaced entry: 0.1 cm⁻¹ points from 3200 to 900 cm⁻¹, far finer than the 2 cm⁻¹ library grid.
  const fine = options.fineSpaced ?? DEFAULT_FINE;
  const n = Math.round((3200 - 900) / 0.1) + 1;
  const fx = new Float64Array(n);
  for (let i = 0; i < n; i++) fx[i] = 900 + i * 0.1;
  const fy = bandProfile(fx, bandsOf(fine.compound), { scale: 0.7, lorentzianFraction: 0.6 });
  const fineLines = [
    `# ${fine.name}`,
    '# synthetic demo spectrum (bandshelf demo generator); not a measurement',
    'wavenumber_cm-1,absorbance',
  ];
  for (let i = 0; i < n; i++)
    fineLines.push(`${fmt(fx[i]!, 1)},${fmt(fy[i]! + 0.015 + 0.004 * rng.normal(), 5)}`);
  files.push({ path: `fine-spaced/${fine.id}.csv`, content: `${fineLines.join('\n')}\n` });
  files.push({
    path: `fine-spaced/${fine.id}.meta.json`,
    content: sidecar(fine, {
      technique: 'transmission',
      sampleForm: 'liquid, 15 µm cell',
      resolution: 0.1,
      tags: ['synthetic', 'demo', fine.class, 'fine-spaced'],
    }),
  });
  return files;
}
