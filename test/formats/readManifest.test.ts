// The manifest reader: one metadata object per data file from a CSV or TSV table, quoting, bad cells.
import { describe, expect, it } from 'vitest';
import { readManifest } from '../../src/formats/readManifest.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

const file = 'library/manifest.csv';

describe('readManifest', () => {
  it('reads one metadata object per data file', () => {
    const text = [
      '# synthetic demo manifest',
      'file,id,name,class,synonyms,cas,resolution,synthetic,concentration',
      'bsa.csv,bsa,Bovine serum albumin,protein,BSA; albumin,,4,yes,50 mg/mL',
      '',
      'glucose.jdx,glucose,D-Glucose,carbohydrate,dextrose,50-99-7,"4,0",true,',
    ].join('\n');
    const manifest = readManifest(text, { file });
    expect([...manifest.keys()]).toEqual(['bsa.csv', 'glucose.jdx']);
    expect(manifest.get('bsa.csv')).toEqual({
      id: 'bsa',
      name: 'Bovine serum albumin',
      class: 'protein',
      synonyms: ['BSA', 'albumin'],
      resolution: 4,
      synthetic: true,
      concentration: { value: 50, unit: 'mg/mL' },
    });
    expect(manifest.get('glucose.jdx')).toEqual({
      id: 'glucose',
      name: 'D-Glucose',
      class: 'carbohydrate',
      synonyms: ['dextrose'],
      cas: '50-99-7',
      resolution: 4,
      synthetic: true,
    });
  });

  it('matches header names loosely and takes concentration in two columns', () => {
    const text =
      'File,InChIKey,Sample Form,sample_form_x,License,concentration.value,concentration.unit\n' +
      'w.csv,XLYOFNOQVPJJNP-UHFFFAOYSA-N,liquid,,CC0-1.0,55.5,mol/L\n';
    const e = bandshelfErrorOf(() => readManifest(text, { file }));
    expect(e.field).toBe('sample_form_x');
    expect(e.line).toBe(1);
    const fixed = text.replace(',sample_form_x', '').replace('liquid,,', 'liquid,');
    expect(readManifest(fixed, { file }).get('w.csv')).toEqual({
      inchiKey: 'XLYOFNOQVPJJNP-UHFFFAOYSA-N',
      sampleForm: 'liquid',
      licence: 'CC0-1.0',
      concentration: { value: 55.5, unit: 'mol/L' },
    });
  });

  it('follows RFC 4180 quoting: commas, doubled quotes and line breaks inside cells', () => {
    const text = 'file,name,notes\r\n"a,b.csv","Urea ""neat""","first line\r\nsecond, line"\r\nc.csv,C,\r\n';
    const manifest = readManifest(text, { file });
    expect(manifest.get('a,b.csv')).toEqual({ name: 'Urea "neat"', notes: 'first line\nsecond, line' });
    expect(manifest.get('c.csv')).toEqual({ name: 'C' });
  });

  it('reads tab-separated tables', () => {
    const manifest = readManifest('file\tname\ttags\nx.csv\tX\ta;b\n', { file });
    expect(manifest.get('x.csv')).toEqual({ name: 'X', tags: ['a', 'b'] });
  });

  it('names the line and field of a bad cell, counting lines inside quoted cells', () => {
    const text = 'file,notes,cas\nok.csv,"two\nlines",7732-18-5\nbad.csv,,7732-18-4\n';
    const e = bandshelfErrorOf(() => readManifest(text, { file }));
    expect(e.code).toBe('BAD_METADATA');
    expect(e.oneLine()).toBe(`${file}:4: cas: has a wrong check digit [BAD_METADATA]`);
    const e2 = bandshelfErrorOf(() => readManifest('file,resolution\nx.csv,four\n', { file }));
    expect([e2.line, e2.field, e2.message]).toEqual([2, 'resolution', '"four" is not a number']);
    const e3 = bandshelfErrorOf(() => readManifest('file,class\nx.csv,sugar\n', { file }));
    expect([e3.line, e3.field]).toEqual([2, 'class']);
  });

  it('refuses a header without a file column, repeated columns and repeated files', () => {
    expect(bandshelfErrorOf(() => readManifest('id,name\na,A\n', { file })).field).toBe('file');
    const repeated = bandshelfErrorOf(() => readManifest('file,name,Name\nx.csv,a,b\n', { file }));
    expect([repeated.line, repeated.field, repeated.message]).toEqual([
      1,
      'name',
      'column 3 repeats column 2',
    ]);
    const twice = bandshelfErrorOf(() => readManifest('file,name\nx.csv,a\ny.csv,b\nx.csv,c\n', { file }));
    expect([twice.line, twice.field, twice.message]).toEqual([
      4,
      'file',
      'x.csv is already described on line 2',
    ]);
    expect(bandshelfErrorOf(() => readManifest('file,name\n,a\n', { file })).message).toBe(
      'the row names no data file',
    );
  });

  it('refuses rows wider than the header, open quotes and stray text after a quote', () => {
    expect(bandshelfErrorOf(() => readManifest('file,name\nx.csv,a,b\n', { file })).line).toBe(2);
    expect(bandshelfErrorOf(() => readManifest('file,name\nx.csv,"open\n\n', { file })).message).toContain(
      'never closed',
    );
    expect(bandshelfErrorOf(() => readManifest('file,name\nx.csv,"a"b\n', { file })).message).toContain(
      'closing quote',
    );
  });

  it('reads a ";"-separated table as spreadsheets set to a decimal comma save it, lists quoted', () => {
    // RFC 4180 quoting with ";" as the separator (common practice of spreadsheet exports in much of Europe).
    const manifest = readManifest('file;name;class;tags\nx.csv;X;Biofluid;"serum;pooled"\ny.csv;Y;;\n', {
      file,
    });
    expect(manifest.get('x.csv')).toEqual({ name: 'X', class: 'biofluid', tags: ['serum', 'pooled'] });
    expect(manifest.get('y.csv')).toEqual({ name: 'Y' });
  });

  it('takes the separator the header uses most, commas on a tie; commas in the rows of a ";" table are text', () => {
    expect(readManifest('file,name\nx.csv,"a;b"\n', { file }).get('x.csv')).toEqual({ name: 'a;b' });
    expect(readManifest('"file";"name"\nx.csv;a, b\n', { file }).get('x.csv')).toEqual({ name: 'a, b' });
    expect(readManifest('file\tname\nx.csv\tA, B\n', { file }).get('x.csv')).toEqual({ name: 'A, B' });
  });

  it('refuses both concentration forms at once, an empty manifest and an oversized one', () => {
    const both = 'file,concentration,concentration.value,concentration.unit\nx.csv,1 mM,1,mM\n';
    expect(bandshelfErrorOf(() => readManifest(both, { file })).field).toBe('concentration');
    expect(bandshelfErrorOf(() => readManifest('\n# nothing\n', { file })).code).toBe('EMPTY_FILE');
    expect(bandshelfErrorOf(() => readManifest('file\n', { file, maxChars: 2 })).code).toBe('FILE_TOO_LARGE');
  });

  it('ignores empty unnamed columns, as spreadsheets save them, but not a value under no name', () => {
    expect(readManifest('file,name,,\nx.csv,X,,\n', { file }).get('x.csv')).toEqual({ name: 'X' });
    const e = bandshelfErrorOf(() => readManifest('file,name,,\nx.csv,X,,oops\n', { file }));
    expect([e.line, e.message]).toEqual([2, 'column 4 has a value but no name in the header']);
  });

  it('gives an empty map for a header alone and strips a byte-order mark', () => {
    expect(readManifest('\ufefffile,name\n', { file }).size).toBe(0);
  });
});
