// The sidecar reader: validated metadata from a .meta.json file; errors name the file, line and field.
import { describe, expect, it } from 'vitest';
import { readSidecar } from '../../src/formats/readSidecar.js';
import { readSidecarSections } from '../../src/formats/readSidecarSections.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

const file = 'library/serum-07.meta.json';

describe('readSidecar', () => {
  it('reads and validates the metadata fields, returning valid ones exactly as written', () => {
    const meta = {
      id: 'serum-07',
      name: 'Dried serum film 07',
      class: 'biofluid',
      cas: '7732-18-5',
      tags: ['serum', 'film'],
      concentration: { value: 1.5, unit: 'mg/mL' },
      synthetic: true,
    };
    expect(readSidecar(JSON.stringify(meta), { file })).toEqual(meta);
  });

  it('leaves id and name to default from the file name later', () => {
    expect(readSidecar('{"class": "protein"}', { file })).toEqual({ class: 'protein' });
    expect(readSidecar('\ufeff{}', { file })).toEqual({});
  });

  it('names the file and the field of a bad value', () => {
    const e = bandshelfErrorOf(() => readSidecar('{"id": "serum-07", "cas": "7732-18-4"}', { file }));
    expect(e.code).toBe('BAD_METADATA');
    expect(e.file).toBe(file);
    expect(e.field).toBe('cas');
    expect(e.oneLine()).toBe(`${file}: cas: has a wrong check digit [BAD_METADATA]`);
  });

  it('names nested fields by their dotted path and counts further problems', () => {
    const e = bandshelfErrorOf(() =>
      readSidecar('{"concentration": {"value": "five", "unit": "mM"}, "date": "2024-02-30", "tags": [1]}', {
        file,
      }),
    );
    expect(e.field).toBe('concentration.value');
    expect(e.message).toBe('must be a number (and 2 more: date, tags.0)');
  });

  it('hints at the field a typo meant', () => {
    const e = bandshelfErrorOf(() => readSidecar('{"clas": "protein"}', { file }));
    expect(e.field).toBe('clas');
    expect(e.message).toBe('unknown field (did you mean "class"?)');
    expect(bandshelfErrorOf(() => readSidecar('{"recipie": {}}', { file })).message).toContain('"recipe"');
    expect(bandshelfErrorOf(() => readSidecar('{"wibble": 1}', { file })).message).toBe('unknown field');
  });

  it('lists the allowed values of an enumeration', () => {
    const e = bandshelfErrorOf(() => readSidecar('{"technique": "FTIR"}', { file }));
    expect(e.field).toBe('technique');
    expect(e.message).toContain(
      'atr, transmission, diffuse-reflectance, tunable-laser, field-resolved, other',
    );
  });

  it('gives the line of a JSON syntax error', () => {
    const text = '{\n  "id": "serum-07",\n  "name": "x",\n  "class": "protein"\n  "tags": []\n}\n';
    const e = bandshelfErrorOf(() => readSidecar(text, { file }));
    expect(e.code).toBe('BAD_METADATA');
    expect(e.line).toBe(5);
    expect(e.oneLine()).toMatch(/^library\/serum-07\.meta\.json:5: not valid JSON/);
    expect(bandshelfErrorOf(() => readSidecar('{"a": "unterminated', { file })).line).toBe(1);
    expect(bandshelfErrorOf(() => readSidecar('{"a": 1,}', { file })).line).toBe(1);
    expect(bandshelfErrorOf(() => readSidecar('{"a": 1}\n\nx', { file })).line).toBe(3);
  });

  it('refuses what is not a JSON object, an empty file and a huge one', () => {
    expect(bandshelfErrorOf(() => readSidecar('[1, 2]', { file })).message).toContain('JSON object');
    expect(bandshelfErrorOf(() => readSidecar('null', { file })).code).toBe('BAD_METADATA');
    expect(bandshelfErrorOf(() => readSidecar('  \n', { file })).code).toBe('EMPTY_FILE');
    expect(
      bandshelfErrorOf(() => readSidecar(`{"notes": "${'x'.repeat(200)}"}`, { file, maxChars: 100 })).code,
    ).toBe('FILE_TOO_LARGE');
  });
});

describe('readSidecarSections', () => {
  it('separates the recipe and the time-domain files from the metadata', () => {
    const text = JSON.stringify({
      id: 'td-01',
      name: 'Field-resolved demo',
      technique: 'field-resolved',
      timeDomain: { sample: 'td-01-sample.csv', reference: ['td-01-ref-a.csv', 'td-01-ref-b.csv'] },
      recipe: { baseline: { method: 'none' }, normalise: { method: 'minmax' } },
    });
    const sections = readSidecarSections(text, { file });
    expect(sections.meta).toEqual({ id: 'td-01', name: 'Field-resolved demo', technique: 'field-resolved' });
    expect(sections.timeDomain).toEqual({
      sample: ['td-01-sample.csv'],
      reference: ['td-01-ref-a.csv', 'td-01-ref-b.csv'],
    });
    // Defaults of the recipe schema are filled in: the stored recipe is always complete.
    expect(sections.recipe?.baseline).toEqual({ method: 'none' });
    expect(sections.recipe?.exclude).toEqual([{ min: 2280, max: 2400 }]);
    expect(readSidecar(text, { file })).toEqual(sections.meta);
  });

  it('reports a bad recipe as BAD_RECIPE with the path inside it', () => {
    const e = bandshelfErrorOf(() =>
      readSidecarSections('{"recipe": {"baseline": {"method": "als", "p": 2}}}', { file }),
    );
    expect(e.code).toBe('BAD_RECIPE');
    expect(e.field).toBe('recipe.baseline.p');
  });

  it('keeps trace names inside the sidecar folder', () => {
    for (const bad of ['../x.csv', '/abs/x.csv', 'C:\\x.csv', 'a/../../x.csv', '']) {
      const e = bandshelfErrorOf(() =>
        readSidecarSections(JSON.stringify({ timeDomain: { sample: bad, reference: 'r.csv' } }), { file }),
      );
      expect(e.code).toBe('BAD_METADATA');
      expect(e.field?.startsWith('timeDomain.sample')).toBe(true);
    }
    expect(
      bandshelfErrorOf(() => readSidecarSections('{"timeDomain": {"sample": "s.csv"}}', { file })).field,
    ).toBe('timeDomain.reference');
    expect(
      bandshelfErrorOf(() =>
        readSidecarSections('{"timeDomain": {"sample": "s.csv", "reference": "r", "x": 1}}', { file }),
      ).field,
    ).toBe('timeDomain.x');
  });
});
