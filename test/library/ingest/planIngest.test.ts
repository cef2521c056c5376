// planIngest without the CLI: which files of a folder become jobs, with which sidecar and manifest row, and what
// the user is told about the rest.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { planIngest } from '../../../src/library/ingest/planIngest.js';
import { bandsFor, tempDir, writeSpectrumCsv } from '../../cli/bandshelfCli.js';

describe('planIngest', () => {
  it("gives each file its folder manifest's row (by path from the manifest's folder) and warns of a row naming no file", () => {
    const dir = tempDir('bandshelf-plan-');
    const data = join(dir, 'refs');
    mkdirSync(join(data, 'sub'), { recursive: true });
    writeSpectrumCsv(join(data, 'albumin.csv'), bandsFor(1));
    writeSpectrumCsv(join(data, 'sub', 'glucose.csv'), bandsFor(2));
    // 50-99-7 is D-glucose's CAS registry number (common practice).
    writeFileSync(
      join(data, 'manifest.csv'),
      'file,name,class,cas\nsub/glucose.csv,D-Glucose (synthetic),carbohydrate,50-99-7\nmissing.csv,Nothing,other,\n',
    );
    const plan = planIngest(['refs'], { cwd: dir });
    const byLabel = new Map(plan.jobs.map((j) => [j.label, j]));
    expect([...byLabel.keys()].sort()).toEqual([
      join('refs', 'albumin.csv'),
      join('refs', 'sub', 'glucose.csv'),
    ]);
    expect(byLabel.get(join('refs', 'sub', 'glucose.csv'))?.manifestMeta).toMatchObject({
      name: 'D-Glucose (synthetic)',
      class: 'carbohydrate',
      cas: '50-99-7',
    });
    expect(byLabel.get(join('refs', 'albumin.csv'))?.manifestMeta).toBeUndefined();
    expect(plan.warnings).toEqual([
      `${join('refs', 'manifest.csv')}: names missing.csv, which is not among the files added`,
    ]);
  });

  it('takes a manifest given as an option for files named one by one', () => {
    const dir = tempDir('bandshelf-plan-');
    writeSpectrumCsv(join(dir, 'a.csv'), bandsFor(3));
    writeFileSync(join(dir, 'rows.csv'), 'file,name,class\na.csv,Alpha,lipid\n');
    const plan = planIngest(['a.csv'], { cwd: dir, manifest: 'rows.csv' });
    expect(plan.jobs).toHaveLength(1);
    expect(plan.jobs[0]!.manifestMeta).toMatchObject({ name: 'Alpha', class: 'lipid' });
    expect(plan.warnings).toEqual([]);
  });

  it('pairs a file with its sidecar, leaves sidecars and other files out, and skips a folder of unknowns', () => {
    const dir = tempDir('bandshelf-plan-');
    const data = join(dir, 'refs');
    mkdirSync(join(data, 'unknowns'), { recursive: true });
    writeSpectrumCsv(join(data, 'serum.csv'), bandsFor(4));
    writeFileSync(join(data, 'serum.meta.json'), JSON.stringify({ name: 'Serum (synthetic)' }));
    writeFileSync(join(data, 'README.md'), 'not a spectrum');
    writeSpectrumCsv(join(data, 'unknowns', 'query.csv'), bandsFor(5));
    const plan = planIngest(['refs'], { cwd: dir });
    expect(plan.jobs.map((j) => j.label)).toEqual([join('refs', 'serum.csv')]);
    expect(plan.jobs[0]!.sidecarPath).toBe(join(data, 'serum.meta.json'));
    expect(plan.warnings).toEqual([
      `${join('refs', 'unknowns')}: skipped (a folder of unknowns to match, not references)`,
    ]);
  });
});
