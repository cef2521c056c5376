// The ASDF decoder on its own: pseudo-digit values, exponents versus SQZ E/e, missing values, Y checks.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { decodeAsdfLines } from '../../src/formats/decodeAsdfLines.js';

const ys = (lines: string[]): number[] => Array.from(decodeAsdfLines(lines).y);

describe('decodeAsdfLines', () => {
  it('reads multi-digit pseudo-digit values and signs', () => {
    // Pseudo-digit tables of JCAMP-DX 4.24 (McDonald & Wilks 1988): A28 = +128, j3 = −13 as a difference,
    // and DUP counts total occurrences (T = 2, s = 9, S0 = 10).
    expect(ys(['0 A28j3'])).toEqual([128, 115]);
    expect(ys(['0 @s'])).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 0]);
    expect(ys(['0 AJS0'])).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11]);
    expect(ys(['0 a5T'])).toEqual([-15, -15]);
  });

  it('tells AFFN exponents from SQZ E/e', () => {
    // Plain AFFN: 1E5 is 100000; on a compressed line E is SQZ +5 unless a sign or a decimal point says otherwise.
    expect(ys(['0 1E5 2.5e-3 -4E+2'])).toEqual([1e5, 2.5e-3, -400]);
    expect(ys(['0 1E5A'])).toEqual([1, 55, 1]);
    expect(ys(['0 1E+2A'])).toEqual([100, 1]);
    // An X run straight into SQZ values that all begin with E (+5…): four digits is no double exponent.
    const d = decodeAsdfLines(['3670E1234E2345']);
    expect(Array.from(d.lineX)).toEqual([3670]);
    expect(Array.from(d.y)).toEqual([51234, 52345]);
  });

  it('keeps ? as NaN in its place, also under a repeat', () => {
    const out = ys(['0 1 ? 3', '3 ?T 6']);
    expect(out.map((v) => (Number.isNaN(v) ? 'NaN' : v))).toEqual([1, 'NaN', 3, 'NaN', 'NaN', 6]);
  });

  it('records each line’s X and the index of the ordinate it belongs to, also across a Y check', () => {
    const d = decodeAsdfLines(['10 1JJ', '12 CJ', '13 D'], { firstLine: 20 });
    expect(Array.from(d.y)).toEqual([1, 2, 3, 4]);
    expect(Array.from(d.lineX)).toEqual([10, 12, 13]);
    expect(Array.from(d.lineFirstIndex)).toEqual([0, 2, 3]);
    expect(Array.from(d.lineNumber)).toEqual([20, 21, 22]);
    expect(Array.from(d.pointLine)).toEqual([20, 20, 20, 21]);
  });

  it('does not treat the first value after an absolute-value line as a Y check', () => {
    expect(ys(['0 1 2', '2 3 4'])).toEqual([1, 2, 3, 4]);
  });

  it('refuses a runaway repeat count instead of exhausting memory', () => {
    expect(() => decodeAsdfLines(['0 AS99999999'], { maxPoints: 1000 })).toThrow(BandshelfError);
  });

  it('refuses characters outside AFFN and ASDF, naming the line', () => {
    try {
      decodeAsdfLines(['0 1 2', '2 3 x'], { file: 'f.jdx', firstLine: 5 });
      expect.unreachable();
    } catch (e) {
      expect((e as BandshelfError).code).toBe('NOT_NUMERIC');
      expect((e as BandshelfError).line).toBe(6);
    }
  });
});
