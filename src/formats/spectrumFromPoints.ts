// Turns the raw (x, y) points a reader decoded into a valid Spectrum: finite, ascending, duplicates merged.
import { BandshelfError } from '../error.js';
import type { Spectrum } from '../spectrum/types.js';
import type { ParseWarning } from './types.js';

/** The largest finite Float32 (IEEE 754 binary32), the precision of a stored processed vector. */
const FLOAT32_MAX = 3.4028234663852886e38;

export interface SpectrumFromPointsOptions {
  /** File named in errors. @default undefined */
  file?: string;
  /** 1-based source line of each point, so errors and warnings can point at it. @default undefined */
  lines?: ArrayLike<number>;
}

export interface SpectrumFromPointsResult {
  spectrum: Spectrum;
  warnings: ParseWarning[];
}

/**
 * Validates and orders points in wavenumber (cm⁻¹) and absorbance. No points → EMPTY_FILE, one → TOO_FEW_POINTS,
 * NaN/±Infinity → NOT_FINITE (with its line), and so is an ordinate beyond ±3.4e38: the library stores processed vectors as
 * Float32, which would hold it as Infinity. Files run ascending or descending; one change of direction
 * (two sweeps joined) is sorted with a warning, more than one means x zig-zags and cannot be a spectrum
 * (NOT_MONOTONIC). Exact duplicate points are merged with a warning; readings repeated at one x with different y
 * are averaged into one point (the usual practice for co-added or overlapping scans), with a warning naming the first
 * such line and the widest spread. Inputs are not modified.
 */
export function spectrumFromPoints(
  points: { x: Float64Array; y: Float64Array },
  options: SpectrumFromPointsOptions = {},
): SpectrumFromPointsResult {
  const { x, y } = points;
  const { file, lines } = options;
  const n = Math.min(x.length, y.length);
  const warnings: ParseWarning[] = [];
  if (n === 0) throw new BandshelfError('EMPTY_FILE', 'the file holds no data points', { file });
  if (n === 1) {
    throw new BandshelfError(
      'TOO_FEW_POINTS',
      'the file holds a single point; a spectrum needs at least two',
      {
        file,
        line: lines?.[0],
      },
    );
  }
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    const yi = y[i]!;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) {
      const which = Number.isFinite(xi) ? `y = ${yi}` : `x = ${xi}`;
      throw new BandshelfError('NOT_FINITE', `${which} is not a finite number`, {
        file,
        line: lines?.[i],
        field: Number.isFinite(xi) ? 'y' : 'x',
      });
    }
    if (Math.abs(yi) > FLOAT32_MAX) {
      throw new BandshelfError(
        'NOT_FINITE',
        `y = ${yi} is beyond ±${FLOAT32_MAX.toPrecision(3)}, the largest value a stored spectrum can hold (check YFACTOR)`,
        { file, line: lines?.[i], field: 'y' },
      );
    }
  }

  // Count changes of direction, ignoring repeated x (they are handled by the merge below).
  let direction = 0;
  let changes = 0;
  let firstChange = -1;
  for (let i = 1; i < n; i++) {
    const d = Math.sign(x[i]! - x[i - 1]!);
    if (d === 0) continue;
    if (direction !== 0 && d !== direction) {
      changes++;
      if (firstChange < 0) firstChange = i;
      if (changes > 1) {
        throw new BandshelfError(
          'NOT_MONOTONIC',
          `x changes direction more than once (again at x = ${x[i - 1]}), so the points cannot be one spectrum`,
          { file, line: lines?.[i - 1], field: 'x' },
        );
      }
    }
    direction = d;
  }

  let order: Uint32Array;
  if (changes === 0) {
    order = new Uint32Array(n);
    if (direction >= 0) for (let i = 0; i < n; i++) order[i] = i;
    else for (let i = 0; i < n; i++) order[i] = n - 1 - i;
  } else {
    warnings.push({
      line: lines?.[firstChange],
      message: 'x changes direction once (two sweeps in one file); the points were sorted',
    });
    const idx = Array.from({ length: n }, (_, i) => i);
    // Stable sort by x, so equal x keep file order and the duplicate check below names the later line.
    idx.sort((a, b) => x[a]! - x[b]! || a - b);
    order = Uint32Array.from(idx);
  }

  const wavenumber = new Float64Array(n);
  const absorbance = new Float64Array(n);
  let m = 0;
  let merged = 0;
  let firstMergedLine: number | undefined;
  let averaged = 0;
  let firstAveragedLine: number | undefined;
  let widestSpread = 0;
  let widestAt = 0;
  for (let k = 0; k < n; ) {
    const i = order[k]!;
    const xi = x[i]!;
    // The run of readings at this x, in file order.
    let end = k + 1;
    while (end < n && x[order[end]!]! === xi) end++;
    let sum = 0;
    let lo = Number.POSITIVE_INFINITY;
    let hi = Number.NEGATIVE_INFINITY;
    for (let r = k; r < end; r++) {
      const yr = y[order[r]!]!;
      sum += yr;
      lo = Math.min(lo, yr);
      hi = Math.max(hi, yr);
    }
    if (end - k > 1) {
      if (hi === lo) {
        merged += end - k - 1;
        firstMergedLine ??= lines?.[order[k + 1]!];
      } else {
        averaged++;
        firstAveragedLine ??= lines?.[order[k + 1]!];
        if (hi - lo > widestSpread) {
          widestSpread = hi - lo;
          widestAt = xi;
        }
      }
    }
    wavenumber[m] = xi;
    absorbance[m] = end - k === 1 || hi === lo ? y[i]! : sum / (end - k);
    m++;
    k = end;
  }
  if (averaged > 0) {
    warnings.push({
      line: firstAveragedLine,
      message: `${averaged} x value${averaged === 1 ? '' : 's'} read more than once with different y; the readings were averaged (widest spread ${widestSpread} at x = ${widestAt})`,
    });
  }
  if (merged > 0) {
    warnings.push({
      line: firstMergedLine,
      message: `${merged} repeated point${merged === 1 ? '' : 's'} (same x, same y) merged`,
    });
  }
  if (m === 1) {
    throw new BandshelfError('TOO_FEW_POINTS', 'all points share one x; a spectrum needs at least two', {
      file,
      line: lines?.[0],
    });
  }
  return {
    spectrum: { wavenumber: wavenumber.slice(0, m), absorbance: absorbance.slice(0, m) },
    warnings,
  };
}
