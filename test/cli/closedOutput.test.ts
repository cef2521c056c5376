// A reader that closes the pipe early (`show --json | head -c 100`) ends the command quietly, with its usual exit
// status and no stack trace; bad cells are still quoted by a short excerpt only.
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

const BIN = join(__dirname, '..', '..', 'src', 'cli', 'bandshelf.mjs');

describe('a closed output', () => {
  const dir = tempDir();
  const lib = join(dir, 'lib.sqlite');

  beforeAll(() => {
    expect(bandshelf(['init', '--library', lib]).code).toBe(0);
    const data = join(dir, 'data');
    mkdirSync(data);
    // 6,801 points: the JSON (~80 kB) outgrows a 64 kB pipe buffer, so the closed pipe is really hit.
    writeSpectrumCsv(join(data, 's0.csv'), bandsFor(3), { start: 4000, stop: 600, step: 0.5 });
    expect(bandshelf(['add', data, '--library', lib]).code).toBe(0);
  });

  it('show --json | head -c 100 prints 100 bytes, no EPIPE and exits 0', () => {
    // The shell reports each side's status: the CLI's must be its usual 0, and stderr must stay empty.
    const out = execFileSync(
      'bash',
      [
        '-c',
        `"${process.execPath}" "${BIN}" show s0 --json --library "${lib}" 2>"${dir}/err.txt" | head -c 100 >/dev/null; echo "\${PIPESTATUS[0]}"; cat "${dir}/err.txt"`,
      ],
      { encoding: 'utf8' },
    );
    const [status, ...err] = out.split('\n');
    expect(status).toBe('0');
    expect(err.join('\n')).not.toMatch(/EPIPE|at .*\.js|Error/);
  });

  it('quotes a bad cell by a short excerpt only', () => {
    const file = join(dir, 'bad.csv');
    writeFileSync(file, `wavenumber,absorbance\n1000,${'9'.repeat(5000)}x\n1002,0.1\n`);
    const r = bandshelf(['add', file, '--library', lib]);
    expect(r.code).not.toBe(0);
    expect(r.stderr.length).toBeLessThan(400);
  });
});
