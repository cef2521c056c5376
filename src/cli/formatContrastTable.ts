// The terminal view of a contrast report: groups, outliers, the difference bands, library hits, method and caution.
import type { ContrastHit, ContrastReport } from '../schema/contrastReport.js';
import { textTable } from './textTable.js';

export interface FormatContrastTableOptions {
  /** Library hits listed per part of the difference. @default 3 */
  hits?: number;
}

const fixed = (v: number, digits: number) =>
  Math.abs(v) < 10 ** -digits && v !== 0 ? v.toExponential(1) : v.toFixed(digits);

function hitList(hits: readonly ContrastHit[], count: number): string {
  return hits
    .slice(0, count)
    .map((h) => `${h.id} (r ${h.score.toFixed(3)})`)
    .join(', ');
}

export function formatContrastTable(
  report: ContrastReport,
  options: FormatContrastTableOptions = {},
): string {
  const count = options.hits ?? 3;
  const { a, b } = report.groups;
  const lines: string[] = [
    `contrast of ${a.label} (${a.n} of ${a.read} spectra) with ${b.label} (${b.n} of ${b.read})`,
    `${report.tested} grid points tested${report.settings.ranges.length === 0 ? '' : ` (inside ${report.settings.ranges.map((w) => `${w.max}–${w.min}`).join(', ')} cm⁻¹)`}; ${report.discoveries} pass at Benjamini–Hochberg q ≤ ${report.settings.q}; ` +
      `${report.bands.length} difference band${report.bands.length === 1 ? '' : 's'}`,
  ];
  const outliers = report.spectra.filter((s) => s.outlier);
  if (outliers.length > 0) {
    lines.push(
      `outliers (${report.settings.dropOutliers ? 'left out' : 'kept; --drop-outliers leaves them out'}): ` +
        outliers
          .map(
            (s) =>
              `${s.file}${s.block === undefined ? '' : ` #${s.block}`} (${s.group === 'a' ? a.label : b.label}, z ${s.robustZ?.toFixed(1)})`,
          )
          .join(', '),
    );
  }
  const qcErrors = report.spectra.filter((s) => s.qc.some((f) => f.level === 'error'));
  if (qcErrors.length > 0)
    lines.push(
      `QC errors: ${qcErrors
        .map(
          (s) =>
            `${s.file} (${s.qc
              .filter((f) => f.level === 'error')
              .map((f) => f.code)
              .join(', ')})`,
        )
        .join(', ')}`,
    );
  lines.push('');
  if (report.bands.length === 0) lines.push('no region differs at this false-discovery rate');
  else {
    const level = `${Math.round(report.settings.level * 100)} % CI`;
    lines.push(
      textTable(
        [
          ['BAND', 'REGION', `IN ${a.label}`, 'DIFFERENCE', level, 'g', 'q', 'ASSIGNMENT', 'LIBRARY PEAKS'],
          ...report.bands.map((band) => [
            band.position.toFixed(0),
            `${band.max.toFixed(0)}–${band.min.toFixed(0)}`,
            band.sign,
            fixed(band.difference, 4),
            `${fixed(band.lower, 4)} … ${fixed(band.upper, 4)}`,
            band.g.toFixed(2),
            fixed(band.smallestQ, 3),
            band.assignments[0] === undefined
              ? '–'
              : `${band.assignments[0].label} (${band.assignments[0].class.join(', ')})`,
            band.candidates
              .slice(0, count)
              .map((c) => c.id)
              .join(', ') || '–',
          ]),
        ],
        { right: [0, 3, 5, 6] },
      ),
    );
  }
  if (report.search.higher !== null)
    lines.push('', `library hits, higher in ${a.label}: ${hitList(report.search.higher, count)}`);
  if (report.search.lower !== null)
    lines.push(`library hits, lower in ${a.label}: ${hitList(report.search.lower, count)}`);
  lines.push(
    '',
    report.method.test,
    `Assumes: ${report.method.assumptions.join('; ')}.`,
    report.method.fdr,
    report.caution,
  );
  return lines.join('\n');
}
