// Writes a spectrum as comma-separated text, wavenumber (cm⁻¹) and absorbance, at full double precision.
import { BandshelfError } from '../error.js';
import type { Spectrum } from '../spectrum/types.js';

export interface WriteCsvOptions {
  /** Start with the header row `wavenumber_cm-1,absorbance`, which readDelimited takes as the units. @default true */
  header?: boolean;
}

/**
 * Each number is written as the shortest decimal that reads back to the same double (ECMAScript
 * Number → String), so a write → read round trip is exact. Rows keep the spectrum's order (ascending).
 */
export function writeCsv(spectrum: Spectrum, options: WriteCsvOptions = {}): string {
  const { header = true } = options;
  const { wavenumber: x, absorbance: y } = spectrum;
  const n = Math.min(x.length, y.length);
  const rows: string[] = header ? ['wavenumber_cm-1,absorbance'] : [];
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    const yi = y[i]!;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) {
      throw new BandshelfError('NOT_FINITE', `point ${i} (${xi}, ${yi}) is not finite`);
    }
    rows.push(`${xi},${yi}`);
  }
  return `${rows.join('\n')}\n`;
}
