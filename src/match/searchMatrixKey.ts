// The identity of a search matrix: library state, row preparation and scoring mask.
import type { MatrixPreparation } from './searchTypes.js';

/** Bump when the matrix contents or layout change meaning, so old disk caches are never read as current. */
const MATRIX_FORMAT = 1;

/** A readable string; the mask is written as index ranges (`0-56,117-1700`), so equal masks give equal keys. */
export function searchMatrixKey(input: {
  stateKey: string;
  preparation: MatrixPreparation;
  mask: Uint8Array;
}): string {
  const { stateKey, preparation, mask } = input;
  const runs: string[] = [];
  let start = -1;
  for (let i = 0; i <= mask.length; i++) {
    const set = i < mask.length && mask[i] !== 0;
    if (set && start < 0) start = i;
    if (!set && start >= 0) {
      runs.push(`${start}-${i - 1}`);
      start = -1;
    }
  }
  const derivative = preparation.derivative
    ? `sg1:${preparation.derivative.window}:${preparation.derivative.order}`
    : 'sg0';
  return [
    `m${MATRIX_FORMAT}`,
    stateKey,
    preparation.centring,
    derivative,
    `n${mask.length}`,
    runs.join(','),
  ].join('|');
}
