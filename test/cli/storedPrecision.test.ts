// What `add` stores `check` passes: ordinates so small their processed values underflow Float32, and ordinates so
// large they would overflow it, either round-trip through `check` or are refused at `add` with file and line.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, syntheticSpectrum, tempDir } from './bandshelfCli.js';

/** A JCAMP-DX 4.24 AFFN file (X++(Y..Y), one ordinate per line) whose integer ordinates are scaled by `yFactor`. */
function jcampWith(path: string, yFactor: string, scale = 1): string {
  const { x, y } = syntheticSpectrum(bandsFor(3), { start: 4000, stop: 600, step: 4, noise: 0 });
  const lines = [
    '##TITLE=synthetic scaling probe',
    '##JCAMP-DX=4.24',
    '##DATA TYPE=INFRARED SPECTRUM',
    '##XUNITS=1/CM',
    '##YUNITS=ABSORBANCE',
    '##XFACTOR=1',
    `##YFACTOR=${yFactor}`,
    `##FIRSTX=${x[0]}`,
    `##LASTX=${x[x.length - 1]}`,
    `##DELTAX=${x[1]! - x[0]!}`,
    `##NPOINTS=${x.length}`,
    '##XYDATA=(X++(Y..Y))',
    ...x.map((w, i) => `${w} ${Math.round(y[i]! * 1e6 * scale)}`),
    '##END=',
  ];
  writeFileSync(path, `${lines.join('\n')}\n`);
  return path;
}

describe('what add stores, check passes', () => {
  it('##YFACTOR=1E-300 (processed values below Float32 range) is stored and then checks clean', () => {
    const dir = tempDir();
    const lib = join(dir, 'lib.sqlite');
    expect(bandshelf(['init', '--library', lib]).code).toBe(0);
    const file = jcampWith(join(dir, 'tiny.jdx'), '1E-300');
    const add = bandshelf(['add', file, '--library', lib, '--force']);
    if (add.code === 0) {
      const check = bandshelf(['check', '--library', lib]);
      expect(check.code, check.stdout + check.stderr).toBe(0);
    } else {
      expect(add.stderr).toMatch(/tiny\.jdx/);
      expect(add.stderr).toMatch(/\[NOT_FINITE\]/);
    }
  });

  it('ordinates ×1e306 (beyond Float32) are refused at add naming file and line, even with --force', () => {
    const dir = tempDir();
    const lib = join(dir, 'lib.sqlite');
    expect(bandshelf(['init', '--library', lib]).code).toBe(0);
    const file = jcampWith(join(dir, 'huge.jdx'), '1E300');
    const add = bandshelf(['add', file, '--library', lib, '--force']);
    expect(add.code, add.stdout).not.toBe(0);
    // The first data line is line 13 of the file written above.
    expect(add.stderr).toMatch(/huge\.jdx:13:/);
    expect(add.stderr).toMatch(/\[NOT_FINITE\]/);
    const check = bandshelf(['check', '--library', lib]);
    expect(check.code, check.stdout + check.stderr).not.toBe(1);
  });

  it('a processed value that would overflow Float32 (baseline removal doubling 3e38) is refused, naming the file', () => {
    const dir = tempDir();
    const lib = join(dir, 'lib.sqlite');
    expect(bandshelf(['init', '--library', lib]).code).toBe(0);
    // Ordinates within Float32 (|y| ≤ 3e38), but the rubberband baseline under the −3e38 ends lifts the middle
    // to ~6e38, which a Float32 vector would hold as Infinity. Normalisation off, so nothing scales it back.
    const lines = ['wavenumber_cm-1,absorbance'];
    for (let x = 600; x <= 4000; x += 2) {
      const y = x < 700 || x > 3900 ? -3e38 : 3e38 * Math.sin(((x - 600) / 3400) * Math.PI);
      lines.push(`${x},${y}`);
    }
    const file = join(dir, 'lifted.csv');
    writeFileSync(file, `${lines.join('\n')}\n`);
    const recipe = join(dir, 'recipe.json');
    writeFileSync(recipe, JSON.stringify({ normalise: { method: 'none' } }));
    const add = bandshelf(['add', file, '--library', lib, '--force', '--recipe', recipe]);
    expect(add.code).toBe(1);
    expect(add.stderr).toMatch(/lifted\.csv: processed: the processed value at \d+ cm⁻¹ is [\d.e+]+, beyond/);
    expect(add.stderr).toMatch(/\[NOT_FINITE\]/);
  });
});
