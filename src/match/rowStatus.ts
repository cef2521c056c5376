// Per-row codes of a search matrix: which rows the kernel scores, which need the exact masked path, which none.

export const rowStatus = {
  /** Nothing to score over the mask: no covered point, or a flat row. */
  empty: 0,
  /** Covers the whole mask: scored by the matrix kernel. */
  full: 1,
  /** Covers part of the mask: scored exactly over the intersection. */
  partial: 2,
} as const;
