// Small display helpers: number formatting, JSON inside a script element, metadata rows, labels and anchors.
import { describe, expect, it } from 'vitest';
import { recipeSchema } from '../../src/schema/recipe.js';
import { formatNumber } from '../../src/site/formatNumber.js';
import { jcampLabels } from '../../src/site/jcampLabels.js';
import { jsonForScript } from '../../src/site/jsonForScript.js';
import { metaRows } from '../../src/site/metaRows.js';
import { recipeRows } from '../../src/site/recipeRows.js';
import { releaseAnchor } from '../../src/site/releaseAnchor.js';
import { techniqueLabel } from '../../src/site/techniqueLabel.js';

describe('formatNumber', () => {
  it('prints fixed decimals, significant digits, a minus sign and a dash for missing values', () => {
    expect(formatNumber(1651.64, { decimals: 1 })).toBe('1651.6');
    expect(formatNumber(0.123456)).toBe('0.1235');
    expect(formatNumber(0.12)).toBe('0.12');
    expect(formatNumber(-0.5, { decimals: 2 })).toBe('−0.50');
    expect(formatNumber(-0.00001, { decimals: 2 })).toBe('0.00');
    expect(formatNumber(12345.6)).toBe('12350');
    expect(formatNumber(Number.NaN)).toBe('–');
    expect(formatNumber(null, { missing: 'n/a' })).toBe('n/a');
  });
});

describe('jsonForScript', () => {
  it('cannot close the script element or open markup, and parses back to the same value', () => {
    const value = { name: '</script><script>alert(1)</script>', notes: '<!-- & \u2028', n: [1, Number.NaN] };
    const text = jsonForScript(value);
    expect(text).not.toMatch(/[<>&\u2028]/);
    expect(JSON.parse(text)).toEqual({ ...value, n: [1, null] });
  });
});

describe('metaRows', () => {
  it('labels fields in schema order, formats units, and links only DOIs, to doi.org', () => {
    const rows = metaRows({
      notes: 'n',
      name: 'Glucose',
      resolution: 4,
      temperature: 25,
      technique: 'atr',
      concentration: { value: 5, unit: 'mg/mL' },
      source: 'doi:10.1016/j.bbabio.2007.06.004',
      extraField: 'x',
    });
    expect(rows.map((r) => r.label)).toEqual([
      'Name',
      'Concentration',
      'Technique',
      'Resolution',
      'Temperature',
      'Source',
      'Notes',
      'extraField',
    ]);
    expect(rows.find((r) => r.label === 'Resolution')!.value).toBe('4 cm⁻¹');
    expect(rows.find((r) => r.label === 'Technique')!.value).toBe('ATR');
    expect(rows.find((r) => r.label === 'Concentration')!.value).toBe('5 mg/mL');
    expect(rows.find((r) => r.label === 'Source')!.href).toBe('https://doi.org/10.1016/j.bbabio.2007.06.004');
    const sneaky = metaRows({ source: 'javascript:alert(1)' });
    expect(sneaky[0]!.href).toBeUndefined();
    const odd = metaRows({ source: '10.1000/"><script>' });
    expect(odd[0]!.href).toBe('https://doi.org/10.1000/%22%3E%3Cscript%3E');
  });
});

describe('recipeRows', () => {
  it('describes the default recipe step by step', () => {
    const rows = recipeRows(recipeSchema.parse({}));
    const byLabel = Object.fromEntries(rows.map((r) => [r.label, r.value]));
    expect(byLabel.Excluded).toBe('2400–2280 cm⁻¹');
    expect(byLabel.Baseline).toBe('rubberband (lower convex hull)');
    expect(byLabel.Normalisation).toBe('unit vector (L2)');
    expect(byLabel.Smoothing).toBe('none');
    expect(recipeRows(recipeSchema.parse({}), { skipNone: true }).map((r) => r.label)).not.toContain(
      'Smoothing',
    );
  });
});

describe('labels', () => {
  it('names techniques, makes safe release anchors and maps metadata onto JCAMP-DX labels', () => {
    expect(techniqueLabel('field-resolved')).toBe('field-resolved time-domain');
    expect(techniqueLabel(undefined)).toBe('not recorded');
    expect(techniqueLabel('new-kind')).toBe('new-kind');
    expect(releaseAnchor('2026.1 "final"')).toBe('release-2026.1__final_');
    const labels = jcampLabels({
      contributor: 'Lab A',
      cas: '7732-18-5',
      synonyms: ['a', 'b'],
      sampleForm: 'liquid',
    });
    expect(labels).toMatchObject({
      origin: 'Lab A',
      owner: 'Lab A',
      cas: '7732-18-5',
      names: 'a; b',
      state: 'liquid',
    });
  });
});
