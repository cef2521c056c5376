// Reads a unit as people write it (`cm^-1`, `1/cm`, `µm`, `micron`, `THz`, `%T`, `abs` …) into bandshelf's unit names.
import { BandshelfError } from '../error.js';
import type { XUnit, YUnit } from './types.js';

export interface UnitFromTextOptions {
  /** Which axis the unit is for. @default 'x' */
  axis?: 'x' | 'y';
  /** Option or field named in the error. @default the axis */
  field?: string;
}

const X: [RegExp, XUnit][] = [
  [/^(cm-1|cm−1|cm\^-1|cm\^\(-1\)|cm\^\{-1\}|cm\*\*-1|cm⁻¹|1\/cm|wavenumbers?|kaysers?)$/, 'cm-1'],
  [/^(um|µm|μm|microns?|micromet(er|re)s?)$/, 'um'],
  [/^(nm|nanomet(er|re)s?)$/, 'nm'],
  [/^(thz|terahertz)$/, 'thz'],
];
const Y: [RegExp, YUnit][] = [
  [/^(a|abs|absorbance|au|od|optical density)$/, 'absorbance'],
  [/^(t|transmittance|transmission)$/, 'transmittance'],
  [
    /^(%t|% t|%|percent|percent-transmittance|percent transmittance|%transmittance)$/,
    'percent-transmittance',
  ],
];

/** Case and surrounding space do not matter; anything else → BAD_OPTION listing what is understood. */
export function unitFromText(text: string, options: UnitFromTextOptions = {}): XUnit | YUnit {
  const { axis = 'x', field = `${axis}-unit` } = options;
  const t = text.trim().toLowerCase().replace(/\s+/g, ' ');
  const table: [RegExp, XUnit | YUnit][] = axis === 'x' ? X : Y;
  for (const [pattern, unit] of table) if (pattern.test(t)) return unit;
  const known = axis === 'x' ? 'cm-1, um, nm, thz' : 'absorbance, transmittance, percent-transmittance';
  throw new BandshelfError(
    'BAD_OPTION',
    `--${field} ${JSON.stringify(text.slice(0, 30))} is not a unit bandshelf reads (${known})`,
    { field },
  );
}
