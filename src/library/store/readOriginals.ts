// Derives the original spectra from stored file bytes: a spectrum file's blocks, or one spectrum from sample and
// reference traces. Ingest and `check` both go through here, so a stored original can always be re-derived.
import { BandshelfError } from '../../error.js';
import { readSpectrumFile } from '../../formats/readSpectrumFile.js';
import { readTimeDomainPair } from '../../formats/readTimeDomainPair.js';
import type { Recipe } from '../../schema/recipe.js';
import type { Spectrum } from '../../spectrum/types.js';
import type { SourceFile } from '../ingest/ingestTypes.js';
import type { ReadOptions, RevisionExtras } from '../types.js';

export interface ReadOriginalsInput {
  files: readonly SourceFile[];
  read: ReadOptions;
  recipe: Recipe;
}

export interface ReadOriginalsOptions {
  /** How the user named the (first) file, for errors.
   * @default the first file's stored name */
  label?: string;
  /** Largest file accepted, bytes (passed to the reader).
   * @default the reader's default */
  maxBytes?: number;
}

export interface OriginalRead {
  spectrum: Spectrum;
  /** Labels the file carried (JCAMP-DX TITLE, CAS REGISTRY NO …), camelCase keys. */
  labels: Record<string, string | number>;
  /** 1-based block of a multi-block file, when the file has several. */
  block?: number;
  /** Header name of the y column, when a delimited file has several. */
  column?: string;
  /** How many spectra the file holds in all. */
  blocks: number;
  extras: RevisionExtras;
  /** 1 per point clipped at the absorbance ceiling on reading (a saturated band), when any is. */
  saturated?: Uint8Array;
}

export function readOriginals(input: ReadOriginalsInput, options: ReadOriginalsOptions = {}): OriginalRead[] {
  const { files, read, recipe } = input;
  const label = options.label ?? files[0]?.name;
  if (recipe.timeDomain !== null) {
    const samples = files.filter((f) => f.role === 'sample-trace');
    const references = files.filter((f) => f.role === 'reference-trace');
    if (samples.length === 0 || references.length === 0) {
      throw new BandshelfError('BAD_OPTION', 'a time-domain entry needs sample and reference trace files', {
        file: label,
      });
    }
    const result = readTimeDomainPair(
      { samples, references, step: recipe.timeDomain },
      read.timeUnit === undefined ? {} : { timeUnit: read.timeUnit },
    );
    const extras: RevisionExtras = {
      dynamicRangeOrders: result.dynamicRangeOrders,
      traces: { sample: samples.length, reference: references.length },
    };
    if (result.timingSpreadAs !== null) extras.timingSpreadAs = result.timingSpreadAs;
    if (result.warnings.length > 0) extras.warnings = result.warnings;
    return [{ spectrum: result.spectrum, labels: {}, blocks: 1, extras }];
  }
  const data = files.find((f) => f.role === 'data');
  if (data === undefined || files.length !== 1) {
    throw new BandshelfError('BAD_OPTION', 'a spectrum entry holds exactly one data file', { file: label });
  }
  const parsed = readSpectrumFile(data.bytes, {
    file: label ?? data.name,
    ...(read.xUnit ? { xUnit: read.xUnit } : {}),
    ...(read.yUnit ? { yUnit: read.yUnit } : {}),
    ...(read.block ? { block: read.block } : {}),
    ...(read.column !== undefined ? { column: read.column } : {}),
    ...(options.maxBytes ? { maxBytes: options.maxBytes } : {}),
  });
  return parsed.map((p) => {
    const extras: RevisionExtras = {
      source: {
        format: p.source.format,
        xUnit: p.source.xUnit,
        yUnit: p.source.yUnit,
        ...(p.source.block !== undefined ? { block: p.source.block } : {}),
        ...(p.source.column !== undefined ? { column: p.source.column } : {}),
      },
    };
    if (p.warnings.length > 0) extras.warnings = p.warnings;
    const out: OriginalRead = { spectrum: p.spectrum, labels: p.meta, blocks: parsed.length, extras };
    if (p.source.block !== undefined) out.block = p.source.block;
    if (p.source.column !== undefined) out.column = p.source.column;
    if (p.saturated !== undefined) out.saturated = p.saturated;
    return out;
  });
}
