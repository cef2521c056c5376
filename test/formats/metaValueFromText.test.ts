// Typed metadata values from text cells (numbers, lists, booleans, concentrations); errors name the field.
import { describe, expect, it } from 'vitest';
import { metaValueFromText } from '../../src/formats/metaValueFromText.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

const value = (field: string, text: string) => metaValueFromText({ field, text });

describe('metaValueFromText', () => {
  it('reads numbers with a decimal point or comma and the field’s own unit', () => {
    expect(value('resolution', '4')).toBe(4);
    expect(value('resolution', ' 0.5 cm-1 ')).toBe(0.5);
    expect(value('resolution', '2,0 cm⁻¹')).toBe(2);
    expect(value('temperature', '-12.5 °C')).toBe(-12.5);
    expect(value('temperature', '3e1')).toBe(30);
    expect(bandshelfErrorOf(() => value('resolution', '4 nm')).message).toBe('"4 nm" is not a number');
    expect(bandshelfErrorOf(() => value('temperature', '1,000.5')).field).toBe('temperature');
    expect(bandshelfErrorOf(() => value('resolution', '0')).message).toContain('>0');
  });

  it('splits lists on ";" and drops empty items', () => {
    expect(value('synonyms', 'BSA; albumin ;;')).toEqual(['BSA', 'albumin']);
    expect(value('tags', '')).toEqual([]);
  });

  it('reads booleans in the usual spellings', () => {
    for (const t of ['true', 'Yes', '1']) expect(value('synthetic', t)).toBe(true);
    for (const f of ['FALSE', 'no', '0']) expect(value('synthetic', f)).toBe(false);
    expect(bandshelfErrorOf(() => value('synthetic', 'maybe')).field).toBe('synthetic');
  });

  it('reads a concentration as a number and a unit', () => {
    expect(value('concentration', '5 mg/mL')).toEqual({ value: 5, unit: 'mg/mL' });
    expect(value('concentration', '0.15M')).toEqual({ value: 0.15, unit: 'M' });
    expect(value('concentration', '2,5 % w/v')).toEqual({ value: 2.5, unit: '% w/v' });
    expect(bandshelfErrorOf(() => value('concentration', 'lots')).message).toContain('5 mg/mL');
    expect(bandshelfErrorOf(() => value('concentration', '5')).field).toBe('concentration');
  });

  it('checks the finished value against the schema', () => {
    expect(value('class', 'lipid')).toBe('lipid');
    expect(value('cas', ' 64-17-5 ')).toBe('64-17-5');
    expect(bandshelfErrorOf(() => value('cas', '64-17-4')).message).toBe('has a wrong check digit');
    expect(bandshelfErrorOf(() => value('id', 'A/B')).field).toBe('id');
  });

  it('names an unknown field, with a hint, the file and the line', () => {
    const e = bandshelfErrorOf(() =>
      metaValueFromText({ field: 'formla', text: 'H2O' }, { file: 'm.csv', line: 3 }),
    );
    expect(e.oneLine()).toBe('m.csv:3: formla: unknown field (did you mean "formula"?) [BAD_METADATA]');
  });
});
