// The time-domain trace reader: delimiters, units from the header or the caller, and one clear error per defect.
import { describe, expect, it } from 'vitest';
import type { BandshelfError } from '../../src/error.js';
import { readTimeTrace } from '../../src/formats/readTimeTrace.js';

function rows(n: number, step: number, format: (t: number, i: number) => string): string[] {
  return Array.from({ length: n }, (_, i) => format(i * step, i));
}

function failure(f: () => unknown): BandshelfError {
  try {
    f();
  } catch (error) {
    return error as BandshelfError;
  }
  throw new Error('expected an error');
}

const fsCsv = [
  '# synthetic test trace',
  'delay_fs,field',
  ...rows(32, 2, (t, i) => `${t},${Math.sin(i)}`),
].join('\n');

describe('readTimeTrace', () => {
  it('reads a comma-separated trace whose header names fs', () => {
    const trace = readTimeTrace(fsCsv, { file: 'a.csv' });
    expect(trace.time.length).toBe(32);
    expect(trace.time[31]).toBe(62);
    expect(trace.field[3]).toBeCloseTo(Math.sin(3), 12);
    expect(trace.source).toMatchObject({
      timeUnit: 'fs',
      unitFrom: 'header',
      delimiter: 'comma',
      columns: ['delay_fs', 'field'],
    });
  });

  it('converts a ps header to fs (1 ps = 1000 fs) and accepts bytes with a BOM and CRLF lines', () => {
    const text = `\ufefftime_ps,E\r\n${rows(20, 0.004, (t, i) => `${t.toFixed(3)},${i}`).join('\r\n')}\r\n`;
    const trace = readTimeTrace(new TextEncoder().encode(text), { file: 'b.csv' });
    expect(trace.source.timeUnit).toBe('ps');
    expect(trace.time[1]).toBeCloseTo(4, 12);
    expect(trace.time[19]).toBeCloseTo(76, 9);
  });

  it('reads UTF-16 traces (LE and BE, with their BOM) and warns when it falls back to Windows-1252', () => {
    const csv = ['delay (fs),field', ...rows(16, 2, (t, i) => `${t},${i}`)].join('\n');
    for (const littleEndian of [true, false]) {
      // UTF-16 with a byte-order mark, FF FE or FE FF (Unicode Standard §3.10).
      const bytes = new Uint8Array(2 + csv.length * 2);
      const view = new DataView(bytes.buffer);
      view.setUint16(0, 0xfeff, littleEndian);
      for (let i = 0; i < csv.length; i++) view.setUint16(2 + 2 * i, csv.charCodeAt(i), littleEndian);
      const t = readTimeTrace(bytes, { file: 'u16.csv' });
      expect(t.time[1]).toBe(2);
      expect(t.field[15]).toBe(15);
    }
    const latin1 = Uint8Array.from(
      ['Verz\u00f6gerung (fs);Feld', ...rows(16, 1, (t, i) => `${t};${i}`)].join('\n'),
      (c) => c.charCodeAt(0),
    );
    expect(readTimeTrace(latin1).warnings.some((w) => /Windows-1252/.test(w.message))).toBe(true);
  });

  it('reads semicolons with decimal commas, tabs, whitespace, and a Latin-1 header', () => {
    const semi = [
      'Verzögerung (fs);Feld',
      ...rows(16, 1.5, (t, i) => `${String(t).replace('.', ',')};${i},5`),
    ].join('\n');
    const latin1 = Uint8Array.from(semi, (c) => c.charCodeAt(0));
    const a = readTimeTrace(latin1);
    expect(a.source.delimiter).toBe('semicolon');
    expect(a.source.columns?.[0]).toBe('Verzögerung (fs)');
    expect(a.time[1]).toBe(1.5);
    expect(a.field[2]).toBe(2.5);
    const tab = readTimeTrace(['t/fs\tE', ...rows(16, 1, (t, i) => `${t}\t${i}`)].join('\n'));
    expect(tab.source.delimiter).toBe('tab');
    const ws = readTimeTrace(
      ['delay ps   field', ...rows(16, 0.001, (t, i) => `  ${t.toFixed(3)}   ${i}e-3`)].join('\n'),
    );
    expect(ws.source).toMatchObject({ delimiter: 'whitespace', timeUnit: 'ps' });
    expect(ws.time[2]).toBeCloseTo(2, 9);
    expect(ws.field[2]).toBeCloseTo(0.002, 15);
  });

  it('uses the caller unit when the header names none, and overrides the header only when asked', () => {
    const bare = rows(16, 0.002, (t, i) => `${t.toFixed(3)} ${i}`).join('\n');
    const asPs = readTimeTrace(bare, { timeUnit: 'ps' });
    expect(asPs.source).toMatchObject({ timeUnit: 'ps', unitFrom: 'option', columns: null });
    expect(asPs.time[1]).toBeCloseTo(2, 9);
    const assumed = readTimeTrace(bare);
    expect(assumed.source.unitFrom).toBe('default');
    // 0.002 fs steps are implausible for a mid-infrared trace: the reader says so.
    expect(assumed.warnings.some((w) => w.message.includes('check it'))).toBe(true);
    const kept = readTimeTrace(fsCsv, { timeUnit: 'ps' });
    expect(kept.source.timeUnit).toBe('fs');
    const forced = readTimeTrace(fsCsv, { timeUnit: 'ps', overrideHeader: true });
    expect(forced.source.timeUnit).toBe('ps');
    expect(forced.time[1]).toBe(2000);
    expect(
      forced.warnings.some((w) => w.line === 2 && w.message.includes('header names the delay in fs')),
    ).toBe(true);
  });

  it('reverses a descending delay, ignores extra columns and inline comments, with warnings', () => {
    const text = ['delay_fs,field,extra', ...rows(16, 1, (t, i) => `${15 - t},${15 - i},9 # note`)].join(
      '\n',
    );
    const trace = readTimeTrace(text);
    expect(trace.time[0]).toBe(0);
    expect(trace.field[0]).toBe(0);
    expect(trace.field[15]).toBe(15);
    expect(trace.warnings.map((w) => w.message).join(' ')).toMatch(/only the first two.*reversed/);
  });

  it('warns when the step is too coarse for the mid-infrared', () => {
    // Nyquist at Δt = 5 fs is 100 THz = 3336 cm⁻¹ (1 THz = 33.356 cm⁻¹, common practice).
    const trace = readTimeTrace(['delay_fs,field', ...rows(16, 5, (t, i) => `${t},${i}`)].join('\n'));
    expect(trace.warnings.some((w) => w.message.includes('3336'))).toBe(true);
  });

  it('gives one clear error per defect, naming file and line', () => {
    const base = ['delay_fs,field', ...rows(20, 1, (t, i) => `${t},${i}`)];
    const withLine = (line: number, text: string) => {
      const copy = base.slice();
      copy[line - 1] = text;
      return copy.join('\n');
    };
    let e = failure(() => readTimeTrace(withLine(5, '3,abc'), { file: 'x.csv' }));
    expect([e.code, e.file, e.line, e.field]).toEqual(['NOT_NUMERIC', 'x.csv', 5, 'field']);
    expect(e.oneLine()).toBe('x.csv:5: field: the field "abc" is not a number [NOT_NUMERIC]');
    e = failure(() => readTimeTrace(withLine(6, '4'), { file: 'x.csv' }));
    expect([e.code, e.line]).toEqual(['BAD_FORMAT', 6]);
    e = failure(() => readTimeTrace(withLine(7, '5,NaN'), { file: 'x.csv' }));
    expect([e.code, e.line]).toEqual(['NOT_FINITE', 7]);
    e = failure(() => readTimeTrace(withLine(8, '6.5,1'), { file: 'x.csv' }));
    expect([e.code, e.line, e.field]).toEqual(['BAD_FORMAT', 8, 'delay']);
    expect(e.message).toMatch(/uniformly sampled/);
    e = failure(() => readTimeTrace(withLine(9, '6,1'), { file: 'x.csv' }));
    expect([e.code, e.line]).toEqual(['NOT_MONOTONIC', 9]);
    e = failure(() => readTimeTrace(base.slice(0, 10).join('\n'), { file: 'x.csv' }));
    expect(e.code).toBe('TOO_FEW_POINTS');
    e = failure(() =>
      readTimeTrace(`time_ns,E\n${rows(20, 1, (t) => `${t},1`).join('\n')}`, { file: 'x.csv' }),
    );
    expect([e.code, e.line]).toEqual(['UNKNOWN_UNIT', 1]);
    // A spectrum file handed over as a trace names its axis, which is not a delay.
    for (const header of ['wavenumber_cm-1,absorbance', 'wavelength_nm,%T', 'frequency_THz,power']) {
      e = failure(() => readTimeTrace(`${header}\n${rows(20, 2, (t) => `${1000 + t},0.1`).join('\n')}`));
      expect([e.code, e.line, e.field], header).toEqual(['UNKNOWN_UNIT', 1, 'delay']);
      expect(e.message).toMatch(/not a time-domain trace/);
    }
    expect(failure(() => readTimeTrace('  \n# only a comment\n')).code).toBe('EMPTY_FILE');
    expect(failure(() => readTimeTrace(Uint8Array.from([0x30, 0x2c, 0x00, 0x31]))).code).toBe('BINARY_DATA');
    expect(failure(() => readTimeTrace(fsCsv, { maxBytes: 100 })).code).toBe('FILE_TOO_LARGE');
    e = failure(() =>
      readTimeTrace(`delay_fs,field\n0,1\nmore text,here\n${rows(20, 1, (t) => `${t},1`).join('\n')}`),
    );
    expect([e.code, e.line, e.field]).toEqual(['NOT_NUMERIC', 3, 'delay']);
  });
});
