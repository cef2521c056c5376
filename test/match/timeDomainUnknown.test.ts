// A trace pair as a match unknown: the same spectrum `add --time-domain` stores for the pair (readOriginals, with the
// noise-floor factor pinned as for a new add), the name and hash it is given, and a refusal without references.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { readOriginals } from '../../src/library/store/readOriginals.js';
import { timeDomainUnknown } from '../../src/match/timeDomainUnknown.js';
import { recipeSchema } from '../../src/schema/recipe.js';
import { ROOT } from '../cli/bandshelfCli.js';

const traces = join(ROOT, 'library', 'time-domain');
const file = (name: string) => ({ name, bytes: readFileSync(join(traces, name)) });

describe('timeDomainUnknown', () => {
  const recipe = recipeSchema.parse({});
  const sample = file('paracetamol-field-resolved-sample.csv');
  const reference = file('paracetamol-field-resolved-reference.csv');

  it('converts the pair as an add stores it: same wavenumbers and absorbance', () => {
    const unknown = timeDomainUnknown({
      samples: [sample],
      references: [reference],
      recipe,
      file: sample.name,
      hash: 'h',
    });
    // readOriginals is what `add --time-domain` (and `check`) derive a stored original with; k = 3 as a new add pins.
    const [stored] = readOriginals({
      files: [
        { role: 'sample-trace', ...sample },
        { role: 'reference-trace', ...reference },
      ],
      read: {},
      recipe: {
        ...recipe,
        timeDomain: { ...recipeSchema.parse({ timeDomain: {} }).timeDomain!, noiseFloorFactor: 3 },
      },
    });
    expect(unknown.file).toBe(sample.name);
    expect(unknown.hash).toBe('h');
    expect(Array.from(unknown.spectrum.wavenumber)).toEqual(Array.from(stored!.spectrum.wavenumber));
    expect(Array.from(unknown.spectrum.absorbance)).toEqual(Array.from(stored!.spectrum.absorbance));
  });

  it('refuses a pair without a reference trace', () => {
    expect(() =>
      timeDomainUnknown({ samples: [sample], references: [], recipe, file: sample.name, hash: 'h' }),
    ).toThrow(BandshelfError);
  });
});
