// New time-domain adds get the noise floor k = 3 pinned; a revision written without the key keeps its coverage.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { prepareRevision } from '../../../src/library/ingest/prepareRevision.js';
import { closeLibrary } from '../../../src/library/store/closeLibrary.js';
import { commitRevisions } from '../../../src/library/store/commitRevisions.js';
import { readOriginals } from '../../../src/library/store/readOriginals.js';
import { timeDomainSchema } from '../../../src/schema/recipe.js';
import { bandshelf, ROOT } from '../../cli/bandshelfCli.js';
import { newLibrary } from '../libraryFixture.js';

const traces = join(ROOT, 'library', 'time-domain');
const sample = 'paracetamol-field-resolved-sample.csv';
const reference = 'paracetamol-field-resolved-reference.csv';

describe('noise floor default for time-domain adds', () => {
  it('pins k = 3 into a new add, keeps an older revision without it, and check passes on both', () => {
    const { library, dir } = newLibrary();
    const path = join(dir, 'lib.sqlite');
    // A revision as written before the default: its stored time-domain step has no noiseFloorFactor key.
    const files = [
      {
        role: 'sample-trace' as const,
        name: sample,
        bytes: new Uint8Array(readFileSync(join(traces, sample))),
      },
      {
        role: 'reference-trace' as const,
        name: reference,
        bytes: new Uint8Array(readFileSync(join(traces, reference))),
      },
    ];
    const recipe = { ...library.recipe, timeDomain: timeDomainSchema.parse({}) };
    const [original] = readOriginals({ files, read: {}, recipe });
    const prepared = prepareRevision(
      library,
      {
        label: sample,
        files,
        read: {},
        original: original!.spectrum,
        meta: { id: 'older', name: 'Older (synthetic)', class: 'drug' },
        recipe,
        extras: original!.extras,
      },
      { force: true },
    );
    commitRevisions(library, [prepared], { author: 'test' });
    closeLibrary(library);

    // The demo traces are synthetic (src/demo/timeDomainDemo.ts).
    const add = bandshelf([
      'add',
      join(traces, sample),
      '--time-domain',
      '--reference',
      join(traces, reference),
      '--id',
      'newer',
      '--library',
      path,
    ]);
    expect(add.code, add.stderr).toBe(0);
    const show = (id: string) =>
      JSON.parse(bandshelf(['show', id, '--json', '--library', path]).stdout) as {
        recipe: { timeDomain: Record<string, unknown> };
        coverage: unknown;
      };
    // k = 3: the usual 3σ detection criterion (IUPAC detection limit; common practice), stated in README.
    expect(show('newer').recipe.timeDomain.noiseFloorFactor).toBe(3);
    expect('noiseFloorFactor' in show('older').recipe.timeDomain).toBe(false);
    const check = bandshelf(['check', '--library', path]);
    expect(check.code, check.stderr).toBe(0);
    expect(check.stdout).toMatch(/ok: 2 revisions verified/);
  });

  it('leaves the test off when a recipe file says null', () => {
    const { library, dir } = newLibrary();
    closeLibrary(library);
    const path = join(dir, 'lib.sqlite');
    const recipeFile = join(dir, 'recipe.json');
    writeFileSync(recipeFile, JSON.stringify({ timeDomain: { noiseFloorFactor: null } }));
    const add = bandshelf([
      'add',
      join(traces, sample),
      '--time-domain',
      '--reference',
      join(traces, reference),
      '--recipe',
      recipeFile,
      '--library',
      path,
    ]);
    expect(add.code, add.stderr).toBe(0);
    const shown = JSON.parse(
      bandshelf(['show', 'paracetamol-field-resolved-sample', '--json', '--library', path]).stdout,
    ) as { recipe: { timeDomain: Record<string, unknown> } };
    expect(shown.recipe.timeDomain.noiseFloorFactor).toBeNull();
  });
});
