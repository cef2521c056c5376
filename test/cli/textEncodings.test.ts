// Every text input goes through the one decoder: a Latin-1 (Windows-1252) sidecar keeps µ and ° (with a warning),
// and a UTF-16 manifest is read like a UTF-8 one, through the real `bandshelf add`.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

/** UTF-16LE with its BOM FF FE (Unicode Standard §3.10). */
function utf16le(text: string): Buffer {
  const out = Buffer.alloc(2 + text.length * 2);
  out.writeUInt16LE(0xfeff, 0);
  for (let i = 0; i < text.length; i++) out.writeUInt16LE(text.charCodeAt(i), 2 + 2 * i);
  return out;
}

describe('text encodings of sidecars and manifests', () => {
  it('reads a Windows-1252 sidecar without losing µ and °, and warns; reads a UTF-16 manifest', () => {
    const dir = tempDir();
    const lib = ['--library', join(dir, 'lib.sqlite')];
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    const data = join(dir, 'refs');
    mkdirSync(data);
    writeSpectrumCsv(join(data, 'film.csv'), bandsFor(1));
    writeSpectrumCsv(join(data, 'other.csv'), bandsFor(2));
    // "Film 25 µm, 37 °C (synthetic)" in Windows-1252: µ is 0xB5, ° is 0xB0.
    const name = 'Film 25 \u00b5m, 37 \u00b0C (synthetic)';
    writeFileSync(join(data, 'film.meta.json'), Buffer.from(JSON.stringify({ name }), 'latin1'));
    writeFileSync(join(data, 'manifest.csv'), utf16le('file,name,cas\nother.csv,D-Glucose (test),50-99-7\n'));
    const add = bandshelf(['add', data, ...lib]);
    expect(add.code, add.stderr).toBe(0);
    expect(add.stdout + add.stderr).toMatch(/film\.meta\.json.*Windows-1252/);
    const film = parseJson<{ meta: { name: string } }>(bandshelf(['show', 'film', ...lib, '--json']).stdout);
    expect(film.meta.name).toBe(name);
    const other = parseJson<{ meta: { name: string; cas: string } }>(
      bandshelf(['show', 'other', ...lib, '--json']).stdout,
    );
    // 50-99-7 is D-glucose's CAS registry number (common practice).
    expect(other.meta.cas).toBe('50-99-7');
  });
});
