// Redaction of a published report: the unknown is named by its hash; file name, folders and title go, also where a
// reader's warning quoted them; the input is not mutated.
import { describe, expect, it } from 'vitest';
import type { MatchReport } from '../../src/schema/matchReport.js';
import { redactReport } from '../../src/site/redactReport.js';
import type { SiteReport } from '../../src/site/types.js';

// SHA-256 of the empty input (FIPS 180-4 test vector, as `sha256sum /dev/null` prints it).
const HASH = 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855';

function site(query: Record<string, unknown>): SiteReport {
  const report = {
    caution: 'Research use only.',
    query: { file: '/data/study-7/P001 visit2.csv', hash: HASH, warnings: [], ...query },
  } as unknown as MatchReport;
  return { slug: 'P001 visit2.match', file: 'P001 visit2.match.json', report };
}

describe('redactReport', () => {
  it('names the unknown by the first 12 hex digits of its SHA-256, in the slug, file and report', () => {
    const input = site({ title: 'patient P001', warnings: ['P001 visit2.csv:3: a value was blank'] });
    const out = redactReport(input);
    expect(out.slug).toBe('unknown-e3b0c44298fc');
    expect(out.file).toBe('unknown-e3b0c44298fc.match.json');
    expect(out.redacted).toBe(true);
    expect(out.report.query.file).toBe('unknown-e3b0c44298fc');
    expect(out.report.query.title).toBeUndefined();
    expect(out.report.query.warnings).toEqual(['unknown-e3b0c44298fc:3: a value was blank']);
    expect(out.report.query.hash).toBe(HASH);
    expect(JSON.stringify(out)).not.toMatch(/P001|study-7/);
    expect(out.report.caution).toBe('Research use only.');
    // The input is not mutated.
    expect(input.report.query.file).toBe('/data/study-7/P001 visit2.csv');
    expect(input.report.query.title).toBe('patient P001');
  });

  it('keeps a block number apart, so two spectra of one file stay two pages', () => {
    expect(redactReport(site({ block: 2 })).slug).toBe('unknown-e3b0c44298fc-b2');
    expect(redactReport(site({}), { hashDigits: 8 }).slug).toBe('unknown-e3b0c442');
  });
});
