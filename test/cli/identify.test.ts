// `bandshelf identify` end to end: bands of a real unknown with assignments, sources, candidates and fit status.
import { beforeAll, describe, expect, it } from 'vitest';
import { matchReportSchema } from '../../src/schema/matchReport.js';
import { bandshelf, parseJson, tempDir } from './bandshelfCli.js';
import { buildMatchFixture, type MatchFixture } from './matchFixture.js';

let fx: MatchFixture;
let without: MatchFixture;

beforeAll(() => {
  const dir = tempDir('bandshelf-identify-');
  fx = buildMatchFixture(dir);
  without = buildMatchFixture(dir, { name: 'no-lactate.sqlite', leaveOut: ['lactate'] });
});

interface IdentifyJson {
  bands: {
    position: number;
    assignments: { id?: string; label: string; class: string[]; source: string }[];
    assignedTo: { id: string; share: number } | null;
    candidates: { id: string }[];
    explained: boolean | null;
  }[];
}

function identify(args: string[], library = fx.library) {
  return bandshelf(['identify', ...args, '--library', library], { cwd: fx.dir });
}

const near = (out: IdentifyJson, position: number) => {
  const band = out.bands.find((b) => Math.abs(b.position - position) <= 3);
  expect(band, `a band near ${position}`).toBeDefined();
  return band!;
};

describe('bandshelf identify', () => {
  it('assigns the serum-like mixture’s amide I, amide II and CH₂ stretch bands, and judges them against the fit', () => {
    const r = identify([without.unknowns.mixture, '--json'], without.library);
    expect(r.code).toBe(0);
    const out = parseJson<IdentifyJson>(r.stdout);
    matchReportSchema.parse(out);
    // The fit holds albumin: the bands albumin carries are assigned to it first, not offered table rows.
    expect(near(out, 1652).assignedTo?.id).toBe('albumin');
    expect(near(out, 1652).assignments).toEqual([]);
    for (const band of out.bands)
      for (const a of band.assignments) expect(a.source.length).toBeGreaterThan(3);
    // Without the fit every band is offered table rows.
    const table = parseJson<IdentifyJson>(
      identify([without.unknowns.mixture, '--json', '--no-mixture'], without.library).stdout,
    );
    // Barth, Biochim. Biophys. Acta 1767 (2007): amide I and amide II are protein bands.
    expect(
      near(table, 1652).assignments.some((a) => a.label.startsWith('amide I') && a.class.includes('protein')),
    ).toBe(true);
    expect(near(table, 1545).assignments[0]!.class).toContain('protein');
    // Movasaghi, Rehman & Rehman (2008): the CH₂ stretches are lipid (and protein side-chain) bands.
    expect(near(table, 2922).assignments[0]!.class).toContain('lipid');
    expect(near(table, 2852).assignments[0]!.class).toContain('lipid');
    // Library entries with a band within tolerance.
    expect(near(out, 1652).candidates.map((c) => c.id)).toContain('albumin');
    // Lactate is not in this library: its 1417 band is unexplained, and nothing in the library has it.
    expect(near(out, 1417).explained).toBe(false);
    expect(near(out, 1417).candidates).toEqual([]);
    // With lactate in the library the fit explains every band.
    const full = parseJson<IdentifyJson>(identify([fx.unknowns.mixture, '--json']).stdout);
    expect(near(full, 1417).candidates.map((c) => c.id)).toEqual(['lactate']);
    expect(full.bands.every((b) => b.explained === true)).toBe(true);
  });

  it('assigns a phosphate band of a nucleic-acid reference to nucleic acid or phospholipid', () => {
    const r = identify(['refs-lib.sqlite/rna.csv', '--json', '--no-mixture']);
    expect(r.code).toBe(0);
    const out = parseJson<IdentifyJson>(r.stdout);
    // PO₂⁻ asymmetric stretch 1220–1250 (Movasaghi 2008): nucleic acid / phospholipid.
    const phosphate = near(out, 1236).assignments.find((a) => a.id === 'phosphate-asymmetric-stretch');
    expect(phosphate?.class).toEqual(['nucleic-acid', 'phospholipid']);
    expect(near(out, 1236).candidates.map((c) => c.id)).toEqual(['rna']);
    expect(out.bands.every((b) => b.explained === null)).toBe(true);
  });

  it('prints a readable band table with numbered sources and the caution', () => {
    const r = identify([fx.unknowns.mixture, '--no-mixture']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/CM⁻¹\s+KIND\s+HEIGHT\s+FWHM\s+ASSIGNMENTS/);
    expect(r.stdout).toMatch(/^\s*1652\.\d\s+peak\s.*amide I.*\(protein\) \[\d+ amide-i[a-z-]*\]/m);
    // With the fit, albumin's amide I is shown as the fitted component's band.
    expect(identify([fx.unknowns.mixture]).stdout).toMatch(
      /^\s*1652\.\d\s+peak\s.*fitted albumin \(\d+ % of the band\)/m,
    );
    expect(r.stdout).toMatch(/Sources:\n\s+\[1\] /);
    expect(r.stdout).toMatch(/Research use only/);
  });

  it('fails with one line for an unreadable unknown or a missing --with entry', () => {
    const bad = identify([fx.unknowns.garbage]);
    expect(bad.code).toBe(1);
    expect(bad.stderr.trim()).toMatch(/^bandshelf: garbage\.csv:\d+: .*\[NOT_NUMERIC\]$/);
    const missing = identify([fx.unknowns.mixture, '--with', 'nope']);
    expect(missing.code).toBe(1);
    expect(missing.stderr.trim()).toMatch(/'nope'.*\[NOT_FOUND\]$/);
  });
});
