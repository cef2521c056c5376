// The search index is built at site-build time; loaded into lunr (as the page does) it answers band positions,
// names, CAS numbers, InChIKeys and band names, also for a prefix typed so far.
import lunr from 'lunr';
import { describe, expect, it } from 'vitest';
import { shippedAssignments } from '../../src/match/shippedAssignments.js';
import { searchQuery } from '../../src/site/browser/searchQuery.js';
import { buildSearchIndex, type SearchIndexFile } from '../../src/site/buildSearchIndex.js';
import { summary } from './fixtureObjects.js';

const entries = [
  {
    summary: summary('albumin', { name: 'Serum albumin', class: 'protein', synonyms: ['HSA'] }),
    path: 'entries/albumin/',
    peakPositions: [3299.6, 1651.6, 1544.8],
  },
  {
    summary: summary('water', {
      name: 'Water',
      class: 'solvent',
      cas: '7732-18-5',
      inchiKey: 'XLYOFNOQVPJJNP-UHFFFAOYSA-N',
      formula: 'H2O',
    }),
    path: 'entries/water/',
    peakPositions: [3404.2, 1643.1],
  },
  {
    summary: summary('glucose', {
      name: 'D-Glucose',
      class: 'carbohydrate',
      tags: ['sugar'],
      notes: 'anhydrous powder',
    }),
    path: 'entries/glucose/',
    peakPositions: [1152, 1107.4, 1035.2],
  },
];
const file = JSON.parse(buildSearchIndex(entries, { assignments: shippedAssignments() })) as SearchIndexFile;
const index = lunr.Index.load(file.index as object);
const find = (text: string) => index.query(searchQuery(text)).map((r) => r.ref);

describe('buildSearchIndex', () => {
  it('finds a band position within 1 cm⁻¹ (1651.6 is indexed as 1651 and 1652)', () => {
    expect(find('1652')).toEqual(['albumin']);
    expect(find('1651')).toEqual(['albumin']);
    expect(find('1650')).toEqual([]);
    expect(find('1152')).toEqual(['glucose']);
  });

  it('finds names, synonyms, tags and notes, and prefixes as the user types', () => {
    expect(find('albumin')[0]).toBe('albumin');
    expect(find('hsa')).toEqual(['albumin']);
    expect(find('Gluc')).toEqual(['glucose']);
    expect(find('sugar')).toEqual(['glucose']);
    expect(find('powder')).toEqual(['glucose']);
  });

  it('finds a CAS number, an InChIKey and a formula as whole tokens', () => {
    expect(find('7732-18-5')).toEqual(['water']);
    expect(find('7732-1')).toEqual(['water']);
    expect(find('XLYOFNOQVPJJNP-UHFFFAOYSA-N')).toEqual(['water']);
    expect(find('h2o')).toEqual(['water']);
  });

  it('finds entries by the names of the bands at their peaks (amide I at 1652, Barth 2007)', () => {
    expect(find('amide')).toContain('albumin');
    expect(find('amide')).not.toContain('glucose');
  });

  it('carries what a result line shows', () => {
    expect(file.docs.water).toEqual(['Water', 'solvent', 'entries/water/']);
  });
});
