// Content identity: data hash over files and read options, content hash over data, recipe and metadata.
import { describe, expect, it } from 'vitest';
import { canonicalJson } from '../../../src/library/store/canonicalJson.js';
import { contentHashes } from '../../../src/library/store/contentHashes.js';
import { sha256Hex } from '../../../src/library/store/sha256Hex.js';

const base = {
  files: [{ role: 'data' as const, sha256: sha256Hex('1000,0.1\n1002,0.2\n') }],
  read: {},
  recipe: { baseline: { method: 'none' }, version: 1 },
  meta: { id: 'water', name: 'Water' },
};

describe('contentHashes', () => {
  it('is SHA-256 of the documented canonical JSON', () => {
    const h = contentHashes(base);
    const data = sha256Hex(canonicalJson({ v: 1, files: base.files, read: {} }));
    expect(h.data).toBe(data);
    expect(h.content).toBe(sha256Hex(canonicalJson({ v: 1, data, recipe: base.recipe, meta: base.meta })));
  });

  it('metadata and recipe change the content hash only; files and read options change both', () => {
    const h = contentHashes(base);
    const meta = contentHashes({ ...base, meta: { ...base.meta, name: 'Liquid water' } });
    expect(meta.data).toBe(h.data);
    expect(meta.content).not.toBe(h.content);
    const recipe = contentHashes({ ...base, recipe: { ...base.recipe, baseline: { method: 'rubberband' } } });
    expect(recipe.data).toBe(h.data);
    expect(recipe.content).not.toBe(h.content);
    const read = contentHashes({ ...base, read: { yUnit: 'percent-transmittance' } });
    expect(read.data).not.toBe(h.data);
    const file = contentHashes({ ...base, files: [{ role: 'data', sha256: sha256Hex('other') }] });
    expect(file.data).not.toBe(h.data);
    expect(file.content).not.toBe(h.content);
  });

  it('ignores key order and file names', () => {
    const h = contentHashes(base);
    const reordered = contentHashes({
      ...base,
      meta: { name: 'Water', id: 'water' },
      recipe: { version: 1, baseline: { method: 'none' } },
      files: [{ ...base.files[0]!, name: 'renamed.csv' } as (typeof base.files)[0]],
    });
    expect(reordered).toEqual(h);
  });
});
