// A match the source cannot answer is refused once, before any unknown is read.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../../src/error.js';
import { checkMatchSource } from '../../../src/match/pipeline/checkMatchSource.js';

const entry = (id: string) => ({ id, revision: 1, name: id, class: 'metabolite' });

function codeOf(f: () => void): string | undefined {
  try {
    f();
  } catch (error) {
    return error instanceof BandshelfError ? `${error.code}:${error.field ?? ''}` : 'other';
  }
  return undefined;
}

describe('checkMatchSource', () => {
  it('passes a source with entries and forced ids it holds', () => {
    expect(
      codeOf(() => checkMatchSource({ entries: [entry('a'), entry('b')], at: null }, { with: ['b'] })),
    ).toBe(undefined);
  });
  it('refuses an empty source, naming the release', () => {
    expect(codeOf(() => checkMatchSource({ entries: [], at: null }))).toBe('EMPTY_LIBRARY:');
    expect(() => checkMatchSource({ entries: [], at: 'v1' })).toThrow("release 'v1' holds no entries");
  });
  it('refuses a forced id that is not an entry, with the API name of the option', () => {
    expect(codeOf(() => checkMatchSource({ entries: [entry('a')], at: null }, { with: ['zz'] }))).toBe(
      'NOT_FOUND:with',
    );
    expect(() => checkMatchSource({ entries: [entry('a')], at: null }, { with: ['zz'] })).toThrow(
      '`with` names',
    );
  });
});
