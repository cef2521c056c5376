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

/** The band-level test: one row per window, its area difference, interval, g, p and q. */
function bandTestTable(report: ContrastReport): string {
  const tests = report.bandTests;
  const passing = tests.filter((t) => t.significant).length;
  const head = `band-level test (integrated areas, Welch, Benjamini–Hochberg over ${tests.length} window${tests.length === 1 ? '' : 's'}): ${passing} pass at q ≤ ${report.settings.q}`;
  if (tests.length === 0) return `${head}; no window to test`;
  const level = `${Math.round(report.settings.level * 100)} % CI`;
  return [
    head,
    textTable(
      [
        ['WINDOW', 'CENTRE', 'AREA DIFFERENCE', level, 'g', 'p', 'q', '', 'ASSIGNMENT'],
        ...tests.map((t) => [
          `${t.max.toFixed(0)}–${t.min.toFixed(0)}`,
          t.position.toFixed(0),
          fixed(t.difference, 4),
          `${fixed(t.lower, 4)} … ${fixed(t.upper, 4)}`,
          t.g.toFixed(2),
          fixed(t.p, 3),
          fixed(t.q, 3),
          t.significant
            ? t.difference > 0
              ? `higher in ${report.groups.a.label}`
              : `lower in ${report.groups.a.label}`
            : '',
          t.assignments[0] === undefined
            ? '–'
            : `${t.assignments[0].label} (${t.assignments[0].class.join(', ')})`,
        ]),
      ],
      { right: [1, 2, 4, 5, 6] },
    ),
  ].join('\n');
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
  lines.push('', bandTestTable(report));
  if (report.search.higher !== null)
    lines.push('', `library hits, higher in ${a.label}: ${hitList(report.search.higher, count)}`);
  if (report.search.lower !== null)
    lines.push(`library hits, lower in ${a.label}: ${hitList(report.search.lower, count)}`);
  lines.push(
    '',
    report.method.test,
    `Assumes: ${report.method.assumptions.join('; ')}.`,
    report.method.fdr,
    report.method.bandTest,
    report.caution,
  );
  return lines.join('\n');
}
