// Time-domain step 5: the one-sided Fourier transform of a field trace, with its spectral power |E(f)|².
import FFT from 'fft.js';
import type { FieldSpectrum, Trace } from './types.js';

export interface FieldSpectrumOptions {
  /**
   * Also drop the zero-frequency bin (it carries only the offset, and a wavenumber of 0 has no place in a spectrum).
   * @default false
   */
  dropZero?: boolean;
}

/**
 * Fourier-transforms a uniformly sampled trace with fft.js (radix-4, real input) and returns the bins 0 … N/2 with
 * frequency in THz (delay in fs, so 1 / fs = 1000 THz) and E(f) scaled by Δt, the Riemann sum of the continuous
 * transform, so spectra of traces with different steps compare. A length that is not a power of two is zero-filled
 * to the next one (fft.js needs it).
 */
export function fieldSpectrum(trace: Trace, options: FieldSpectrumOptions = {}): FieldSpectrum {
  const dropZero = options.dropZero ?? false;
  const { time, field } = trace;
  const n = time.length;
  const step = n > 1 ? (time[n - 1]! - time[0]!) / (n - 1) : 1;
  let size = 2;
  while (size < n) size *= 2;
  const input = new Float64Array(size);
  input.set(field);
  const fft = new FFT(size);
  const out = new Float64Array(2 * size);
  // realTransform fills bins 0 … N/2 of the interleaved complex output, which is all a real input needs.
  fft.realTransform(out, input);
  const first = dropZero ? 1 : 0;
  const bins = size / 2 + 1 - first;
  const frequency = new Float64Array(bins);
  const real = new Float64Array(bins);
  const imag = new Float64Array(bins);
  const power = new Float64Array(bins);
  const df = 1000 / (size * step);
  for (let j = 0; j < bins; j++) {
    const k = j + first;
    const re = out[2 * k]! * step;
    const im = out[2 * k + 1]! * step;
    frequency[j] = k * df;
    real[j] = re;
    imag[j] = im;
    power[j] = re * re + im * im;
  }
  return { frequency, real, imag, power };
}
