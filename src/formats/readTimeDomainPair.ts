// Reads field-resolved sample and reference trace files into one absorbance spectrum (browser-safe): the one
// conversion that `add --time-domain`, `match --time-domain` and the site's matcher all go through.
import type { TimeDomainStep } from '../schema/recipe.js';
import { type TraceToSpectrumResult, traceToSpectrum } from '../spectrum/trace/traceToSpectrum.js';
import { readTimeTrace, type TimeUnit } from './readTimeTrace.js';

/** One trace file: its name (for messages) and its bytes. */
export interface TraceFile {
  name: string;
  bytes: Uint8Array | string;
}

export interface ReadTimeDomainPairInput {
  /** Sample traces, averaged after alignment. */
  samples: readonly TraceFile[];
  /** Reference traces (no sample in the beam), averaged likewise. */
  references: readonly TraceFile[];
  /** The recipe's time-domain step. */
  step: TimeDomainStep;
}

export interface ReadTimeDomainPairOptions {
  /** The delay unit the user gave (`--time-unit`), overriding the files' headers.
   * @default undefined (each header's unit, else the step's `timeUnit`) */
  timeUnit?: TimeUnit;
}

/** The spectrum and its figures; the readers' warnings follow the conversion's, each prefixed with its file's name. */
export function readTimeDomainPair(
  input: ReadTimeDomainPairInput,
  options: ReadTimeDomainPairOptions = {},
): TraceToSpectrumResult {
  const { samples, references, step } = input;
  // An explicit unit overrides the headers; the step's unit only fills in for headers without one.
  const traceOptions = {
    timeUnit: options.timeUnit ?? step.timeUnit,
    overrideHeader: options.timeUnit !== undefined,
  };
  const all = [...samples, ...references];
  const traces = all.map((f) => readTimeTrace(f.bytes, { ...traceOptions, file: f.name }));
  const traceWarnings = all.flatMap((f, i) =>
    traces[i]!.warnings.map((w) => ({ ...w, message: `${f.name}: ${w.message}` })),
  );
  const result = traceToSpectrum(traces.slice(0, samples.length), traces.slice(samples.length), step, {
    files: all.map((f) => f.name),
  });
  return { ...result, warnings: [...result.warnings, ...traceWarnings] };
}
