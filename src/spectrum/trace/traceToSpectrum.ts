// Turns field-resolved sample and reference traces into an absorbance spectrum, with its coverage and quality figures.
//
// Contract for the library (`add --time-domain`):
//   traceToSpectrum(samples: Trace | Trace[], references: Trace | Trace[], step: TimeDomainStep, options?)
//     → { spectrum, dynamicRangeOrders, timingSpreadAs, timingJitterAs, coverage, noiseFrom, spacing, warnings }
// `samples` and `references` come from readTimeTrace (delay already in fs). `step` is recipe.timeDomain (parsed or
// not; it is parsed here with its defaults). The spectrum is in cm⁻¹ ascending, absorbance A = −log10(|E_s|²/|E_r|²),
// and holds ONLY the wavenumbers where the reference power ≥ step.powerThreshold × its peak (and, with
// step.noiseFloorFactor k, where both spectra's amplitudes exceed k × the reference trace's noise floor): everything else is not
// covered (absent, so resampleToGrid leaves the grid NaN there). Store dynamicRangeOrders and timingSpreadAs with the
// revision. Throws BandshelfError (BAD_RECIPE, BAD_FORMAT, TOO_FEW_POINTS, NOT_FINITE, NOT_MONOTONIC, NOT_A_SPECTRUM).
import type { z } from 'zod';
import { BandshelfError } from '../../error.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import { type TimeDomainStep, timeDomainSchema } from '../../schema/recipe.js';
import type { Spectrum } from '../types.js';
import { alignTraces } from './alignTraces.js';
import { apodise } from './apodise.js';
import { averageTraces } from './averageTraces.js';
import { fieldSpectrum } from './fieldSpectrum.js';
import { mainPulseIndex } from './mainPulseIndex.js';
import { removeMean } from './removeMean.js';
import { sampleEchoes } from './sampleEchoes.js';
import { type NoiseSource, spectralDynamicRange } from './spectralDynamicRange.js';
import { timeGate } from './timeGate.js';
import { traceTimeStep } from './traceTimeStep.js';
import type { Trace, TraceWarning } from './types.js';
import { wavenumberFromTerahertz } from './wavenumberFromTerahertz.js';
import { zeroFill } from './zeroFill.js';

export interface TraceToSpectrumOptions {
  /**
   * Names for the sample traces, then the reference traces, used in errors (e.g. the file names).
   * @default []
   */
  files?: readonly string[];
  /**
   * Where the reference's noise floor comes from (see spectralDynamicRange).
   * @default 'auto'
   */
  noiseFrom?: 'auto' | NoiseSource;
  /**
   * Largest relative difference allowed between the delay steps of the traces.
   * @default 0.001
   */
  stepTolerance?: number;
  /**
   * Largest delay (fs) searched either way when aligning repeated traces.
   * @default pulseDelay's (200)
   */
  maxDelay?: number;
  /**
   * The library grid's step, cm⁻¹: a warning is given when the record-length resolution 1/(c·T) is coarser than
   * two grid steps (the grid would then show finer detail than the record holds).
   * @default undefined (no such warning)
   */
  gridStep?: number;
}

/** Speed of light in vacuum, cm/s (exact, SI definition of the metre). */
const C_CM_PER_S = 29979245800;

export interface TraceToSpectrumResult {
  /** Absorbance on the covered wavenumbers only, ascending cm⁻¹. */
  spectrum: Spectrum;
  /** The reference's spectral dynamic range, log10(peak power / noise floor). */
  dynamicRangeOrders: number;
  /** Residual timing spread after aligning repeated traces, attoseconds (pooled over sample and reference sets); null when each set is one trace. */
  timingSpreadAs: number | null;
  /** Spread of the delays removed by alignment, attoseconds (pooled); null when each set is one trace. */
  timingJitterAs: number | null;
  /** Lowest and highest covered wavenumber, cm⁻¹. */
  coverage: { min: number; max: number };
  noiseFrom: NoiseSource;
  /** Wavenumber spacing of the spectrum's points (after zero-filling), cm⁻¹. */
  spacing: number;
  /**
   * Resolution the record length allows, 1/(c·T) cm⁻¹ with T the delay span used (the traces' span, narrowed to
   * the gate): the standard Fourier pair, common practice. Apodisation broadens the line shape beyond it;
   * zero-filling only interpolates, so `spacing` is finer than this without resolving more.
   */
  recordResolution: number;
  warnings: TraceWarning[];
}

function asList(traces: Trace | readonly Trace[]): readonly Trace[] {
  return 'time' in traces ? [traces as Trace] : (traces as readonly Trace[]);
}

