// Lawson–Hanson active-set NNLS on the normal equations, so forward selection can re-fit subsets cheaply.
import { BandshelfError } from '../error.js';

export interface NnlsNormalProblem {
  /** AᵀA, n × n, row-major (symmetric). */
  gram: Float64Array;
  /** Aᵀb, length n. */
  atb: Float64Array;
}

export interface NnlsNormalOptions {
  /**
   * A variable enters the passive set only while its gradient component (Aᵀ(b − Ax)) exceeds this. Absolute.
   * @default 1e-10 × the largest |Aᵀb| (1e-300 when that is 0)
   */
  tolerance?: number;
  /**
   * Outer iterations before giving up with the best point so far (Lawson & Hanson suggest 3n).
   * @default 3n + 30
   */
  maxIterations?: number;
}

export interface NnlsNormalResult {
  x: Float64Array;
  /** Outer iterations used. */
  iterations: number;
  /** False when `maxIterations` stopped the search before the optimality test passed. */
  converged: boolean;
}

/**
 * Solves the least-squares subproblem on the passive set by Cholesky. Returns null when the passive Gram block is
 * not positive definite (a column dependent on the others): the caller then keeps that variable out.
 */
function solvePassive(
  gram: Float64Array,
  atb: Float64Array,
  n: number,
  passive: Int32Array,
  p: number,
): Float64Array | null {
  const l = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    const gi = passive[i]!;
    for (let j = 0; j <= i; j++) {
      const gj = passive[j]!;
      let sum = gram[gi * n + gj]!;
      for (let k = 0; k < j; k++) sum -= l[i * p + k]! * l[j * p + k]!;
      if (i === j) {
        // Relative pivot test: a pivot this small means the column adds nothing independent.
        if (!(sum > 1e-13 * gram[gi * n + gi]!) || !(sum > 0)) return null;
        l[i * p + i] = Math.sqrt(sum);
      } else {
        l[i * p + j] = sum / l[j * p + j]!;
      }
    }
  }
  const y = new Float64Array(p);
  for (let i = 0; i < p; i++) {
    let sum = atb[passive[i]!]!;
    for (let k = 0; k < i; k++) sum -= l[i * p + k]! * y[k]!;
    y[i] = sum / l[i * p + i]!;
  }
  for (let i = p - 1; i >= 0; i--) {
    let sum = y[i]!;
    for (let k = i + 1; k < p; k++) sum -= l[k * p + i]! * y[k]!;
    y[i] = sum / l[i * p + i]!;
  }
  return y;
}

/**
 * Minimises ‖Ax − b‖² subject to x ≥ 0 given only AᵀA and Aᵀb (Lawson & Hanson, Solving Least Squares Problems,
 * 1974, ch. 23, algorithm NNLS). Squaring the condition number is harmless for the few, distinct columns of a
 * mixture fit in double precision; `nnls` is the entry point for a plain A and b.
 */
export function nnlsNormal(problem: NnlsNormalProblem, options: NnlsNormalOptions = {}): NnlsNormalResult {
  const { gram, atb } = problem;
  const n = atb.length;
  if (gram.length !== n * n) {
    throw new BandshelfError('BAD_OPTION', `the Gram matrix has ${gram.length} values; expected ${n * n}`, {
      field: 'gram',
    });
  }
  for (let i = 0; i < gram.length; i++) {
    if (!Number.isFinite(gram[i]!))
      throw new BandshelfError('BAD_OPTION', 'the Gram matrix holds a non-finite value', { field: 'gram' });
  }
  let scale = 0;
  for (let j = 0; j < n; j++) {
    const v = atb[j]!;
    if (!Number.isFinite(v))
      throw new BandshelfError('BAD_OPTION', 'Aᵀb holds a non-finite value', { field: 'atb' });
    scale = Math.max(scale, Math.abs(v));
  }
  const tolerance = options.tolerance ?? (scale > 0 ? 1e-10 * scale : 1e-300);
  const maxIterations = options.maxIterations ?? 3 * n + 30;

  const x = new Float64Array(n);
  const inPassive = new Uint8Array(n);
  // Variables whose entry failed (dependent column): skipped until x next changes.
  const blocked = new Uint8Array(n);
  const passive = new Int32Array(n);
  const w = Float64Array.from(atb);
  let p = 0;
  let iterations = 0;
  let converged = false;

  const rebuildPassive = (): void => {
    p = 0;
    for (let j = 0; j < n; j++) if (inPassive[j]) passive[p++] = j;
  };

  while (iterations < maxIterations) {
    let t = -1;
    let best = tolerance;
    for (let j = 0; j < n; j++) {
      if (!inPassive[j] && !blocked[j] && w[j]! > best) {
        best = w[j]!;
        t = j;
      }
    }
    if (t < 0) {
      converged = true;
      break;
    }
    iterations++;
    inPassive[t] = 1;
    rebuildPassive();
    const first = solvePassive(gram, atb, n, passive, p);
    if (first === null || !(first[passive.subarray(0, p).indexOf(t)]! > 0)) {
      // Numerically the entering variable cannot move: keep it out rather than cycle.
      inPassive[t] = 0;
      blocked[t] = 1;
      rebuildPassive();
      continue;
    }
    let s: Float64Array = first;
    // Inner loop: step back towards x until every passive variable is positive.
    let solved = true;
    for (let guard = 0; guard <= n + 1; guard++) {
      let alpha = Number.POSITIVE_INFINITY;
      let leaving = -1;
      for (let i = 0; i < p; i++) {
        const si = s[i]!;
        if (si <= 0) {
          const xi = x[passive[i]!]!;
          const ratio = xi / (xi - si);
          if (ratio < alpha) {
            alpha = ratio;
            leaving = passive[i]!;
          }
        }
      }
      if (leaving < 0) break;
      for (let i = 0; i < p; i++) {
        const j = passive[i]!;
        x[j] = x[j]! + alpha * (s[i]! - x[j]!);
      }
      // The variable that set alpha lands on zero exactly in exact arithmetic; force it, and any that crossed.
      x[leaving] = 0;
      for (let i = 0; i < p; i++) {
        const j = passive[i]!;
        if (x[j]! <= 0) {
          x[j] = 0;
          inPassive[j] = 0;
        }
      }
      rebuildPassive();
      const next = solvePassive(gram, atb, n, passive, p);
      if (next === null) {
        // x is still feasible: keep it and let the outer loop re-test optimality.
        solved = false;
        break;
      }
      s = next;
    }
    if (solved) {
      x.fill(0);
      for (let i = 0; i < p; i++) x[passive[i]!] = Math.max(0, s[i]!);
    }
    blocked.fill(0);
    for (let j = 0; j < n; j++) {
      let g = atb[j]!;
      for (let k = 0; k < n; k++) g -= gram[j * n + k]! * x[k]!;
      w[j] = g;
    }
  }
  return { x, iterations, converged };
}
