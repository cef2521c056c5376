// The synthetic field-resolved, tunable-laser and fine-spaced demo files read back into the bands they were made from.
import { describe, expect, it } from 'vitest';
import { demoCompounds } from '../../src/demo/demoCompounds.js';
import { generateDemoLibrary } from '../../src/demo/generateDemoLibrary.js';
import { timeDomainDemoFiles } from '../../src/demo/timeDomainDemo.js';
import { readSidecarSections } from '../../src/formats/readSidecarSections.js';
import { readSpectrumFile } from '../../src/formats/readSpectrumFile.js';
import { readTimeTrace } from '../../src/formats/readTimeTrace.js';
import { recipeSchema } from '../../src/schema/recipe.js';
import { correlation } from '../../src/spectrum/correlation.js';
import { processSpectrum } from '../../src/spectrum/processSpectrum.js';
import { traceToSpectrum } from '../../src/spectrum/trace/traceToSpectrum.js';

const bandsOf = (id: string) => {
  const compound = demoCompounds.find((c) => c.id === id);
  if (!compound) throw new Error(`no demo compound ${id}`);
  return compound.bands;
};

describe('timeDomainDemoFiles', () => {
  const files = timeDomainDemoFiles(20261201, bandsOf);
  const byPath = new Map(files.map((f) => [f.path, f.content]));

  it('is deterministic for a seed and labels every file synthetic', () => {
    expect(timeDomainDemoFiles(20261201, bandsOf).map((f) => f.content)).toEqual(files.map((f) => f.content));
    expect(timeDomainDemoFiles(5, bandsOf)[0]!.content).not.toBe(files[0]!.content);
    for (const f of files) {
      if (f.path.endsWith('.meta.json')) expect(JSON.parse(f.content).synthetic, f.path).toBe(true);
      else expect(f.content.split('\n').slice(0, 3).join('\n'), f.path).toMatch(/^# .*\n# synthetic/);
    }
  });

  it('writes sidecars the metadata reader accepts, naming every trace file that exists', () => {
    const sidecars = files.filter((f) => f.path.startsWith('time-domain/') && f.path.endsWith('.meta.json'));
    expect(sidecars).toHaveLength(2);
    for (const s of sidecars) {
      const sections = readSidecarSections(s.content, { file: s.path });
      expect(sections.meta.technique).toBe('field-resolved');
      expect(sections.timeDomain).toBeDefined();
      for (const name of [...sections.timeDomain!.sample, ...sections.timeDomain!.reference]) {
        expect(byPath.has(`time-domain/${name}`), name).toBe(true);
      }
    }
    const fine = files.find((f) => f.path.startsWith('fine-spaced/') && f.path.endsWith('.meta.json'))!;
    expect(readSidecarSections(fine.content).meta.resolution).toBe(0.1);
  });

  it('gives traces whose spectrum shows the compound bands at their positions', () => {
    for (const [id, compound, repeats] of [
      ['paracetamol-field-resolved', 'paracetamol', 1],
      ['glucose-field-resolved', 'glucose', 3],
    ] as const) {
      const sections = readSidecarSections(byPath.get(`time-domain/${id}.meta.json`)!);
      const read = (name: string) => readTimeTrace(byPath.get(`time-domain/${name}`)!, { file: name });
      const samples = sections.timeDomain!.sample.map(read);
      const references = sections.timeDomain!.reference.map(read);
      expect(samples).toHaveLength(repeats);
      for (const t of [...samples, ...references]) expect(t.warnings).toEqual([]);
      // The recipe defaults: Hann apodisation, zero-fill × 2, coverage above 10⁻⁴ of the reference peak.
      const result = traceToSpectrum(samples, references, {});
      expect(result.coverage.min).toBeLessThan(900);
      expect(result.coverage.max).toBeGreaterThan(2500);
      expect(result.dynamicRangeOrders).toBeGreaterThan(4.5);
      expect(result.dynamicRangeOrders).toBeLessThan(7);
      if (repeats > 1) {
        // The generator jitters scans by 300 as (rms): alignment removes that and leaves much less.
        expect(result.timingJitterAs!).toBeGreaterThan(100);
        expect(result.timingSpreadAs!).toBeLessThan(50);
      } else expect(result.timingSpreadAs).toBeNull();
      // The strongest band inside the coverage is where the compound table puts it (within two 2 cm⁻¹ bins).
      const strongest = bandsOf(compound)
        .filter((b) => b.position > 900 && b.position < 2500)
        .reduce((a, b) => (b.height > a.height ? b : a));
      const { wavenumber: w, absorbance: y } = result.spectrum;
      let peak = 0;
      for (let i = 0; i < w.length; i++) if (w[i]! > 900 && w[i]! < 2500 && y[i]! > y[peak]!) peak = i;
      expect(Math.abs(w[peak]! - strongest.position), id).toBeLessThanOrEqual(4);
      // Its height: 0.5 × the relative height above the 0.04 offset, lowered a little by the Hann window.
      expect(y[peak]! - 0.04).toBeGreaterThan(0.5 * strongest.height * 0.6);
      expect(y[peak]! - 0.04).toBeLessThan(0.5 * strongest.height * 1.1);
    }
  });

  it('gives a scattered tunable-laser unknown over 1750–1000 cm⁻¹ and a 0.1 cm⁻¹ fine-spaced entry', () => {
    const tl = byPath
      .get('unknowns/u04-tunable-laser.csv')!
      .split('\n')
      .filter((l) => /^\d/.test(l));
    const x = tl.map((l) => Number(l.split(',')[0]));
    expect(x[0]).toBe(1750);
    expect(x[x.length - 1]!).toBeGreaterThanOrEqual(1000);
    expect(x[x.length - 1]!).toBeLessThan(1003);
    for (let i = 1; i < x.length; i++) {
      const gap = x[i - 1]! - x[i]!;
      expect(gap).toBeGreaterThanOrEqual(0.999);
      expect(gap).toBeLessThanOrEqual(3.001);
    }
    const fine = [...byPath.entries()].find(([p]) => p.startsWith('fine-spaced/') && p.endsWith('.csv'))![1];
    const fx = fine
      .split('\n')
      .filter((l) => /^\d/.test(l))
      .map((l) => Number(l.split(',')[0]));
    expect(fx[1]! - fx[0]!).toBeCloseTo(0.1, 9);
    expect(fx.length).toBe(23001);
  });
});

describe('the other instruments match the FTIR entries of the same compound', () => {
  it('ranks the FTIR entry of the same compound first for the tunable-laser unknown and both field-resolved entries', () => {
    // The demo's FTIR reference files (one per compound, a sidecar beside each), processed with the default recipe.
    const all = generateDemoLibrary();
    const recipe = recipeSchema.parse({});
    const grid = { start: 4000, stop: 600, step: 2 };
    const encoder = new TextEncoder();
    const library: { id: string; processed: Float64Array }[] = [];
    for (const file of all) {
      if (file.path.includes('/') || file.path.endsWith('.meta.json') || file.path.startsWith('4')) continue;
      const sidecar = all.find((f) => f.path === file.path.replace(/\.(jdx|csv)$/, '.meta.json'));
      if (!sidecar) continue;
      const [parsed] = readSpectrumFile(encoder.encode(file.content), { file: file.path });
      library.push({
        id: JSON.parse(sidecar.content).id,
        processed: processSpectrum(parsed!.spectrum, recipe, grid).processed,
      });
    }
    expect(library.length).toBe(demoCompounds.length);
    const top = (query: Float64Array) =>
      library
        .map((entry) => ({ id: entry.id, r: correlation(query, entry.processed) }))
        .sort((a, b) => b.r - a.r)[0]!.id;

    const tunable = all.find((f) => f.path === 'unknowns/u04-tunable-laser.csv')!;
    const [u04] = readSpectrumFile(encoder.encode(tunable.content), { file: tunable.path });
    expect(top(processSpectrum(u04!.spectrum, recipe, grid).processed)).toBe('aspirin');

    for (const [id, compound] of [
      ['paracetamol-field-resolved', 'paracetamol'],
      ['glucose-field-resolved', 'glucose'],
    ] as const) {
      const sections = readSidecarSections(
        all.find((f) => f.path === `time-domain/${id}.meta.json`)!.content,
      );
      const read = (name: string) =>
        readTimeTrace(all.find((f) => f.path === `time-domain/${name}`)!.content);
      const result = traceToSpectrum(
        sections.timeDomain!.sample.map(read),
        sections.timeDomain!.reference.map(read),
        {},
      );
      expect(top(processSpectrum(result.spectrum, recipe, grid).processed), id).toBe(compound);
    }
  });
});
