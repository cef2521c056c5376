// Units as people write them (issue list of spellings; SI symbols for cm⁻¹, µm, nm, THz — common practice).
import { describe, expect, it } from 'vitest';
import { unitFromText } from '../../src/formats/unitFromText.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

describe('unitFromText', () => {
  it.each([
    ['cm-1', 'cm-1'],
    ['cm^-1', 'cm-1'],
    ['1/cm', 'cm-1'],
    ['cm⁻¹', 'cm-1'],
    ['um', 'um'],
    ['µm', 'um'],
    ['micron', 'um'],
    ['nm', 'nm'],
    ['THz', 'thz'],
    ['cm−1', 'cm-1'],
    ['cm**-1', 'cm-1'],
    ['CM^(-1)', 'cm-1'],
    ['μm', 'um'],
    ['Microns', 'um'],
  ])('x %s → %s', (text, unit) => expect(unitFromText(text, { axis: 'x' })).toBe(unit));
  it.each([
    ['%T', 'percent-transmittance'],
    ['T', 'transmittance'],
    ['A', 'absorbance'],
    ['abs', 'absorbance'],
    ['percent-transmittance', 'percent-transmittance'],
    ['%t', 'percent-transmittance'],
    ['Transmittance', 'transmittance'],
    ['ABS', 'absorbance'],
  ])('y %s → %s', (text, unit) => expect(unitFromText(text, { axis: 'y' })).toBe(unit));
  it('refuses anything else with BAD_OPTION naming the option', () => {
    const error = bandshelfErrorOf(() => unitFromText('furlong', { axis: 'x' }));
    expect(error.code).toBe('BAD_OPTION');
    expect(error.message).toMatch(/--x-unit/);
  });
});
