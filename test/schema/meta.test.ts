// The entry metadata schema: required fields, classes and techniques, field formats and the patch schema.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { entryClasses, entryMetaPatchSchema, entryMetaSchema, techniques } from '../../src/schema/meta.js';

const base = { id: 'serum-07', name: 'Dried serum film 07' };

function issuesOf(input: unknown): { path: string; message: string }[] {
  const result = entryMetaSchema.safeParse(input);
  if (result.success) return [];
  return result.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
}

describe('entryMetaSchema', () => {
  it('refuses Windows reserved device names as ids, with or without an extension', () => {
    // Reserved names CON, PRN, AUX, NUL, COM0–9, LPT0–9: Microsoft, "Naming Files, Paths, and Namespaces" (from memory).
    for (const id of ['con', 'nul', 'aux.txt', 'com1', 'lpt9', 'prn.tar.gz', 'trailing.']) {
      expect(
        issuesOf({ ...base, id }).map((i) => i.path),
        id,
      ).toEqual(['id']);
    }
    for (const id of ['console', 'nullable', 'com10', 'aux-serum', 'lpt']) {
      expect(issuesOf({ ...base, id }), id).toEqual([]);
    }
  });

  it('needs only id and name', () => {
    expect(entryMetaSchema.parse(base)).toEqual(base);
    expect(issuesOf({ name: 'x' }).map((i) => i.path)).toEqual(['id']);
    expect(issuesOf({ id: 'x' }).map((i) => i.path)).toEqual(['name']);
  });

  it('accepts a fully described entry and trims text', () => {
    const full = {
      id: 'glucose_aq.10',
      name: '  D-Glucose in water  ',
      synonyms: ['dextrose', 'grape sugar'],
      class: 'carbohydrate',
      formula: 'C6H12O6',
      // InChIKey of water, used here only for its shape (from memory).
      inchiKey: 'XLYOFNOQVPJJNP-UHFFFAOYSA-N',
      cas: '50-99-7',
      sampleForm: 'dried film',
      preparation: 'Spotted 2 µL on the crystal,\ndried 10 min under nitrogen.',
      solvent: 'water',
      concentration: { value: 10, unit: 'mg/mL' },
      technique: 'atr',
      resolution: 4,
      temperature: 22.5,
      contributor: 'A. Researcher',
      date: '2024-02-29',
      licence: 'CC-BY-4.0',
      source: 'doi:10.5555/synthetic.0001',
      tags: ['sugar', 'reference set'],
      notes: 'synthetic demo entry',
      synthetic: true,
      origin: 'Bench 3',
      owner: 'Demo lab',
      state: 'solid',
      samplingProcedure: 'ATR, diamond, 1 reflection',
    };
    const parsed = entryMetaSchema.parse(full);
    expect(parsed.name).toBe('D-Glucose in water');
    expect(parsed.preparation).toContain('\n');
    expect(parsed.concentration).toEqual({ value: 10, unit: 'mg/mL' });
  });

  it('lists the classes and techniques of the issue', () => {
    expect([...entryClasses]).toEqual([
      'protein',
      'lipid',
      'carbohydrate',
      'nucleic-acid',
      'metabolite',
      'drug',
      'solvent',
      'buffer',
      'mixture',
      'biofluid',
      'other',
    ]);
    expect([...techniques]).toEqual([
      'atr',
      'transmission',
      'diffuse-reflectance',
      'tunable-laser',
      'field-resolved',
      'other',
    ]);
    expect(issuesOf({ ...base, class: 'sugar' })[0]?.path).toBe('class');
    expect(entryMetaSchema.parse({ ...base, technique: 'ATR', class: 'Biofluid' })).toMatchObject({
      technique: 'atr',
      class: 'biofluid',
    });
    expect(issuesOf({ ...base, technique: 'laser-x' })[0]?.path).toBe('technique');
  });

  it.each([
    ['a slash', 'serum/07', 'path separator'],
    ['a backslash', 'serum\\07', 'path separator'],
    ['a parent reference', '..', '".."'],
    ['an embedded ..', 'a..b', '".."'],
    ['a traversal', '../etc/passwd', 'path separator'],
    ['a control character', 'serum\u000007', 'control'],
    ['a newline', 'serum\n07', 'control'],
    ['capitals', 'Serum-07', 'lowercase'],
    ['a space', 'serum 07', 'only lowercase letters'],
    ['a leading dot', '.hidden', 'start with'],
    ['a leading hyphen', '-x', 'start with'],
    ['unicode letters', 'sérum', 'only lowercase letters'],
    ['81 characters', 'a'.repeat(81), 'at most 80'],
    ['nothing', '', 'empty'],
  ])('rejects an id with %s', (_what, id, words) => {
    const issues = issuesOf({ ...base, id });
    expect(issues[0]?.path).toBe('id');
    expect(issues[0]?.message).toContain(words);
  });

  it.each(['serum-07', 'glucose_1.2', '7732-18-5', 'a'.repeat(80), 'x'])('accepts the id %s', (id) => {
    expect(issuesOf({ ...base, id })).toEqual([]);
  });

  it('format-checks the InChIKey', () => {
    // Water's InChIKey (from memory): 14 + 10 + 1 capital letters.
    expect(issuesOf({ ...base, inchiKey: 'XLYOFNOQVPJJNP-UHFFFAOYSA-N' })).toEqual([]);
    for (const bad of [
      'xlyofnoqvpjjnp-uhfffaoysa-n',
      'XLYOFNOQVPJJN-UHFFFAOYSA-N',
      'XLYOFNOQVPJJNPUHFFFAOYSAN',
    ]) {
      expect(issuesOf({ ...base, inchiKey: bad })[0]?.path).toBe('inchiKey');
    }
  });

  it('verifies the CAS check digit', () => {
    expect(issuesOf({ ...base, cas: '7732-18-5' })).toEqual([]);
    expect(issuesOf({ ...base, cas: '7732-18-4' })).toEqual([
      { path: 'cas', message: 'has a wrong check digit' },
    ]);
    expect(issuesOf({ ...base, cas: '773218-5' })[0]?.message).toContain('CAS Registry Number');
  });

  it('checks dates are real calendar dates', () => {
    expect(issuesOf({ ...base, date: '2024-02-29' })).toEqual([]); // 2024 is a leap year
    expect(issuesOf({ ...base, date: '2023-02-29' })[0]?.message).toBe('is not a calendar date');
    expect(issuesOf({ ...base, date: '2024-13-01' })[0]?.message).toBe('is not a calendar date');
    expect(issuesOf({ ...base, date: '24-01-01' })[0]?.path).toBe('date');
    expect(issuesOf({ ...base, date: '2024-01-01T10:00' })[0]?.path).toBe('date');
  });

  it('checks numbers and their ranges', () => {
    expect(issuesOf({ ...base, resolution: 0 })[0]?.path).toBe('resolution');
    expect(issuesOf({ ...base, resolution: -4 })[0]?.path).toBe('resolution');
    expect(issuesOf({ ...base, resolution: '4' })[0]?.path).toBe('resolution');
    expect(issuesOf({ ...base, temperature: -300 })[0]?.message).toContain('absolute zero');
    expect(issuesOf({ ...base, temperature: -273.15 })).toEqual([]);
    expect(issuesOf({ ...base, concentration: { value: -1, unit: 'mM' } })[0]?.path).toBe(
      'concentration.value',
    );
    expect(issuesOf({ ...base, concentration: { value: 1 } })[0]?.path).toBe('concentration.unit');
    expect(issuesOf({ ...base, concentration: { value: 1, unit: 'mM', x: 1 } })[0]?.path).toBe(
      'concentration',
    );
  });

  it('checks licence identifiers by their SPDX shape', () => {
    for (const ok of ['CC-BY-4.0', 'CC0-1.0', 'MIT', 'MIT OR Apache-2.0', 'LicenseRef-lab-internal']) {
      expect(issuesOf({ ...base, licence: ok })).toEqual([]);
    }
    for (const bad of ['CC BY 4.0', 'free!', ''])
      expect(issuesOf({ ...base, licence: bad })[0]?.path).toBe('licence');
  });

  it('takes a source as a DOI or as a citation, and checks what looks like a DOI', () => {
    for (const ok of [
      '10.5555/synthetic.0001',
      'doi:10.5555/synthetic.0001',
      'https://doi.org/10.5555/synthetic.0001',
      'Invented Lab, Internal Report 3 (2024)',
    ]) {
      expect(issuesOf({ ...base, source: ok })).toEqual([]);
    }
    expect(issuesOf({ ...base, source: 'doi:10.12' })[0]?.message).toContain('DOI');
    expect(issuesOf({ ...base, source: '   ' })[0]?.path).toBe('source');
  });

  it('keeps markup in names and notes as plain text (escaping is the site’s job)', () => {
    const meta = entryMetaSchema.parse({
      ...base,
      name: '<img src=x onerror=alert(1)>',
      notes: '"><script>x</script>',
    });
    expect(meta.name).toBe('<img src=x onerror=alert(1)>');
    expect(meta.notes).toBe('"><script>x</script>');
  });

  it('rejects unknown fields, control characters and a ";" inside a tag', () => {
    expect(issuesOf({ ...base, colour: 'red' })[0]?.message).toContain('colour');
    expect(issuesOf({ ...base, name: 'a\u0007b' })[0]?.message).toContain('control');
    expect(issuesOf({ ...base, notes: 'line one\nline two\ttabbed' })).toEqual([]);
    expect(issuesOf({ ...base, notes: 'bell\u0007' })[0]?.path).toBe('notes');
    expect(issuesOf({ ...base, tags: ['a;b'] })[0]?.path).toBe('tags.0');
    expect(issuesOf({ ...base, synthetic: 'yes' })[0]?.path).toBe('synthetic');
  });

  it('validates patches field by field without requiring id or name', () => {
    expect(entryMetaPatchSchema.parse({ class: 'protein' })).toEqual({ class: 'protein' });
    expect(entryMetaPatchSchema.safeParse({ cas: '64-17-4' }).success).toBe(false);
    expect(entryMetaPatchSchema.safeParse({ clas: 'protein' }).success).toBe(false);
  });

  it('exports to JSON Schema with an id pattern that agrees with the validator', () => {
    const json = z.toJSONSchema(entryMetaSchema, { io: 'input' }) as {
      required: string[];
      properties: Record<string, { pattern?: string }>;
    };
    expect(json.required).toEqual(['id', 'name']);
    const pattern = new RegExp(json.properties['id']!.pattern!);
    fc.assert(
      fc.property(
        fc.oneof(
          fc.string({ maxLength: 90 }),
          fc.stringMatching(/^[a-z0-9._\-/]{0,85}$/),
          fc.constantFrom('..', 'a..b', 'a/b', '-a', '.a', 'con', 'nul.x', 'com1', 'console', 'a.'),
        ),
        (id) => {
          const accepted = entryMetaSchema.safeParse({ ...base, id }).success;
          expect(pattern.test(id)).toBe(accepted);
          if (accepted) {
            expect(id).not.toMatch(/[/\\]/);
            expect(id).not.toContain('..');
            expect(id.length).toBeLessThanOrEqual(80);
          }
        },
      ),
      { seed: 7, numRuns: 500 },
    );
  });
});
