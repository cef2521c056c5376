// Test helpers: run the real `bandshelf` CLI in a child process on a real library file, and write small
// synthetic spectrum files (seeded, so every run sees the same bytes).
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seededRandom } from '../../src/demo/seededRandom.js';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const BIN = join(ROOT, 'src', 'cli', 'bandshelf.mjs');

export interface CliResult {
  code: number;
  stdout: string;
  stderr: string;
}

export interface CliOptions {
  cwd?: string;
  /** Author name for the revisions (BANDSHELF_AUTHOR). */
  author?: string;
}

function env(options: CliOptions): NodeJS.ProcessEnv {
  return { ...process.env, BANDSHELF_AUTHOR: options.author ?? 'test-author', BANDSHELF_DEBUG: '' };
}

export function bandshelf(args: string[], options: CliOptions = {}): CliResult {
  const r = spawnSync(process.execPath, [BIN, ...args], {
    cwd: options.cwd ?? ROOT,
    env: env(options),
    encoding: 'utf8',
    timeout: 120_000,
  });
  return { code: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

/** Starts the CLI without waiting (for kill and concurrency tests). */
export function bandshelfAsync(args: string[], options: CliOptions = {}) {
  const child = spawn(process.execPath, [BIN, ...args], { cwd: options.cwd ?? ROOT, env: env(options) });
  let stdout = '';
  let stderr = '';
  child.stdout.on('data', (d) => {
    stdout += String(d);
  });
  child.stderr.on('data', (d) => {
    stderr += String(d);
  });
  const done = new Promise<CliResult>((resolve) => {
    child.on('close', (code, signal) => resolve({ code: code ?? (signal ? -1 : 0), stdout, stderr }));
  });
  return { child, done };
}

export function tempDir(prefix = 'bandshelf-test-'): string {
  return mkdtempSync(join(tmpdir(), prefix));
}

export interface Band {
  position: number;
  height: number;
  /** Full width at half maximum, cm⁻¹. */
  fwhm: number;
}

export interface SpectrumFileOptions {
  /** @default 4000 */
  start?: number;
  /** @default 600 */
  stop?: number;
  /** @default 2 */
  step?: number;
  /** RMS of seeded white noise, absorbance. @default 0.0005 */
  noise?: number;
  /** @default 1 */
  seed?: number;
  /** Constant offset added to every point. @default 0.02 */
  offset?: number;
}

/** Absorbance of Gaussian bands on a descending axis, as (x, y) arrays. */
export function syntheticSpectrum(bands: readonly Band[], options: SpectrumFileOptions = {}) {
  const start = options.start ?? 4000;
  const stop = options.stop ?? 600;
  const step = options.step ?? 2;
  const rng = seededRandom(options.seed ?? 1);
  const noise = options.noise ?? 0.0005;
  const x: number[] = [];
  const y: number[] = [];
  const n = Math.round(Math.abs(start - stop) / step) + 1;
  for (let i = 0; i < n; i++) {
    const w = start > stop ? start - i * step : start + i * step;
    let a = options.offset ?? 0.02;
    for (const b of bands) {
      const s = b.fwhm / (2 * Math.sqrt(2 * Math.LN2));
      a += b.height * Math.exp(-((w - b.position) ** 2) / (2 * s * s));
    }
    x.push(w);
    y.push(a + noise * rng.normal());
  }
  return { x, y };
}

/** Writes a CSV spectrum (header `wavenumber_cm-1,absorbance`) and returns its path. */
export function writeSpectrumCsv(
  path: string,
  bands: readonly Band[],
  options: SpectrumFileOptions = {},
): string {
  const { x, y } = syntheticSpectrum(bands, options);
  const lines = ['wavenumber_cm-1,absorbance', ...x.map((w, i) => `${w},${y[i]!.toFixed(6)}`)];
  writeFileSync(path, `${lines.join('\n')}\n`);
  return path;
}

/** A family of distinct spectra: entry k gets its own band set, so no two are near-duplicates. */
export function bandsFor(k: number): Band[] {
  const rng = seededRandom(1000 + k);
  const bands: Band[] = [];
  const count = 3 + (k % 4);
  for (let j = 0; j < count; j++) {
    bands.push({
      position: 700 + rng.uniform() * 3200,
      height: 0.1 + rng.uniform() * 0.8,
      fwhm: 8 + rng.uniform() * 40,
    });
  }
  return bands;
}

export function parseJson<T = unknown>(text: string): T {
  return JSON.parse(text) as T;
}
