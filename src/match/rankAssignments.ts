// Table rows that may assign one band, ranked by position agreement, width and relative intensity.
import type { BandAssignment } from '../schema/bandAssignment.js';

export interface RankAssignmentsOptions {
  /**
   * A row whose tolerance is at least this wide is a broad-band row (O–H stretch, amide A, water combination): it
   * expects a broad band, and a narrow row expects a narrow one, cm⁻¹.
   * @default 30
   */
  broadTolerance?: number;
  /**
   * FWHM that separates a narrow from a broad band, cm⁻¹.
   * @default 60
   */
  broadWidth?: number;
}

export interface RankedAssignment {
  row: BandAssignment;
  /** 0–1: position agreement × width agreement × (0.5 + 0.5 × relative intensity). */
  score: number;
}

/**
 * Position agreement is 1 inside min–max and falls linearly to 0 at the row's own tolerance beyond it; a band whose
 * width does not suit the row's kind (broad against narrow) keeps half its score; a weak band (small height
 * relative to the spectrum's strongest) has its assignment offered with less weight, since weak bands are where
 * noise and overlap mislead most. Region rows (water-vapour lines) are never offered as assignments.
 */
export function rankAssignments(
  band: { position: number; fwhm: number; relative: number },
  rows: readonly BandAssignment[],
  options: RankAssignmentsOptions = {},
): RankedAssignment[] {
  const broadTolerance = options.broadTolerance ?? 30;
  const broadWidth = options.broadWidth ?? 60;
  const ranked: RankedAssignment[] = [];
  for (const row of rows) {
    if (row.region) continue;
    const outside = Math.max(row.min - band.position, band.position - row.max, 0);
    const position = outside === 0 ? 1 : row.tolerance > 0 ? Math.max(0, 1 - outside / row.tolerance) : 0;
    if (position <= 0) continue;
    const rowBroad = row.tolerance >= broadTolerance;
    const width = Number.isFinite(band.fwhm) && rowBroad !== band.fwhm >= broadWidth ? 0.5 : 1;
    const relative = Math.min(1, Math.max(0, band.relative));
    ranked.push({ row, score: position * width * (0.5 + 0.5 * relative) });
  }
  const centre = (r: BandAssignment): number => Math.abs(band.position - (r.centre ?? (r.min + r.max) / 2));
  return ranked.sort((a, b) => b.score - a.score || centre(a.row) - centre(b.row));
}
