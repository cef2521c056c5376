// Which row preparation a metric scores on: Pearson and derivative on centred rows, cosine and euclidean on unit rows.
import type { MatrixPreparation, Metric } from './searchTypes.js';

export interface MetricPreparationOptions {
  /**
   * Savitzky–Golay first-derivative filter of the `derivative` metric.
   * @default { window: 9, order: 2 }
   */
  derivative?: { window: number; order: number };
}

/** Cosine and euclidean share one matrix: for unit vectors ‖a − b‖² = 2 − 2 cos(a, b). */
export function metricPreparation(metric: Metric, options: MetricPreparationOptions = {}): MatrixPreparation {
  if (metric === 'derivative')
    return { centring: 'centred', derivative: options.derivative ?? { window: 9, order: 2 } };
  return { centring: metric === 'pearson' ? 'centred' : 'unit', derivative: null };
}
