// The match, identify and mixture commands on the demo collection's unknowns, checked against its ground truth.
import { cpSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { type MatchReport, matchReportSchema } from '../../src/schema/matchReport.js';
import { bandshelf, parseJson, ROOT, tempDir } from './bandshelfCli.js';

interface Truth {
  unknowns: Record<
    string,
    {
      components: { id: string; share: number }[];
      spiked?: string;
      unlistedBands?: number[];
      coverage?: object;
    }
  >;
}

const LIBRARY = join(ROOT, 'library');
const UNKNOWNS = join(LIBRARY, 'unknowns');
const truth = parseJson<Truth>(readFileSync(join(UNKNOWNS, 'truth.json'), 'utf8'));
const spikedName = Object.keys(truth.unknowns).find((name) => truth.unknowns[name]!.spiked !== undefined)!;
const spiked = truth.unknowns[spikedName]!;
const spikedId = spiked.spiked!;

let dir: string;

function report(args: string[], library = 'demo.sqlite'): MatchReport {
  const r = bandshelf([...args, '--library', library, '--json'], { cwd: dir });
  expect(r.code, r.stderr).toBe(0);
  return matchReportSchema.parse(parseJson(r.stdout));
}

beforeAll(() => {
  dir = tempDir('bandshelf-match-demo-');
  expect(bandshelf(['init', '--library', 'demo.sqlite'], { cwd: dir }).code).toBe(0);
  expect(bandshelf(['add', LIBRARY, '--library', 'demo.sqlite'], { cwd: dir }).code).toBe(0);
  // The same collection without the spiked compound.
  const copy = join(dir, 'without');
  cpSync(LIBRARY, copy, { recursive: true });
  rmSync(join(copy, 'unknowns'), { recursive: true });
  const walk = (d: string): void => {
    for (const name of readdirSync(d, { withFileTypes: true })) {
      const full = join(d, name.name);
      if (name.isDirectory()) walk(full);
      else if (new RegExp(`(^|-)${spikedId}\\.`).test(name.name)) rmSync(full);
    }
  };
  walk(copy);
  expect(bandshelf(['init', '--library', 'without.sqlite'], { cwd: dir }).code).toBe(0);
  expect(bandshelf(['add', 'without', '--library', 'without.sqlite'], { cwd: dir }).code).toBe(0);
}, 300_000);

describe('matching the demo unknowns', () => {
  it('finds the spiked compound of the spiked mixture with --mixture, near its true share', () => {
    const r = report(['match', join(UNKNOWNS, spikedName), '--mixture']);
    const m = r.mixture!;
    const found = m.components.find((c) => c.id === spikedId);
    expect(found, JSON.stringify(m.components.map((c) => c.id))).toBeDefined();
    const share = spiked.components.find((c) => c.id === spikedId)!.share;
    expect(Math.abs(found!.share - share)).toBeLessThan(0.02);
    expect(m.r2).toBeGreaterThan(0.99);
  });

  it('lists the spiked compound’s main band among the unexplained bands when it is left out', () => {
    const shown = bandshelf(['show', spikedId, '--library', 'demo.sqlite', '--json'], { cwd: dir });
    const peaks = parseJson<{ peaks: { position: number; height: number }[] }>(shown.stdout).peaks;
    const main = [...peaks].sort((a, b) => b.height - a.height)[0]!.position;
    const r = report(['match', join(UNKNOWNS, spikedName), '--mixture'], 'without.sqlite');
    expect(r.mixture!.components.map((c) => c.id)).not.toContain(spikedId);
    expect(r.mixture!.residualBands.some((b) => Math.abs(b.position - main) <= 4)).toBe(true);
  });

  it('assigns the demo serum’s amide I, amide II, CH₂ stretch and phosphate bands to the right classes', () => {
    const serum = Object.keys(truth.unknowns).find((name) => name.includes('serum'))!;
    const fitted = report(['identify', join(UNKNOWNS, serum)]);
    // A band the demo's truth lists as in no library entry stays unexplained and unassigned to any component.
    for (const p of truth.unknowns[serum]!.unlistedBands ?? []) {
      const b = fitted.bands.find((x) => Math.abs(x.position - p) <= 6);
      expect(b?.explained).toBe(false);
      expect(b?.assignedTo).toBeNull();
    }
    // The table assignments themselves, without the fit.
    const r = report(['identify', join(UNKNOWNS, serum), '--no-mixture']);
    const near = (p: number, within = 6) => r.bands.find((b) => Math.abs(b.position - p) <= within);
    const classesNear = (p: number) => near(p)?.assignments.flatMap((a) => a.class) ?? [];
    // Barth, Biochim. Biophys. Acta 1767 (2007): amide I ~1650 and amide II ~1550 are protein bands.
    expect(near(1652)?.assignments[0]?.class).toContain('protein');
    expect(near(1545)?.assignments[0]?.class).toContain('protein');
    // Movasaghi, Rehman & Rehman, Appl. Spectrosc. Rev. 43 (2008): CH₂ stretches are lipid; PO₂⁻ asymmetric
    // stretch is nucleic acid or phospholipid.
    expect(classesNear(2922)).toContain('lipid');
    expect(classesNear(2852)).toContain('lipid');
    const phosphate = near(1238, 8)!;
    expect(phosphate.assignments.find((a) => a.label.startsWith('phosphate'))?.class).toEqual([
      'nucleic-acid',
      'phospholipid',
    ]);
  });

  it('assigns pure caffeine’s bands to the fitted caffeine, not to protein, glycogen or nucleic-acid rows', () => {
    const name = Object.keys(truth.unknowns).find(
      (n) => truth.unknowns[n]!.components[0]!.id === 'caffeine',
    )!;
    const r = report(['identify', join(UNKNOWNS, name)]);
    const onCaffeine = r.bands.filter((b) => b.assignedTo?.id === 'caffeine');
    expect(onCaffeine.length).toBeGreaterThan(r.bands.length / 2);
    for (const b of r.bands) {
      if (b.assignedTo === null) continue;
      expect(b.assignments).toEqual([]);
    }
    // What was wrong before: amide I/II/III, glycogen and nucleic-acid rows on caffeine's own bands.
    const offered = r.bands
      .filter((b) => b.explained === true)
      .flatMap((b) => b.assignments.map((a) => a.label));
    expect(offered.filter((l) => /amide|glycogen|nucleic/.test(l))).toEqual([]);
  });

  it('fits the tunable-laser unknown with its own compound alone and leaves none of its bands unexplained', () => {
    const [name, t] = Object.entries(truth.unknowns).find(([, u]) => u.coverage !== undefined)!;
    const id = t.components[0]!.id;
    const r = report(['match', join(UNKNOWNS, name), '--mixture']);
    const m = r.mixture!;
    expect(m.components.map((c) => c.id)).toEqual([id]);
    expect(m.r2).toBeGreaterThanOrEqual(0.98);
    // The references were processed again over the unknown's short span, and the report says so.
    expect(m.criterion).toMatch(/processed again over that span/);
    const shown = bandshelf(['show', id, '--library', 'demo.sqlite', '--json'], { cwd: dir });
    const peaks = parseJson<{ peaks: { position: number }[] }>(shown.stdout).peaks;
    const own = m.residualBands.filter((b) => peaks.some((p) => Math.abs(p.position - b.position) <= 4));
    expect(own.map((b) => b.position)).toEqual([]);
    for (const band of r.bands) expect(band.explained, String(band.position)).toBe(true);
  });

  it('ranks the true compound first for the single-compound and the tunable-laser unknowns', () => {
    for (const [name, t] of Object.entries(truth.unknowns)) {
      if (t.components.length !== 1) continue;
      const r = report(['match', join(UNKNOWNS, name)]);
      expect(r.hits[0]!.id, name).toBe(t.components[0]!.id);
      if (t.coverage) expect(r.query.coverage!.overlap).toBeLessThan(800);
    }
  });
});
