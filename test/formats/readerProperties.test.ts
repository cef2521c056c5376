// Property tests of every reader on generated files: valid files round-trip, benign variants (CRLF, BOM, UTF-16,
// trailing white space) read the same values, damaged files fail with their one stable code. Seeded; the seed and
// the shrunk counterexample are in each failure message (fast-check's report).
import fc from 'fast-check';
import { describe, it } from 'vitest';
import { readerFuzzCases } from '../../scripts/readerFuzzCases.js';

const SEED = 20_240_917;
const RUNS = 1000;

describe('reader properties (fast-check, seeded)', () => {
  for (const c of readerFuzzCases()) {
    it(`${c.reader}: ${c.property} (${RUNS} cases, seed ${SEED})`, () => {
      fc.assert(
        fc.property(c.inputs, (input) => {
          input.check();
        }),
        { seed: SEED, numRuns: RUNS },
      );
    });
  }
});
