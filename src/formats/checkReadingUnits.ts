// Refuses a stated x or y unit that is not one of the readers' units, before any file is read.
import { BandshelfError } from '../error.js';
import { X_UNITS, Y_UNITS } from './types.js';

export interface CheckReadingUnitsOptions {
  /** The file named in the error. @default undefined */
  file?: string;
}

/** BAD_OPTION naming the field (`xUnit`, `yUnit`) and the units allowed; units as given by an API caller, not a user. */
export function checkReadingUnits(
  units: { xUnit?: string | undefined; yUnit?: string | undefined },
  options: CheckReadingUnitsOptions = {},
): void {
  for (const [field, value, allowed] of [
    ['xUnit', units.xUnit, X_UNITS],
    ['yUnit', units.yUnit, Y_UNITS],
  ] as const) {
    if (value !== undefined && !(allowed as readonly string[]).includes(value)) {
      const shown = JSON.stringify(value.length > 30 ? `${value.slice(0, 30)}…` : value);
      throw new BandshelfError('BAD_OPTION', `${field} ${shown} is not one of ${allowed.join(', ')}`, {
        file: options.file,
        field,
      });
    }
  }
}
