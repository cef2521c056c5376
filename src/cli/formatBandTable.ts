// The readable terminal form of a band identification: every band with its assignments, sources and candidates.
import type { MatchReport } from '../schema/matchReport.js';
import { textTable } from './textTable.js';

export interface FormatBandTableOptions {
  /**
   * Library candidates shown per band.
   * @default 3
   */
  candidates?: number;
}

/** Assignment sources become footnote numbers so the table stays narrow; the sources are listed beneath. */
export function formatBandTable(report: MatchReport, options: FormatBandTableOptions = {}): string {
  const shown = options.candidates ?? 3;
  const sources: string[] = [];
  const note = (source: string): number => {
    const at = sources.indexOf(source);
    if (at >= 0) return at + 1;
    sources.push(source);
    return sources.length;
  };
  const q = report.query;
  const out: string[] = [`Unknown  ${q.file}${q.block === undefined ? '' : ` block ${q.block}`}`];
  out.push(
    `Library  ${report.library.release === null ? 'working state' : `release ${report.library.release}`}, ` +
      `${report.library.entries} entries; tolerance ±${report.settings.tolerance} cm⁻¹`,
  );
  out.push('');
  if (report.bands.length === 0) out.push('No bands found.');
  else {
    out.push(
      textTable(
        [
          ['CM⁻¹', 'KIND', 'HEIGHT', 'FWHM', 'ASSIGNMENTS (CLASS) [SOURCE]', 'LIBRARY', 'FIT'],
          ...report.bands.map((b) => [
            b.position.toFixed(1),
            b.kind,
            b.height.toPrecision(3),
            b.fwhm === null ? '–' : b.fwhm.toFixed(0),
            b.assignedTo !== null
              ? `fitted ${b.assignedTo.id} (${(100 * b.assignedTo.share).toFixed(0)} % of the band)`
              : b.assignments.length === 0
                ? '–'
                : b.assignments
                    .map(
                      (a) => `${a.label} (${a.class.join('/')}) [${note(a.source)}${a.id ? ` ${a.id}` : ''}]`,
                    )
                    .join('; '),
            b.candidates.length === 0
              ? '–'
              : b.candidates
                  .slice(0, shown)
                  .map((c) => c.id)
                  .join(', ') + (b.candidates.length > shown ? ` +${b.candidates.length - shown}` : ''),
            b.explained === null ? '–' : b.explained ? 'explained' : 'UNEXPLAINED',
          ]),
        ],
        { right: [0, 2, 3] },
      ),
    );
  }
  if (report.mixture !== null) {
    out.push('');
    out.push(
      `Fit: ${report.mixture.components.map((c) => `${c.id} ${(100 * c.share).toFixed(1)} %`).join(', ') || 'no components'}` +
        `; R² ${report.mixture.r2 === null ? '–' : report.mixture.r2.toFixed(4)}`,
    );
  }
  if (sources.length > 0) {
    out.push('');
    out.push('Sources:');
    for (const [i, s] of sources.entries()) out.push(`  [${i + 1}] ${s}`);
  }
  out.push('');
  out.push(report.caution);
  return out.join('\n');
}
