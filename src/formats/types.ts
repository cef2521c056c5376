// Shapes shared by the readers and writers: what a parsed spectrum file gives the library.
import type { Spectrum } from '../spectrum/types.js';

/** The abscissa units a source file may be in (the one declaration); readers always convert to cm⁻¹. */
export const X_UNITS = ['cm-1', 'um', 'nm', 'thz'] as const;
export type XUnit = (typeof X_UNITS)[number];

/** The ordinate units a source file may be in (the one declaration); readers always convert to decadic absorbance. */
export const Y_UNITS = ['absorbance', 'transmittance', 'percent-transmittance'] as const;
export type YUnit = (typeof Y_UNITS)[number];

/** Something a reader tolerated but the user should hear about (a bent rule, a guessed unit …). */
export interface ParseWarning {
  /** 1-based line of the file, where the warning is tied to one. */
  line?: number;
  message: string;
}

/** One spectrum read from a file: converted to cm⁻¹ and absorbance, ascending, finite, no duplicate x. */
export interface ParsedSpectrum {
  spectrum: Spectrum;
  /**
   * Labels the file carried, with camelCase keys: title, origin, owner, resolution (number when it reads as
   * one), state, samplingProcedure, cas, formula, casName, names, date, instrument, dataType, jcampVersion.
   * Only labels present and non-empty appear.
   */
  meta: Record<string, string | number>;
  source: {
    format: 'jcamp-dx' | 'delimited';
    /** The unit the file's abscissa was in before conversion. */
    xUnit: XUnit;
    /** The unit the file's ordinate was in before conversion. */
    yUnit: YUnit;
    /** 1-based position of this spectrum among the spectra of a JCAMP-DX file. */
    block?: number;
    /** Header name of the y column this spectrum came from, in a delimited file with several. */
    column?: string;
  };
  /**
   * 1 where the point (same index as spectrum.wavenumber) is saturated: its transmittance lay at or below the
   * absorbance ceiling's floor and was clipped. Such points are not covered: kept out of scoring, peaks and fits.
   */
  saturated?: Uint8Array;
  warnings: ParseWarning[];
}

/**
 * How to read a spectrum, given once by every command that reads one (see src/cli/readingOptions.ts): units that
 * override the file's, the block or column to take, and time-domain traces with their reference.
 */
export interface SpectrumReadOptions {
  xUnit?: XUnit;
  yUnit?: YUnit;
  /** 1-based block of a multi-block JCAMP-DX file. */
  block?: number;
  /** Header name or 1-based y-column number of a delimited file with several spectra. */
  column?: string | number;
  /** The files are field-resolved sample traces, each converted against `references`. */
  timeDomain?: boolean;
  /** Reference trace files for `timeDomain`, as the user named them. */
  references?: string[];
  /** Delay unit of time-domain traces, overriding their headers. */
  timeUnit?: 'fs' | 'ps';
}

/**
 * The one default size limit of an input file (spectrum, trace, sidecar, manifest), 200 MB: larger than any spectrum
 * or trace file seen in practice, small enough to read into memory.
 */
export const MAX_INPUT_BYTES = 200_000_000;
