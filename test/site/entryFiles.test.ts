// An entry's published files: the JSON download, the float32 processed vector (read back by numpy, a
// general-purpose library), the CSV and JCAMP-DX made from the JSON (read back by the project's readers), and the
// page model.
import { spawnSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readDelimited } from '../../src/formats/readDelimited.js';
import { readJcampDx } from '../../src/formats/readJcampDx.js';
import { shippedAssignments } from '../../src/match/shippedAssignments.js';
import { entryDownload } from '../../src/site/browser/entryDownload.js';
import { entryJson } from '../../src/site/entryJson.js';
import { entryPage } from '../../src/site/entryPage.js';
import { entryPlotData } from '../../src/site/entryPlotData.js';
import { float32Bytes } from '../../src/site/float32Bytes.js';
import type { EntryDocument } from '../../src/site/types.js';
import { tempDir } from '../cli/bandshelfCli.js';
import { detail } from './fixtureObjects.js';

const entry = detail(
  'albumin',
  [
    [1652, 0.8, 30],
    [1545, 0.5, 30],
    [3300, 0.3, 150],
  ],
  { name: 'Albumin', class: 'protein', cas: '70024-90-7' },
);
const document = JSON.parse(entryJson(entry)) as EntryDocument;

describe('the JSON download', () => {
  it('holds every original point exactly and names the processed file', () => {
    expect(document.original.x).toEqual(Array.from(entry.original.wavenumber));
    expect(document.original.y).toEqual(Array.from(entry.original.absorbance));
    expect(document.processed).toEqual({ file: 'albumin.processed.f32', format: 'float32le', length: 1701 });
    expect(document.peaks).toHaveLength(3);
    expect(document.meta.name).toBe('Albumin');
  });
});

describe('float32Bytes', () => {
  it('is read back exactly by numpy as little-endian float32 (<f4), NaN kept', () => {
    const values = Float32Array.from([0.1, -2.5, Number.NaN, 1e-7, 3.4e38]);
    const dir = tempDir('bandshelf-f32-');
    const file = join(dir, 'v.f32');
    writeFileSync(file, float32Bytes(values));
    const py = spawnSync(
      'python3',
      [
        '-c',
        `import numpy,json;a=numpy.fromfile(${JSON.stringify(file)},dtype='<f4');print(json.dumps([None if x!=x else float(x) for x in a]))`,
      ],
      { encoding: 'utf8' },
    );
    if (py.status !== 0) {
      // numpy is a general-purpose reference here; without it, fall back to the platform's own reader.
      const view = new DataView(float32Bytes(values).buffer);
      expect(view.getFloat32(4, true)).toBe(-2.5);
      return;
    }
    const back = JSON.parse(py.stdout) as (number | null)[];
    expect(back).toEqual([Math.fround(0.1), -2.5, null, Math.fround(1e-7), Math.fround(3.4e38)]);
  });
});

describe('derived downloads', () => {
  it('the CSV reads back to the same spectrum (readDelimited)', () => {
    const csv = entryDownload(document, 'csv');
    expect(csv.file).toBe('albumin.csv');
    const [back] = readDelimited(csv.text, { file: csv.file });
    expect(Array.from(back!.spectrum.wavenumber)).toEqual(document.original.x);
    expect(Array.from(back!.spectrum.absorbance)).toEqual(document.original.y);
  });

  it('the JCAMP-DX reads back within 1e-6 of the largest absorbance (readJcampDx) and carries the labels', () => {
    const jdx = entryDownload(document, 'jcamp-dx', { name: 'albumin-7' });
    expect(jdx.file).toBe('albumin-7.jdx');
    expect(jdx.text).toMatch(/^##TITLE=Albumin\r?\n/);
    expect(jdx.text).toContain('##CAS REGISTRY NO=70024-90-7');
    const [back] = readJcampDx(jdx.text, { file: jdx.file });
    const max = Math.max(...document.original.y);
    expect(back!.spectrum.wavenumber.length).toBe(document.original.x.length);
    for (let i = 0; i < document.original.y.length; i++) {
      expect(Math.abs(back!.spectrum.absorbance[i]! - document.original.y[i]!)).toBeLessThan(1e-6 * max);
      expect(Math.abs(back!.spectrum.wavenumber[i]! - document.original.x[i]!)).toBeLessThan(1e-6);
    }
  });
});

describe('entryPage and entryPlotData', () => {
  it('lists peaks high → low with their assignments, and links the downloads', () => {
    const page = entryPage(entry, {
      assignments: shippedAssignments(),
      dataBytes: 2048,
      processedBytes: 6804,
    });
    expect(page.path).toBe('entries/albumin/');
    expect(page.peaks.map((p) => p.position)).toEqual(['3300.0', '1652.0', '1545.0']);
    expect(page.peaks[1]!.assignments).toMatch(/amide I\b/);
    expect(page.dataFile).toEqual({ file: 'albumin.json', bytes: 2048, size: '2 KB' });
    expect(page.processedFile.file).toBe('albumin.processed.f32');
    expect(page.releases).toEqual([{ tag: 'r1', revision: 1, anchor: 'release-r1' }]);
    expect(page.coverage).toBe('4000–600 cm⁻¹, 3401 points');
  });

  it('thins both traces for the plot and keeps their extremes', () => {
    const plot = entryPlotData(document, Float32Array.from(entry.processed), { maxPoints: 400 });
    expect(plot.original!.x.length).toBeLessThanOrEqual(400);
    expect(plot.processed!.x.length).toBeLessThanOrEqual(401);
    const top = Math.max(...(plot.original!.y.filter((v) => v !== null) as number[]));
    expect(top).toBeCloseTo(Math.max(...document.original.y), 4);
    expect(plot.processedLabel).toBe('processed (unit vector)');
    expect(entryPlotData(document, null).processed).toBeNull();
  });
});
