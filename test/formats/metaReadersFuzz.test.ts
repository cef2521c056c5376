// Fuzzing the sidecar and manifest readers: random and mutated input raises only BandshelfError.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { readManifest } from '../../src/formats/readManifest.js';
import { readSidecarSections } from '../../src/formats/readSidecarSections.js';

const sidecar = JSON.stringify(
  {
    id: 'serum-07',
    name: 'Dried serum film 07',
    synonyms: ['film seven'],
    class: 'biofluid',
    cas: '7732-18-5',
    concentration: { value: 1.5, unit: 'mg/mL' },
    date: '2024-02-29',
    tags: ['serum'],
    synthetic: true,
    timeDomain: { sample: ['s.csv'], reference: 'r.csv' },
    recipe: { baseline: { method: 'als', lambda: 1e5 } },
  },
  null,
  2,
);
const manifest = [
  '# synthetic',
  'file,id,name,class,synonyms,resolution,concentration,notes',
  'a.csv,a,A,protein,x;y,4,5 mg/mL,"quoted, with comma"',
  'b.jdx,b,B,lipid,,2 cm-1,,"two',
  'lines"',
  'c.csv,c,C,other,,,,',
].join('\n');

/** Truncate, flip characters, shuffle or duplicate lines, or splice in random text. */
const mutated = (text: string) =>
  fc.oneof(
    fc.nat({ max: text.length }).map((n) => text.slice(0, n)),
    fc
      .array(fc.tuple(fc.nat({ max: text.length - 1 }), fc.integer({ min: 0, max: 0xffff })), {
        minLength: 1,
        maxLength: 8,
      })
      .map((flips) => {
        const chars = [...text];
        for (const [at, code] of flips) chars[at] = String.fromCharCode(code);
        return chars.join('');
      }),
    fc.shuffledSubarray(text.split('\n'), { minLength: 0 }).map((lines) => lines.join('\n')),
    fc
      .tuple(fc.nat({ max: text.length }), fc.string({ maxLength: 40 }))
      .map(([at, s]) => text.slice(0, at) + s + text.slice(at)),
    fc.string({ maxLength: 200 }),
  );

function onlyTypedErrors(read: (text: string) => unknown) {
  return (text: string) => {
    try {
      read(text);
    } catch (error) {
      expect(error).toBeInstanceOf(BandshelfError);
      // The one line a user sees names the problem without a stack trace.
      expect((error as BandshelfError).oneLine()).not.toMatch(/\n|\bat .*:\d+:\d+/);
    }
  };
}

describe('metadata readers under random and mutated input', () => {
  it('readSidecarSections throws nothing but BandshelfError', () => {
    fc.assert(
      fc.property(
        mutated(sidecar),
        onlyTypedErrors((t) => readSidecarSections(t, { file: 'x.meta.json' })),
      ),
      {
        seed: 4242,
        numRuns: 600,
      },
    );
  });

  it('readManifest throws nothing but BandshelfError', () => {
    fc.assert(
      fc.property(
        mutated(manifest),
        onlyTypedErrors((t) => readManifest(t, { file: 'manifest.csv' })),
      ),
      {
        seed: 4343,
        numRuns: 600,
      },
    );
  });

  it('the unmutated inputs read cleanly', () => {
    expect(readSidecarSections(sidecar).meta.id).toBe('serum-07');
    expect(readManifest(manifest).size).toBe(3);
  });
});
