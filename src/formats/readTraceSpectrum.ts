// Reads field-resolved sample and reference trace files (bytes) into one absorbance spectrum (browser-safe).
import type { TimeDomainStep } from '../schema/recipe.js';
import { type TraceToSpectrumResult, traceToSpectrum } from '../spectrum/trace/traceToSpectrum.js';
import { readTimeTrace } from './readTimeTrace.js';

/** One trace file: its name (for warnings and errors) and its bytes. */
export interface TraceFile {
  name: string;
  bytes: Uint8Array;
}

export interface TraceFiles {
  samples: readonly TraceFile[];
  references: readonly TraceFile[];
  /** The recipe's time-domain step (its noise floor pinned as the caller stores it). */
  step: TimeDomainStep;
}

export interface ReadTraceSpectrumOptions {
  /** Delay unit overriding the traces' headers (`--time-unit`). @default undefined (headers, else step.timeUnit) */
  timeUnit?: 'fs' | 'ps';
  /** The library grid's step, cm⁻¹, for the record-length resolution warning (see traceToSpectrum). @default undefined */
  gridStep?: number;
}

/**
 * The one reading of a trace pair, for `add --time-domain` (through readOriginals), `match`/`identify`/`bands
 * --from` with `--time-domain`, and the site's matcher: each file read with readTimeTrace, then traceToSpectrum. A
 * unit given explicitly overrides the headers; the step's unit only fills in for headers without one. The traces'
 * own warnings come after the conversion's, each prefixed with its file's name.
 */
export function readTraceSpectrum(
  input: TraceFiles,
  options: ReadTraceSpectrumOptions = {},
): TraceToSpectrumResult {
  const traceOptions = {
    timeUnit: options.timeUnit ?? input.step.timeUnit,
    overrideHeader: options.timeUnit !== undefined,
  };
  const files = [...input.samples, ...input.references];
  const traces = files.map((f) => readTimeTrace(f.bytes, { ...traceOptions, file: f.name }));
  const traceWarnings = files.flatMap((f, i) =>
    traces[i]!.warnings.map((w) => ({ ...w, message: `${f.name}: ${w.message}` })),
  );
  const result = traceToSpectrum(
    traces.slice(0, input.samples.length),
    traces.slice(input.samples.length),
    input.step,
    {
      files: files.map((f) => f.name),
      ...(options.gridStep === undefined ? {} : { gridStep: options.gridStep }),
    },
  );
  return { ...result, warnings: [...result.warnings, ...traceWarnings] };
}
