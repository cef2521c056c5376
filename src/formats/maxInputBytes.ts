// The one default size limit of an input file (spectrum, trace, sidecar, manifest): generous, but bounded.

/** 200 MB: larger than any spectrum or trace file seen in practice, small enough to read into memory. */
export const MAX_INPUT_BYTES = 200_000_000;
