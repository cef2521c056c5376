// `add --time-domain` through the real CLI: field traces become an absorbance spectrum with its coverage, dynamic
// range and trace files stored in the revision.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandshelf, parseJson, tempDir } from '../bandshelfCli.js';
import { writeTracePair } from './traceFiles.js';

interface ShowJson {
  original: { x: number[]; y: number[] };
  recipe: { timeDomain: Record<string, unknown> | null };
  files: { role: string; name: string; sha256: string }[];
  extras: {
    dynamicRangeOrders?: number;
    timingSpreadAs?: number;
    traces?: { sample: number; reference: number };
  };
  coverage: { min: number; max: number; points: number } | null;
  qc: { code: string }[];
}

describe('bandshelf add --time-domain', () => {
  const dir = tempDir();
  const lib = ['--library', join(dir, 'lib.sqlite')];

  it('a reference attenuated 10,000-fold in power reads as 4 absorbance units (common practice)', () => {
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    // A 30 fs pulse has a power spectrum about 490 cm⁻¹ wide (time–bandwidth product 0.441, common practice), so
    // its 10⁻⁴ coverage spans roughly 1500 ± 900 cm⁻¹: part of the grid only.
    const { sample, reference } = writeTracePair(join(dir, 'one'), 'flat', {
      attenuation: 1e4,
      fwhm: 30,
      sidecar: false,
    });
    const r = bandshelf([
      'add',
      sample,
      '--time-domain',
      '--reference',
      reference,
      '--id',
      'flat-4',
      ...lib,
      '--force',
    ]);
    expect(r.code, r.stderr).toBe(0);
    const show = parseJson<ShowJson>(bandshelf(['show', 'flat-4', ...lib, '--json']).stdout);
    expect(show.recipe.timeDomain).not.toBeNull();
    expect(show.files.map((f) => [f.role, f.name])).toEqual([
      ['sample-trace', 'flat-sample.csv'],
      ['reference-trace', 'flat-reference.csv'],
    ]);
    expect(show.original.y.length).toBeGreaterThan(10);
    for (const a of show.original.y) expect(a).toBeCloseTo(4, 6);
    expect(show.extras.dynamicRangeOrders).toBeGreaterThan(4);
    expect(show.extras.traces).toEqual({ sample: 1, reference: 1 });
    // The pulse covers only part of 4000–600 cm⁻¹, so QC warns about narrow coverage, but it does cover the
    // grid around its 1500 cm⁻¹ carrier.
    expect(show.qc.map((f) => f.code)).toContain('narrow-coverage');
    expect(show.coverage).not.toBeNull();
    expect(show.coverage!.min).toBeLessThan(1500);
    expect(show.coverage!.max).toBeGreaterThan(1500);
    expect(bandshelf(['check', ...lib]).code).toBe(0);
  });

  it('averages repeated traces and stores the residual timing spread; a sidecar naming both files works in a folder', () => {
    const a = writeTracePair(join(dir, 'rep-a'), 'rep', { attenuation: 10, sidecar: false });
    const b = writeTracePair(join(dir, 'rep-b'), 'rep', { attenuation: 10, sidecar: false });
    const r = bandshelf([
      'add',
      a.sample,
      b.sample,
      '--time-domain',
      '--reference',
      a.reference,
      '--reference',
      b.reference,
      '--id',
      'repeated',
      ...lib,
    ]);
    expect(r.code, r.stderr).toBe(0);
    const show = parseJson<ShowJson>(bandshelf(['show', 'repeated', ...lib, '--json']).stdout);
    expect(show.extras.traces).toEqual({ sample: 2, reference: 2 });
    expect(typeof show.extras.timingSpreadAs).toBe('number');
    writeTracePair(join(dir, 'folder'), 'from-sidecar', { attenuation: 10 });
    const folder = bandshelf(['add', join(dir, 'folder'), ...lib, '--json']);
    expect(folder.code, folder.stderr).toBe(0);
    // The two trace files belong to the sidecar's entry: one entry, not three.
    expect(parseJson<{ added: { id: string }[] }>(folder.stdout).added.map((x) => x.id)).toEqual([
      'from-sidecar',
    ]);
  });

  it('refuses --time-domain without a reference, and --reference without --time-domain', () => {
    const { sample, reference } = writeTracePair(join(dir, 'bad'), 'bad', { sidecar: false });
    const none = bandshelf(['add', sample, '--time-domain', ...lib]);
    expect(none.code).toBe(2);
    expect(none.stderr).toContain('--reference');
    const stray = bandshelf(['add', sample, '--reference', reference, ...lib]);
    expect(stray.code).toBe(2);
  });
});
