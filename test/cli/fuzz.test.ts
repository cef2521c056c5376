// `npm run fuzz` runs end to end at a small count (as CI does in `npm test`) and prints one JSON summary; no timing
// is asserted: the script measures, the test only checks it ran clean and reports what it promises.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const fuzz = fileURLToPath(new URL('../../dist/fuzz.js', import.meta.url));

describe('npm run fuzz', () => {
  it('runs the reader generators with mutations and large worst cases, and reports no failure', () => {
    const run = spawnSync(process.execPath, [fuzz, '--count', '60', '--seed', '3'], {
      encoding: 'utf8',
      timeout: 300_000,
    });
    // Exit 1 also means an input ran over 5 s (a measured figure, not asserted here): check the failures instead.
    expect(run.stderr).not.toMatch(/worker failed/);
    const report = JSON.parse(run.stdout) as {
      seed: number;
      inputs: number;
      mutatedInputs: number;
      failures: number;
      failuresByCode: Record<string, number>;
      over5s: unknown[];
      slowest: { ms: number; msPerMB: number } | null;
      large: { name: string; msPerMB: number }[];
    };
    expect(report).toMatchObject({ seed: 3, inputs: 60, mutatedInputs: 60, failures: 0, failuresByCode: {} });
    expect(Array.isArray(report.over5s)).toBe(true);
    expect(typeof report.slowest?.msPerMB).toBe('number');
    expect(report.large.map((l) => l.name)).toContain('jcamp-dx 100,000 block titles');
  });

  it('refuses a bad count with one line and exit 2', () => {
    const run = spawnSync(process.execPath, [fuzz, '--count', 'lots'], { encoding: 'utf8' });
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/^fuzz: --count must be a whole number/);
  });
});
