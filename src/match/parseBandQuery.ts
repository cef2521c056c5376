// Reads one band of a band-position query as a spectroscopist writes it: `1652`, `1652.5`, `1652cm-1` (any cm⁻¹
// spelling) or with a strength `1652:s` (strong), `:m`, `:w`. Shared by `bandshelf bands` and the site's search.
import { BandshelfError } from '../error.js';
import type { BandQuery, BandStrength } from './types.js';

export interface ParseBandQueryOptions {
  /** Field named in the error of a text that is not a band.
   * @default 'bands' */
  field?: string;
}

export function parseBandQuery(text: string, options: ParseBandQueryOptions = {}): BandQuery {
  const m =
    /^\s*(\d+(?:\.\d+)?)\s*(?:cm-1|cm−1|cm\^-1|cm\^\(-1\)|cm\*\*-1|cm⁻¹|1\/cm|\/cm)?\s*(?::\s*([smw]))?\s*$/i.exec(
      text,
    );
  if (!m) {
    throw new BandshelfError(
      'BAD_OPTION',
      `'${text}' is not a band position: give wavenumbers in cm⁻¹, optionally with :s, :m or :w (e.g. 1652:s)`,
      { field: options.field ?? 'bands' },
    );
  }
  const band: BandQuery = { position: Number(m[1]) };
  if (m[2] !== undefined) band.strength = m[2].toLowerCase() as BandStrength;
  return band;
}
