// The readable terminal form of one match report: hits with their standing, the mixture, unexplained bands.
import type { MatchReport } from '../schema/matchReport.js';
import { textTable } from './textTable.js';

export interface FormatMatchTableOptions {
  /**
   * Leave out the closing caution line (a batch prints it once at the end).
   * @default false
   */
  omitCaution?: boolean;
  /**
   * Print each hit's per-region contributions to its score (`match --explain`).
   * @default false
   */
  explain?: boolean;
}

const cm = (v: number): string => v.toFixed(0);

/** Plain text, no colour; wavenumbers from high to low as the trade writes them. */
export function formatMatchTable(report: MatchReport, options: FormatMatchTableOptions = {}): string {
  const out: string[] = [];
  const q = report.query;
  const coverage =
    q.coverage === null
      ? 'covers nothing on the grid'
      : `covers ${cm(q.coverage.max)}–${cm(q.coverage.min)} cm⁻¹ (${cm(q.coverage.overlap)} cm⁻¹ scored)`;
  out.push(
    `Unknown  ${q.file}${q.block === undefined ? '' : ` block ${q.block}`}${q.column === undefined ? '' : ` column ${q.column}`}  sha256 ${q.hash.slice(0, 12)}…  ${coverage}`,
  );
  const lib = report.library;
  out.push(
    `Library  ${lib.name || '(unnamed)'}  ${lib.release === null ? 'working state' : `release ${lib.release}`}  ` +
      `${lib.entries} entries  state ${lib.stateKey.slice(0, 12)}`,
  );
  const exclusions = q.recipe.exclude.map((w) => `${cm(w.max)}–${cm(w.min)}`).join(', ') || 'none';
  const ranges =
    q.ranges.length === 0 ? 'whole grid' : q.ranges.map((w) => `${cm(w.max)}–${cm(w.min)}`).join(', ');
  out.push(`Scored   ${ranges} cm⁻¹ (excluded: ${exclusions})  recipe from the ${q.recipeSource}`);
  for (const metric of report.metrics) {
    const hits = report.hitsByMetric[metric] ?? [];
    out.push('');
    out.push(
      metric === 'euclidean' ? 'euclidean (distance, lower is closer)' : `${metric} (0–1, higher is closer)`,
    );
    if (hits.length === 0) {
      out.push('  no entry shares enough of the unknown’s range to be scored');
      continue;
    }
    out.push(
      textTable(
        [
          ['#', 'ID', 'REV', 'NAME', 'CLASS', 'SCORE', 'P', 'GAP', 'Z', 'OVERLAP'],
          ...hits.map((h) => [
            String(h.rank),
            h.id,
            String(h.revision),
            h.name,
            h.class,
            h.score.toFixed(4),
            h.pValue === null ? '–' : h.pValue.toPrecision(2),
            h.gapToNext === null ? '–' : h.gapToNext.toFixed(4),
            h.z === null ? '–' : h.z.toFixed(1),
            `${cm(h.overlap)} cm⁻¹`,
          ]),
        ],
        { right: [0, 2, 5, 6, 7, 8, 9] },
      ),
    );
    if (options.explain) {
      for (const h of hits) {
        if (h.contributions === null) continue;
        const parts = h.contributions.map(
          (c) => `${c.label} ${c.share >= 0 ? '+' : ''}${c.share.toFixed(3)}`,
        );
        out.push(`  why #${h.rank} ${h.id}: r ${h.rawScore.toFixed(3)} = ${parts.join(', ')}`);
      }
    }
  }
  if (report.confidence !== null) {
    out.push('');
    out.push(`P: ${report.confidence.text}`);
  }
  out.push('');
  out.push(
    `Standing (${report.standing.metric}): ${report.standing.verdict.toUpperCase()}: ${report.standing.text}`,
  );
  const m = report.mixture;
  if (m !== null) {
    out.push('');
    out.push(
      `Mixture  R² ${m.r2 === null ? '–' : m.r2.toFixed(4)}  ${m.components.length} component(s) from ${m.candidates} ` +
        `candidates  baseline ${m.baseline === null ? 'none' : m.baseline.degree === 0 ? 'free offset' : `free-sign polynomial of degree ${m.baseline.degree}`}`,
    );
    if (m.components.length > 0) {
      out.push(
        textTable(
          [
            ['ID', 'REV', 'NAME', 'WEIGHT', '95 % INTERVAL', 'SHARE', 'SHARE 95 %', 'HOW'],
            ...m.components.map((c) => [
              c.id,
              String(c.revision),
              c.name ?? '',
              c.weight.toPrecision(4),
              `${c.interval95[0].toPrecision(3)} – ${c.interval95[1] === null ? '∞' : c.interval95[1].toPrecision(3)}`,
              `${(100 * c.share).toFixed(1)} %`,
              `${(100 * c.shareInterval95[0]).toFixed(1)} – ${(100 * c.shareInterval95[1]).toFixed(1)} %`,
              c.forced ? 'forced (--with)' : `added, −${(100 * (c.improvement ?? 0)).toFixed(1)} % RSS`,
            ]),
          ],
          { right: [1, 3, 5, 6] },
        ),
      );
    }
    for (const c of m.components) {
      if (c.alternatives !== undefined && c.alternatives.length > 0) {
        out.push(
          `${c.id} stands for one of {${[c.id, ...c.alternatives].join(', ')}}: each fits as well in its place, ` +
            'so this spectrum names the group, not one member',
        );
      }
      if (!c.significant) out.push(`${c.id}: its interval reaches 0 — not significant, not found`);
    }
    out.push(`Stopped: ${m.stopReason}`);
    out.push(`Rule: ${m.criterion}`);
    const noise = `${m.noise.toPrecision(2)} (${m.noiseSource === 'band-free-window' ? 'band-free window' : 'residual differences'})`;
    if (m.residualBands.length === 0) out.push(`Unexplained bands: none above ${m.k} × noise ${noise}`);
    else {
      out.push(
        `Unexplained bands (residual peaks above ${m.k} × noise ${noise}): ` +
          [...m.residualBands]
            .sort((a, b) => b.position - a.position)
            .map((b) => `${b.position.toFixed(1)} cm⁻¹ (${b.height.toPrecision(2)})`)
            .join(', '),
      );
    }
    if (m.misfitBands.length > 0) {
      out.push(
        'On fitted bands (shape or position differs from the reference; not unexplained): ' +
          m.misfitBands.map((b) => `${b.position.toFixed(1)} cm⁻¹ (${b.component})`).join(', '),
      );
    }
  }
  if (report.bands.length > 0) {
    const assigned = report.bands.filter((b) => b.assignments.length > 0).length;
    out.push('');
    out.push(
      `Bands: ${report.bands.length} found, ${assigned} with a table assignment (\`bandshelf identify\` lists them)`,
    );
  }
  for (const w of q.warnings) out.push(`note: ${w}`);
  if (!options.omitCaution) {
    out.push('');
    out.push(report.caution);
  }
  return out.join('\n');
}
