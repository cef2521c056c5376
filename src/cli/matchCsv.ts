// Batch output of `match`: one CSV row per unknown (top hits, standing, mixture, unexplained bands, or the error).
import type { MatchOutcome } from './matchUnknowns.js';

export interface MatchCsvOptions {
  /**
   * Hits per row.
   * @default 3
   */
  hits?: number;
}

function field(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  const text = String(value);
  return /[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** RFC 4180 quoting; numbers in plain decimal; `;` separates list items inside a field. */
export function matchCsv(outcomes: readonly MatchOutcome[], options: MatchCsvOptions = {}): string {
  const n = options.hits ?? 3;
  const header = ['file', 'block', 'column', 'status'];
  for (let i = 1; i <= n; i++) header.push(`hit${i}_id`, `hit${i}_revision`, `hit${i}_score`);
  header.push(
    'metric',
    'standing',
    'overlap_cm1',
    'mixture_r2',
    'mixture_components',
    'unexplained_bands_cm1',
    'error',
  );
  const lines = [header.join(',')];
  for (const o of outcomes) {
    const r = o.report;
    const row: (string | number | null | undefined)[] = [
      o.file,
      o.block,
      o.column,
      r === undefined ? 'failed' : 'ok',
    ];
    for (let i = 0; i < n; i++) {
      const h = r?.hits[i];
      row.push(h?.id, h?.revision, h === undefined ? undefined : h.score.toFixed(6));
    }
    row.push(
      r?.metrics[0],
      r?.standing.verdict,
      r?.query.coverage?.overlap,
      r?.mixture?.r2 === null || r?.mixture?.r2 === undefined ? undefined : r.mixture.r2.toFixed(6),
      r?.mixture?.components.map((c) => `${c.id}:${c.share.toFixed(4)}`).join(';'),
      r?.mixture?.residualBands.map((b) => b.position.toFixed(1)).join(';'),
      o.error,
    );
    lines.push(row.map(field).join(','));
  }
  return `${lines.join('\n')}\n`;
}