/** Pooled standard deviation of several sets from their individual ones (√ of the dof-weighted mean variance). */
function pooled(parts: { sd: number | null; count: number }[]): number | null {
  let ss = 0;
  let dof = 0;
  for (const part of parts) {
    if (part.sd === null) continue;
    ss += part.sd * part.sd * (part.count - 1);
    dof += part.count - 1;
  }
  return dof > 0 ? Math.sqrt(ss / dof) : null;
}

/**
 * Processing, in the order the recipe records it: check each trace (finite, uniform delay step shared by all);
 * remove the mean; align repeated traces of each set on their main pulse and average them; time gate (step.gate,
 * in step.timeUnit); apodise with one window centred on the reference's main pulse and reaching the far end of the
 * record (or gate), the same for sample and reference; zero-fill both to one power-of-two length (step.zeroFill);
 * FFT; frequency → wavenumber (ν̃ = f / c); absorbance where the reference power passes the threshold and, with
 * `noiseFloorFactor` k, where both the sample's and the reference's amplitude exceed k × the noise floor.
 */
export function traceToSpectrum(
  samples: Trace | readonly Trace[],
  references: Trace | readonly Trace[],
  step: TimeDomainStep | z.input<typeof timeDomainSchema> = {},
  options: TraceToSpectrumOptions = {},
): TraceToSpectrumResult {
  const parsed = timeDomainSchema.safeParse(step);
  if (!parsed.success) {
    throw metaErrorFromIssues(parsed.error.issues, {
      code: 'BAD_RECIPE',
      prefix: 'timeDomain',
      knownFields: Object.keys(timeDomainSchema.shape),
    });
  }
  const recipe = parsed.data;
  const files = options.files ?? [];
  const stepTolerance = options.stepTolerance ?? 1e-3;
  const sampleList = asList(samples);
  const referenceList = asList(references);
  if (sampleList.length === 0) throw new BandshelfError('TOO_FEW_POINTS', 'no sample trace was given');
  if (referenceList.length === 0) throw new BandshelfError('TOO_FEW_POINTS', 'no reference trace was given');
  const warnings: TraceWarning[] = [];

  const all = [...sampleList, ...referenceList];
  let dt = 0;
  for (const [index, trace] of all.entries()) {
    const file = files[index];
    const s = traceTimeStep(trace, file === undefined ? {} : { file });
    if (index === 0) dt = s;
    else if (Math.abs(s - dt) > stepTolerance * dt) {
      throw new BandshelfError(
        'BAD_FORMAT',
        `this trace is sampled every ${s.toPrecision(6)} fs, the first sample trace every ${dt.toPrecision(6)} fs: sample and reference must share one delay step`,
        file === undefined ? {} : { file },
      );
    }
  }

  const alignOptions = options.maxDelay === undefined ? {} : { maxDelay: options.maxDelay };
  const combine = (list: readonly Trace[]) => {
    const centred = list.map((trace) => removeMean(trace));
    if (centred.length === 1) return { trace: centred[0]!, spread: null, jitter: null, count: 1 };
    const aligned = alignTraces(centred, alignOptions);
    return {
      trace: averageTraces(aligned.traces),
      spread: aligned.timingSpreadAs,
      jitter: aligned.timingJitterAs,
      count: centred.length,
    };
  };
  const sample = combine(sampleList);
  const reference = combine(referenceList);

  // The gate is given in the files' delay unit; the traces are already in fs.
  const unit = recipe.timeUnit === 'ps' ? 1000 : 1;
  const gate = recipe.gate;
  const ref = reference.trace;
  const refTime = ref.time;
  const centre = refTime[Math.max(0, mainPulseIndex(ref))]!;
  let lo = Math.min(refTime[0]!, sample.trace.time[0]!);
  let hi = Math.max(refTime[refTime.length - 1]!, sample.trace.time[sample.trace.time.length - 1]!);
  if (gate !== null) {
    lo = Math.max(lo, gate.start * unit);
    hi = Math.min(hi, gate.end * unit);
  }
  const halfWidth = Math.max(Math.abs(centre - lo), Math.abs(hi - centre), dt);
  // A pulse replica only the sample has (a reflection in the sample cell) is read as absorbance unless gated out.
  const [echo] = sampleEchoes(sample.trace, ref, {
    window: gate === null ? null : { start: gate.start * unit, end: gate.end * unit },
  });
  if (echo !== undefined) {
    warnings.push({
      message: `the sample trace shows a replica of the pulse ${Math.abs(echo.delay).toFixed(0)} fs ${echo.delay > 0 ? 'after' : 'before'} its main pulse (${(100 * echo.sample).toPrecision(2)} % of it in field) that the reference lacks: its interference is read as absorbance; gate it out (timeDomain.gate) or record the reference with the same echo`,
    });
  }
  // T in fs; 1/(c·T) in cm⁻¹.
  const recordResolution = 1e15 / (C_CM_PER_S * Math.max(hi - lo, dt));
  if (options.gridStep !== undefined && recordResolution > 2 * options.gridStep) {
    warnings.push({
      message: `the record spans ${((hi - lo) / 1000).toPrecision(3)} ps, so its resolution 1/(c·T) is ${recordResolution.toPrecision(3)} cm⁻¹, coarser than two steps of the ${options.gridStep} cm⁻¹ grid: bands narrower than that are broadened and lowered (record longer, or compare at that resolution)`,
    });
  }
  const window = (trace: Trace): Trace => {
    const gated =
      gate === null
        ? trace
        : timeGate(trace, { start: gate.start * unit, end: gate.end * unit, edge: gate.edge * unit });
    return apodise(gated, { window: recipe.apodisation, centre, halfWidth });
  };
  const weights = window({ time: refTime, field: new Float64Array(refTime.length).fill(1) }).field;
  const windowedSample = window(sample.trace);
  const windowedReference = window(ref);

  let length = 2;
  const longest = Math.max(windowedSample.time.length, windowedReference.time.length);
  while (length < longest * recipe.zeroFill) length *= 2;
  const sampleSpectrum = fieldSpectrum(zeroFill(windowedSample, { length }));
  const referenceSpectrum = fieldSpectrum(zeroFill(windowedReference, { length }));

  const range = spectralDynamicRange(referenceSpectrum, {
    trace: ref,
    weights,
    noiseFrom: options.noiseFrom ?? 'auto',
  });

  const pr = referenceSpectrum.power;
  const ps = sampleSpectrum.power;
  const threshold = recipe.powerThreshold * range.peakPower;
  // Both spectra must stand k × (in amplitude) above the reference trace's noise floor, so noise is not read as bands.
  const factor = recipe.noiseFloorFactor;
  const floor = factor === undefined || factor === null ? 0 : factor * factor * range.noiseFloor;
  const keep: number[] = [];
  let dropped = 0;
  let belowFloor = 0;
  for (let k = 1; k < pr.length; k++) {
    if (!(pr[k]! >= threshold)) continue;
    if (floor > 0 && !(pr[k]! > floor && ps[k]! > floor)) {
      belowFloor++;
      continue;
    }
    if (!(ps[k]! > 0) || !Number.isFinite(ps[k]!)) {
      dropped++;
      continue;
    }
    keep.push(k);
  }
  if (belowFloor > 0) {
    warnings.push({
      message: `${belowFloor} frequency bin(s) above the power threshold had the sample or the reference within ${factor} × the noise floor (in amplitude) and were left not covered`,
    });
  }
  if (dropped > 0) {
    warnings.push({
      message: `${dropped} covered bin(s) had no sample power (infinite absorbance) and were left out`,
    });
  }
  if (keep.length < 2) {
    throw new BandshelfError(
      'NOT_A_SPECTRUM',
      'fewer than two frequency bins pass the reference power threshold: the traces carry no usable spectrum',
      { field: 'timeDomain.powerThreshold' },
    );
  }
  const wavenumber = new Float64Array(keep.length);
  const absorbance = new Float64Array(keep.length);
  const frequency = referenceSpectrum.frequency;
  for (let j = 0; j < keep.length; j++) {
    const k = keep[j]!;
    wavenumber[j] = wavenumberFromTerahertz(frequency[k]!);
    absorbance[j] = -Math.log10(ps[k]! / pr[k]!);
  }
  if (keep[keep.length - 1] === pr.length - 1) {
    warnings.push({
      message:
        'the reference power is still above the threshold at the Nyquist frequency: the delay step is too coarse and the spectrum may be aliased',
    });
  }
  return {
    spectrum: { wavenumber, absorbance },
    dynamicRangeOrders: range.orders,
    timingSpreadAs: pooled([
      { sd: sample.spread, count: sample.count },
      { sd: reference.spread, count: reference.count },
    ]),
    timingJitterAs: pooled([
      { sd: sample.jitter, count: sample.count },
      { sd: reference.jitter, count: reference.count },
    ]),
    coverage: { min: wavenumber[0]!, max: wavenumber[wavenumber.length - 1]! },
    noiseFrom: range.noiseFrom,
    spacing: wavenumberFromTerahertz(frequency[1]! - frequency[0]!),
    recordResolution,
    warnings,
  };
}
