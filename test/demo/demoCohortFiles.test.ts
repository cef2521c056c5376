// The demo cohort: 20 + 20 readable synthetic serum-film files, the cases richer in lipid.
import { describe, expect, it } from 'vitest';
import { demoCohortFiles } from '../../src/demo/demoCohortFiles.js';
import { readDelimited } from '../../src/formats/readDelimited.js';

describe('demoCohortFiles', () => {
  it('writes 20 labelled synthetic films per group that the reader takes, the cases with more ester C=O', () => {
    const files = demoCohortFiles();
    expect([...files.keys()].filter((k) => k.startsWith('cases/'))).toHaveLength(20);
    expect([...files.keys()].filter((k) => k.startsWith('controls/'))).toHaveLength(20);
    const meanAt = (group: string, wavenumber: number) => {
      let sum = 0;
      for (const [name, text] of files) {
        if (!name.startsWith(group)) continue;
        expect(text.split('\n')[0]).toMatch(/^# synthetic demo serum film/);
        const { spectrum } = readDelimited(text, { file: name })[0]!;
        sum += spectrum.absorbance[spectrum.wavenumber.indexOf(wavenumber)]!;
      }
      return sum / 20;
    };
    // Triolein's ester C=O band sits near 1745 cm⁻¹ in the demo table; its amount is raised in the cases by design.
    expect(meanAt('cases', 1746)).toBeGreaterThan(meanAt('controls', 1746));
    expect(Math.abs(meanAt('cases', 1652) - meanAt('controls', 1652))).toBeLessThan(
      0.1 * meanAt('controls', 1652),
    );
  });
});
