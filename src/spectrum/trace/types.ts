// Shared shapes of the time-domain layer: a field trace and its complex spectrum, both as parallel typed arrays.

/**
 * A field-resolved time-domain trace: the electric field of the light sampled against delay.
 * `time` is in femtoseconds, ascending and uniformly spaced; `field` is in any (consistent) unit.
 */
export interface Trace {
  readonly time: Float64Array;
  readonly field: Float64Array;
}

/**
 * The one-sided Fourier transform of a trace, E(f) = Δt · Σ E(tₙ) e^(−2πi f tₙ'), on the bins 0 … N/2
 * (tₙ' counted from the first sample). Frequency in THz, field spectrum in field unit × fs.
 */
export interface FieldSpectrum {
  /** Bin frequencies, THz, ascending from 0 to the Nyquist frequency. */
  readonly frequency: Float64Array;
  readonly real: Float64Array;
  readonly imag: Float64Array;
  /** |E(f)|², the spectral power (unnormalised; only ratios and relative levels carry meaning). */
  readonly power: Float64Array;
}

/** A non-fatal note about a trace or its conversion, with the 1-based line where one applies. */
export interface TraceWarning {
  line?: number;
  message: string;
}
