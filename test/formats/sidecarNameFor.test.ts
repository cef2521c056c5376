// Sidecar file names: the name beside a data file, and telling sidecars from data files.
import { describe, expect, it } from 'vitest';
import { isSidecarName } from '../../src/formats/isSidecarName.js';
import { sidecarNameFor } from '../../src/formats/sidecarNameFor.js';

describe('sidecarNameFor', () => {
  it.each([
    ['serum-07.csv', 'serum-07.meta.json'],
    ['glucose.jdx', 'glucose.meta.json'],
    ['a.b.dx', 'a.b.meta.json'],
    ['noextension', 'noextension.meta.json'],
    ['.hidden', '.hidden.meta.json'],
    ['library/proteins/bsa.CSV', 'library/proteins/bsa.meta.json'],
    ['C:\\data\\urea.txt', 'C:\\data\\urea.meta.json'],
    ['dir.v2/plain', 'dir.v2/plain.meta.json'],
  ])('%s → %s', (data, sidecar) => {
    expect(sidecarNameFor(data)).toBe(sidecar);
  });

  it('takes another suffix', () => {
    expect(sidecarNameFor('x.csv', { suffix: '.json' })).toBe('x.json');
  });

  it('names something isSidecarName recognises, and never the data file itself', () => {
    for (const data of ['serum-07.csv', 'x', 'a.b.c', 'dir/y.jdx']) {
      expect(isSidecarName(sidecarNameFor(data))).toBe(true);
      expect(isSidecarName(data)).toBe(false);
    }
  });
});

describe('isSidecarName', () => {
  it('recognises the suffix in any case and folder', () => {
    expect(isSidecarName('serum-07.meta.json')).toBe(true);
    expect(isSidecarName('dir/SERUM.META.JSON')).toBe(true);
    expect(isSidecarName('dir\\x.meta.json')).toBe(true);
  });

  it('does not take look-alikes for sidecars', () => {
    expect(isSidecarName('.meta.json')).toBe(false);
    expect(isSidecarName('meta.json')).toBe(false);
    expect(isSidecarName('serum.meta.json.csv')).toBe(false);
    expect(isSidecarName('dir.meta.json/serum.csv')).toBe(false);
  });
});
