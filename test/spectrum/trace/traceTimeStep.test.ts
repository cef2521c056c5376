// The delay-axis checks every trace passes before a Fourier transform.
import { describe, expect, it } from 'vitest';
import type { BandshelfError } from '../../../src/error.js';
import { traceTimeStep } from '../../../src/spectrum/trace/traceTimeStep.js';

function codeOf(f: () => unknown): string {
  try {
    f();
  } catch (error) {
    return (error as BandshelfError).code;
  }
  return 'no error';
}

const axis = (n: number, step: number) => Float64Array.from({ length: n }, (_, i) => i * step);

describe('traceTimeStep', () => {
  it('returns the mean step of a uniform axis', () => {
    expect(traceTimeStep({ time: axis(20, 0.5), field: new Float64Array(20) })).toBe(0.5);
  });

  it('names each defect with its own code', () => {
    const time = axis(20, 1);
    expect(codeOf(() => traceTimeStep({ time, field: new Float64Array(19) }))).toBe('BAD_FORMAT');
    expect(codeOf(() => traceTimeStep({ time: axis(8, 1), field: new Float64Array(8) }))).toBe(
      'TOO_FEW_POINTS',
    );
    const uneven = time.slice();
    uneven[7] = 7.2;
    expect(codeOf(() => traceTimeStep({ time: uneven, field: new Float64Array(20) }))).toBe('BAD_FORMAT');
    expect(traceTimeStep({ time: uneven, field: new Float64Array(20) }, { tolerance: 0.25 })).toBeCloseTo(
      1,
      12,
    );
    const backwards = time.slice();
    backwards[5] = 3.5;
    expect(codeOf(() => traceTimeStep({ time: backwards, field: new Float64Array(20) }))).toBe(
      'NOT_MONOTONIC',
    );
    const field = new Float64Array(20);
    field[3] = Number.NaN;
    expect(codeOf(() => traceTimeStep({ time, field }))).toBe('NOT_FINITE');
  });
});
