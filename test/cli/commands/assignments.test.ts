// `bandshelf assignments`: a lab's own band-assignment rows, validated (every row names its source) and stored.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandshelf, parseJson, tempDir } from '../bandshelfCli.js';

describe('bandshelf assignments', () => {
  const dir = tempDir();
  const lib = ['--library', join(dir, 'lib.sqlite')];

  it('stores valid rows as lab rows and lists them; a row without a source stores nothing', () => {
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    expect(bandshelf(['assignments', ...lib]).stdout).toContain('no band-assignment rows');
    const good = join(dir, 'good.json');
    writeFileSync(
      good,
      JSON.stringify([
        {
          min: 1740,
          max: 1745,
          label: 'ester C=O',
          vibration: 'C=O stretch',
          group: 'ester',
          class: ['lipid'],
          source: 'Movasaghi, Rehman & Rehman, Appl. Spectrosc. Rev. 43 (2008)',
        },
      ]),
    );
    const r = bandshelf(['assignments', '--add', good, ...lib]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toContain('1 band-assignment row added');
    const bad = join(dir, 'bad.json');
    writeFileSync(
      bad,
      JSON.stringify([
        {
          min: 1000,
          max: 1010,
          label: 'x',
          vibration: 'y',
          group: 'z',
          class: ['other'],
          source: 'Lab notes 2026',
        },
        { min: 1650, max: 1660, label: 'no source', vibration: 'v', group: 'g', class: ['protein'] },
      ]),
    );
    const refused = bandshelf(['assignments', '--add', bad, ...lib]);
    expect(refused.code).toBe(1);
    expect(refused.stderr.trim()).toMatch(/^bandshelf: .*bad\.json: row 2\.source: .*\[BAD_METADATA\]$/);
    const rows = parseJson<{ label: string; origin: string; basis: string }[]>(
      bandshelf(['assignments', ...lib, '--json']).stdout,
    );
    expect(rows.map((a) => [a.label, a.origin, a.basis])).toEqual([['ester C=O', 'lab', 'lab']]);
    expect(bandshelf(['check', ...lib]).code).toBe(0);
  });
});
