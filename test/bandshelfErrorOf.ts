// The BandshelfError a call throws, for tests that check its code, file, line and field rather than only its text.
import { BandshelfError } from '../src/error.js';

/** Fails the test when `run` returns normally; any other error is re-thrown so its own message is seen. */
export function bandshelfErrorOf(run: () => unknown): BandshelfError {
  try {
    run();
  } catch (error) {
    if (error instanceof BandshelfError) return error;
    throw error;
  }
  throw new Error('expected a BandshelfError');
}
