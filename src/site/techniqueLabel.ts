// The display name of a metadata technique code (`atr` → `ATR`); unknown codes print as given.

export interface TechniqueLabelOptions {
  /** Printed when no technique is recorded.
   * @default 'not recorded' */
  missing?: string;
}

const LABELS: Record<string, string> = {
  atr: 'ATR',
  transmission: 'transmission',
  'diffuse-reflectance': 'diffuse reflectance',
  'tunable-laser': 'tunable laser',
  'field-resolved': 'field-resolved time-domain',
  other: 'other',
};

export function techniqueLabel(code: string | undefined, options: TechniqueLabelOptions = {}): string {
  if (code === undefined || code === '') return options.missing ?? 'not recorded';
  return LABELS[code] ?? code;
}
