// Verifies a CAS Registry Number's shape and check digit, so a mistyped number never enters the library.

/** The shape of a CAS Registry Number: 2–7 digits (no leading zero), 2 digits, 1 check digit. */
const casPattern = /^([1-9]\d{1,6})-(\d{2})-(\d)$/;

export interface CasCheckDigitValidOptions {
  /**
   * Accept surrounding whitespace (trimmed before the check).
   * @default false
   */
  trim?: boolean;
}

/**
 * True when `cas` has the registry's shape and its check digit matches: the digits before the check digit,
 * weighted 1, 2, 3 … from the right, summed, modulo 10.
 */
export function casCheckDigitValid(cas: string, options: CasCheckDigitValidOptions = {}): boolean {
  const text = options.trim ? cas.trim() : cas;
  const match = casPattern.exec(text);
  if (!match) return false;
  const digits = `${match[1]}${match[2]}`;
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    sum += (digits.charCodeAt(digits.length - 1 - i) - 48) * (i + 1);
  }
  return sum % 10 === Number(match[3]);
}
