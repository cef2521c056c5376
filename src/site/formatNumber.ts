// Prints a number for a table cell: fixed decimals for positions, significant digits for heights and scores.

export interface FormatNumberOptions {
  /** Decimal places; when set, `significant` is ignored.
   * @default undefined */
  decimals?: number;
  /** Significant digits when `decimals` is not set.
   * @default 4 */
  significant?: number;
  /** Printed for NaN, ±Infinity, null and undefined.
   * @default '–' */
  missing?: string;
}

/** Never exponent notation for the magnitudes spectra have (1e-6 … 1e6); a minus sign, not a hyphen. */
export function formatNumber(value: number | null | undefined, options: FormatNumberOptions = {}): string {
  const missing = options.missing ?? '–';
  if (value === null || value === undefined || !Number.isFinite(value)) return missing;
  let text: string;
  if (options.decimals !== undefined) {
    text = value.toFixed(options.decimals);
  } else {
    const significant = options.significant ?? 4;
    if (value === 0) {
      text = '0';
    } else {
      const magnitude = Math.floor(Math.log10(Math.abs(value)));
      const decimals = Math.max(0, Math.min(20, significant - 1 - magnitude));
      text = Number(value.toPrecision(significant)).toFixed(decimals);
      // Trailing zeros carry no information in a table of measured values: 0.1200 prints as 0.12.
      if (text.includes('.')) text = text.replace(/\.?0+$/, '');
    }
  }
  if (/^-0(\.0*)?$/.test(text)) text = text.slice(1);
  return text.startsWith('-') ? `−${text.slice(1)}` : text;
}
