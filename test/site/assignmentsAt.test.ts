// Naming a band from the shipped assignment table: the classic biofluid bands land on the right rows.
import { describe, expect, it } from 'vitest';
import { shippedAssignments } from '../../src/match/shippedAssignments.js';
import { assignmentsAt } from '../../src/site/assignmentsAt.js';
import type { SiteAssignment } from '../../src/site/types.js';

const table = shippedAssignments();
const labels = (position: number) => assignmentsAt(position, table, { tolerance: 4 }).map((a) => a.label);

describe('assignmentsAt', () => {
  it('names amide I and amide II (Barth, Biochim. Biophys. Acta 1767, 2007) and the CH₂ stretch (Movasaghi 2008)', () => {
    expect(labels(1652).some((l) => /amide I\b/.test(l))).toBe(true);
    expect(labels(1547).some((l) => /amide II\b/.test(l))).toBe(true);
    expect(labels(2921).some((l) => /CH₂ asymmetric/.test(l))).toBe(true);
    // Each row named carries its source.
    for (const a of assignmentsAt(1652, table)) expect(a.source.length).toBeGreaterThan(3);
  });

  it('widens each range by the tolerance only', () => {
    const rows: SiteAssignment[] = [
      {
        min: 1000,
        max: 1010,
        label: 'x',
        vibration: '',
        group: '',
        class: ['other'],
        source: 's',
        basis: 'seen',
        origin: 'lab',
      },
    ];
    expect(assignmentsAt(995, rows)).toHaveLength(0);
    expect(assignmentsAt(996, rows, { tolerance: 4 })).toHaveLength(1);
    expect(assignmentsAt(1014, rows, { tolerance: 4 })).toHaveLength(1);
    expect(assignmentsAt(1014.5, rows, { tolerance: 4 })).toHaveLength(0);
  });
});
