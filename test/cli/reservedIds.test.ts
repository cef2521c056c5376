// Ids Windows reserves for devices are refused through the real `bandshelf add` (from a file name, --id or a
// sidecar), so no export or site page is named CON or NUL; the library keeps nothing of the refused file.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

describe('reserved device names as ids', () => {
  it('refuses con.csv, --id nul and a sidecar id aux.txt, one line each naming the field, and stores nothing', () => {
    // Reserved names CON, PRN, AUX, NUL, COM0–9, LPT0–9: Microsoft, "Naming Files, Paths, and Namespaces" (from memory).
    const dir = tempDir();
    const lib = ['--library', join(dir, 'lib.sqlite')];
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    const con = writeSpectrumCsv(join(dir, 'con.csv'), bandsFor(31));
    const plain = writeSpectrumCsv(join(dir, 'plain.csv'), bandsFor(32));
    const sidecar = writeSpectrumCsv(join(dir, 'side.csv'), bandsFor(33));
    writeFileSync(join(dir, 'side.meta.json'), JSON.stringify({ id: 'aux.txt' }));
    // A file name or sidecar id is bad metadata (exit 1); a bad --id is a bad option (exit 2).
    const cases: [string[], number, RegExp][] = [
      [[con], 1, /con\.csv: id: is a name Windows reserves for a device \[BAD_METADATA\]/],
      [[plain, '--id', 'nul'], 2, /id: --id: is a name Windows reserves for a device \[BAD_OPTION\]/],
      [[sidecar], 1, /side\.meta\.json: id: is a name Windows reserves for a device \[BAD_METADATA\]/],
    ];
    for (const [args, code, line] of cases) {
      const r = bandshelf(['add', ...args, ...lib]);
      expect(r.code, r.stderr).toBe(code);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(line);
    }
    const list = bandshelf(['list', ...lib, '--json']);
    expect(list.code).toBe(0);
    expect(parseJson<unknown[]>(list.stdout)).toEqual([]);
    // The same files under ordinary ids are accepted.
    expect(bandshelf(['add', con, '--id', 'con-serum', ...lib]).code).toBe(0);
  });
});
