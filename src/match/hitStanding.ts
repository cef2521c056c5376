// How far a report's best hit stands out: the verdict and sentence of a report's `standing`.
import type { MatchHit, MatchReport } from '../schema/matchReport.js';
import type { Metric } from './searchTypes.js';

/**
 * How far the best hit stands out, read from its calibrated p-value against the library's best wrong hits:
 * distinct at p ≤ 0.01, ambiguous at p ≤ 0.1 or at the p floor of a library too small to reach 0.01, weak above
 * (our own cut-offs, stated in the text). Without a null
 * (a metric other than pearson) the verdict is weak below a score of 0.90 and ambiguous otherwise: no claim of
 * distinctness is made without a calibration.
 */
export interface HitStandingOptions {
  /**
   * The smallest p-value the library's null can give, 1 / (1 + sampled); at it a small library shows no more.
   * @default 0 (no floor)
   */
  floor?: number;
}

export function hitStanding(
  input: { metric: Metric; hits: readonly MatchHit[] },
  options: HitStandingOptions = {},
): MatchReport['standing'] {
  const { metric, hits } = input;
  const floor = options.floor ?? 0;
  const best = hits[0];
  if (best === undefined) return { metric, verdict: 'none', text: 'no library entry could be scored' };
  const gapText =
    best.gapToNext === null ? 'has no runner-up' : `leads the next by ${best.gapToNext.toFixed(3)}`;
  const head = `best hit '${best.id}' (${metric} ${best.score.toFixed(3)}) ${gapText}`;
  if (best.pValue === null) {
    const similarity = metric === 'euclidean' ? 1 - (best.rawScore * best.rawScore) / 2 : best.rawScore;
    return similarity < 0.9
      ? { metric, verdict: 'weak', text: `${head}: a weak match; treat every hit as a guess` }
      : {
          metric,
          verdict: 'ambiguous',
          text: `${head}; no calibration for this metric, so no claim it stands out`,
        };
  }
  const p = `p = ${best.pValue.toPrecision(2)} against the library's best wrong hits`;
  // A small library cannot show p ≤ 0.01: at its floor 1/(n + 1) no wrong hit reached the score, and no more is known.
  if (best.pValue === floor && floor > 0.01)
    return {
      metric,
      verdict: 'ambiguous',
      text: `${head}, ${p}: no wrong hit in the library scores this high, but ${Math.round(1 / floor) - 1} entries are too few to show p ≤ 0.01`,
    };
  if (best.pValue <= 0.01)
    return { metric, verdict: 'distinct', text: `${head}, ${p}: stands out (p ≤ 0.01)` };
  if (best.pValue <= 0.1)
    return {
      metric,
      verdict: 'ambiguous',
      text: `${head}, ${p}: wrong entries score this high now and then`,
    };
  return {
    metric,
    verdict: 'weak',
    text: `${head}, ${p}: a wrong entry often scores this high; treat it as a guess`,
  };
}
