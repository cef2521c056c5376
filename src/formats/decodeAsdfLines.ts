// Decodes the body of `##XYDATA=(X++(Y..Y))` in any mix of AFFN, PAC, SQZ, DIF and DUP (ASDF) forms.
import { BandshelfError } from '../error.js';
import type { ParseWarning } from './types.js';

export interface DecodeAsdfLinesOptions {
  /** File named in errors. @default undefined */
  file?: string;
  /** 1-based line number of `lines[0]` in the file. @default 1 */
  firstLine?: number;
  /** Refuse more ordinates than this (a stray DUP count must not exhaust memory). @default 5_000_000 */
  maxPoints?: number;
  /**
   * The header's abscissa of ordinate 0 and step, in the units written on the lines (before XFACTOR). A DIF
   * line whose X is within half a step of the next point's abscissa (not the repeated one's) comes from a
   * writer that left the Y check out: its first value is kept as data, with a warning.
   * @default undefined (every line after a DIF line is taken to start with the Y check)
   */
  xHint?: { first: number; step: number };
  /**
   * Take a line's first value that repeats the last ordinate as the Y check even where `xHint` says the X names
   * a new point (writers that put the next point's X on a line and still repeat the check).
   * @default false
   */
  matchingValueIsCheck?: boolean;
}

export interface AsdfDecoded {
  /** Ordinates as written (before YFACTOR), NaN where the file had `?`. */
  y: Float64Array;
  /** 1-based file line of each ordinate. */
  pointLine: Uint32Array;
  /** Per data line: its X as written (before XFACTOR) … */
  lineX: Float64Array;
  /** … the index of the ordinate that X belongs to … */
  lineFirstIndex: Int32Array;
  /** … and its 1-based file line. */
  lineNumber: Uint32Array;
  warnings: ParseWarning[];
}

const ABS = 1;
const DIF = 2;
const DUP = 3;
const MISSING = 4;

/**
 * Each line is an abscissa followed by ordinates. Pseudo-digits (McDonald & Wilks 1988): SQZ `@A–I a–i`
 * start an absolute value, DIF `% J–R j–r` a difference from the previous ordinate, DUP `S–Z s` repeat the
 * previous token (value or difference) to a total count. When a line ends in DIF form, the next line's first
 * ordinate repeats the last one as a check: it is verified (a mismatch is a warning with the line) and dropped
 * (unless `xHint` shows the line X belongs to a new point).
 * `?` is a missing ordinate: it keeps its place (so abscissae stay right) and comes back as NaN.
 */
export function decodeAsdfLines(lines: readonly string[], options: DecodeAsdfLinesOptions = {}): AsdfDecoded {
  const { file, firstLine = 1, maxPoints = 5_000_000, xHint, matchingValueIsCheck = false } = options;
  const warnings: ParseWarning[] = [];
  let y = new Float64Array(1024);
  let pointLine = new Uint32Array(1024);
  let count = 0;
  let lineX = new Float64Array(64);
  let lineFirstIndex = new Int32Array(64);
  let lineNumber = new Uint32Array(64);
  let lineCount = 0;

  let kinds = new Uint8Array(64);
  let values = new Float64Array(64);

  let prevY = Number.NaN;
  let havePrev = false;
  let lastKind = 0;
  let lastDelta = 0;
  let lineEndedDif = false;
  let checkFailures = 0;
  let firstCheckFailure: ParseWarning | undefined;
  let difAfterMissing = 0;
  let missingChecks = 0;
  let firstMissingCheck: number | undefined;
  let notNumbers = 0;
  let firstNotNumber: { line: number; word: string } | undefined;
  // With the header's spacing known, a line's X tells a repeated last point (a Y check) from a new one.
  // Only an X within half a step of the next point counts; anything vaguer leaves the standard's rule in force.
  const startsNewPoint = (x: number, next: number): boolean => {
    if (!xHint || xHint.step === 0 || !Number.isFinite(xHint.first + xHint.step)) return false;
    return Math.abs(x - (xHint.first + next * xHint.step)) < 0.5 * Math.abs(xHint.step);
  };

  const ensure = (extra: number, lineNo: number): void => {
    const need = count + extra;
    if (need > maxPoints) {
      throw new BandshelfError('BAD_FORMAT', `the data hold more than ${maxPoints} points`, {
        file,
        line: lineNo,
      });
    }
    if (need <= y.length) return;
    let cap = y.length;
    while (cap < need) cap *= 2;
    const ny = new Float64Array(cap);
    ny.set(y.subarray(0, count));
    y = ny;
    const nl = new Uint32Array(cap);
    nl.set(pointLine.subarray(0, count));
    pointLine = nl;
  };
  const push = (v: number, lineNo: number): void => {
    if (count >= y.length || count >= maxPoints) ensure(1, lineNo);
    y[count] = v;
    pointLine[count] = lineNo;
    count++;
  };

  for (let li = 0; li < lines.length; li++) {
    const s = lines[li]!;
    const lineNo = firstLine + li;
    // Tokenise first, so the line's form is known before values are combined.
    let nTok = 0;
    let compressed = COMPRESSED.test(s);
    // `NaN`, `NA`, `inf` are made of pseudo-digits but, standing alone on an otherwise plain (AFFN) line, they are
    // a writer's missing or infinite values: never decode them as compressed digits.
    let notNumberWords = false;
    if (compressed && NOT_NUMBER_WORD.test(s)) {
      compressed = COMPRESSED.test(s.replace(NOT_NUMBER_WORDS, ' '));
      notNumberWords = !compressed;
    }
    let i = 0;
    const len = s.length;
    while (i < len) {
      const c = s.charCodeAt(i);
      if (c === 32 || c === 9 || c === 44 || c === 59 || c === 12 || c === 11) {
        i++;
        continue;
      }
      let kind: number;
      let value: number;
      if (c === 63) {
        kind = MISSING;
        value = Number.NaN;
        i++;
      } else if ((c >= 48 && c <= 57) || c === 46 || c === 43 || c === 45) {
        kind = ABS;
        const start = i;
        i++;
        while (i < len && isDigitOrDot(s.charCodeAt(i))) i++;
        if (i < len && (s.charCodeAt(i) | 32) === 101 && hasExponent(s, i, compressed, start)) {
          i++;
          if (s.charCodeAt(i) === 43 || s.charCodeAt(i) === 45) i++;
          while (i < len && isDigit(s.charCodeAt(i))) i++;
        }
        value = Number(s.slice(start, i));
        if (Number.isNaN(value)) throw notNumeric(s.slice(start, i), file, lineNo);
      } else if (notNumberWords && isSeparator(s.charCodeAt(i - 1)) && notNumberWordAt(s, i) > i) {
        const end = notNumberWordAt(s, i);
        const word = s.slice(i, end);
        if (/^inf/i.test(word)) {
          throw new BandshelfError('NOT_FINITE', `${JSON.stringify(word)} is not a finite ordinate`, {
            file,
            line: lineNo,
          });
        }
        kind = MISSING;
        value = Number.NaN;
        notNumbers++;
        firstNotNumber ??= { line: lineNo, word };
        i = end;
      } else {
        const pd = PSEUDO[c] ?? 0;
        if (pd === 0) {
          throw new BandshelfError(
            'NOT_NUMERIC',
            `unexpected character ${JSON.stringify(s[i])} in the data (not AFFN or ASDF)`,
            { file, line: lineNo },
          );
        }
        kind = pd >> 8;
        const digit = (pd & 0xff) - 10;
        const start = i + 1;
        i++;
        // Whole numbers (the usual case) are accumulated directly; a decimal point falls back to Number().
        let magnitude = Math.abs(digit);
        let dot = false;
        while (i < len) {
          const d = s.charCodeAt(i);
          if (d >= 48 && d <= 57) magnitude = magnitude * 10 + (d - 48);
          else if (d === 46) dot = true;
          else break;
          i++;
        }
        if (dot || i - start > 15) magnitude = Number(`${Math.abs(digit)}${s.slice(start, i)}`);
        if (Number.isNaN(magnitude)) throw notNumeric(s.slice(start - 1, i), file, lineNo);
        value = digit < 0 ? -magnitude : magnitude;
        if (kind === DUP && (!Number.isInteger(value) || value < 1)) {
          throw new BandshelfError(
            'NOT_NUMERIC',
            `repeat count ${JSON.stringify(s.slice(start - 1, i))} is not a whole number ≥ 1`,
            {
              file,
              line: lineNo,
            },
          );
        }
      }
      if (nTok >= kinds.length) {
        const nk = new Uint8Array(kinds.length * 2);
        nk.set(kinds);
        kinds = nk;
        const nv = new Float64Array(values.length * 2);
        nv.set(values);
        values = nv;
      }
      kinds[nTok] = kind;
      values[nTok] = value;
      nTok++;
    }
    if (nTok === 0) continue;
    if (kinds[0] !== ABS) {
      throw new BandshelfError('BAD_FORMAT', 'a data line must start with its x value', {
        file,
        line: lineNo,
      });
    }
    if (nTok === 1) continue;

    const countAtStart = count;
    let checked = false;
    for (let t = 1; t < nTok; t++) {
      const kind = kinds[t]!;
      const v = values[t]!;
      if (kind === ABS) {
        const matches = Math.abs(v - prevY) <= 1e-9 * Math.max(1, Math.abs(v)) || Number.isNaN(prevY);
        if (
          t === 1 &&
          lineEndedDif &&
          havePrev &&
          ((matchingValueIsCheck && matches) || !startsNewPoint(values[0]!, count))
        ) {
          // The Y check: the previous line's last ordinate, repeated.
          checked = true;
          if (!matches) {
            checkFailures++;
            firstCheckFailure ??= {
              line: lineNo,
              message: `Y-check failed: the line starts with ${v} but the previous line ended with ${prevY}`,
            };
          }
          prevY = v;
        } else {
          if (t === 1 && lineEndedDif && havePrev) {
            // A writer that skips the Y check: the line's X names a new point, so its first value is one.
            missingChecks++;
            firstMissingCheck ??= lineNo;
          }
          push(v, lineNo);
          prevY = v;
          havePrev = true;
        }
        lastKind = ABS;
      } else if (kind === DIF) {
        if (!havePrev) {
          throw new BandshelfError('BAD_FORMAT', 'a difference (DIF) comes before any absolute value', {
            file,
            line: lineNo,
          });
        }
        if (Number.isNaN(prevY)) difAfterMissing++;
        prevY += v;
        push(prevY, lineNo);
        lastDelta = v;
        lastKind = DIF;
      } else if (kind === DUP) {
        if (t === 1) {
          throw new BandshelfError('BAD_FORMAT', 'a repeat count (DUP) has nothing before it to repeat', {
            file,
            line: lineNo,
          });
        }
        const repeats = v - 1;
        if (repeats > 0) ensure(repeats, lineNo);
        if (lastKind === DIF) {
          for (let r = 0; r < repeats; r++) {
            prevY += lastDelta;
            push(prevY, lineNo);
          }
        } else {
          for (let r = 0; r < repeats; r++) push(prevY, lineNo);
        }
      } else {
        push(Number.NaN, lineNo);
        prevY = Number.NaN;
        havePrev = true;
        lastKind = ABS;
      }
    }
    lineEndedDif = lastKind === DIF;

    if (lineCount >= lineX.length) {
      const cap = lineX.length * 2;
      const a = new Float64Array(cap);
      a.set(lineX);
      lineX = a;
      const b = new Int32Array(cap);
      b.set(lineFirstIndex);
      lineFirstIndex = b;
      const d = new Uint32Array(cap);
      d.set(lineNumber);
      lineNumber = d;
    }
    lineX[lineCount] = values[0]!;
    lineFirstIndex[lineCount] = checked ? countAtStart - 1 : countAtStart;
    lineNumber[lineCount] = lineNo;
    lineCount++;
  }

  if (firstNotNumber) {
    warnings.push({
      line: firstNotNumber.line,
      message: `${notNumbers} ordinate${notNumbers === 1 ? '' : 's'} written as a word (${JSON.stringify(firstNotNumber.word)}) read as missing, not as compressed digits`,
    });
  }
  if (firstCheckFailure) {
    if (checkFailures > 1) firstCheckFailure.message += ` (${checkFailures} lines fail their Y-check)`;
    warnings.push(firstCheckFailure);
  }
  if (missingChecks > 0) {
    warnings.push({
      line: firstMissingCheck,
      message: `${missingChecks} DIF line${missingChecks === 1 ? ' starts' : 's start'} without the Y check (the X names a new point); read as data`,
    });
  }
  if (difAfterMissing > 0) {
    warnings.push({
      message: `${difAfterMissing} difference${difAfterMissing === 1 ? '' : 's'} followed a missing ordinate and could not be resolved`,
    });
  }
  return {
    y: y.slice(0, count),
    pointLine: pointLine.slice(0, count),
    lineX: lineX.slice(0, lineCount),
    lineFirstIndex: lineFirstIndex.slice(0, lineCount),
    lineNumber: lineNumber.slice(0, lineCount),
    warnings,
  };
}

// Any pseudo-digit other than E/e (which may be an AFFN exponent) marks a compressed line.
const COMPRESSED = /[@A-DF-Ia-df-i%J-Rj-rS-Zs]/;

/** Pseudo-digit table: (kind << 8) | (digit + 10), 0 for characters that are not pseudo-digits. */
const PSEUDO: number[] = (() => {
  const table: number[] = [];
  const set = (ch: string, kind: number, digit: number): void => {
    table[ch.charCodeAt(0)] = (kind << 8) | (digit + 10);
  };
  set('@', ABS, 0);
  set('%', DIF, 0);
  for (let d = 1; d <= 9; d++) {
    set(String.fromCharCode(64 + d), ABS, d); // A–I
    set(String.fromCharCode(96 + d), ABS, -d); // a–i
    set(String.fromCharCode(73 + d), DIF, d); // J–R
    set(String.fromCharCode(105 + d), DIF, -d); // j–r
  }
  for (let d = 1; d <= 8; d++) set(String.fromCharCode(82 + d), DUP, d); // S–Z
  set('s', DUP, 9);
  return table;
})();

// Words a writer puts for a value that is not a number, each standing alone between separators.
const NOT_NUMBER_WORD = /(?:^|[\s,;])(?:nan|na|inf|infinity)(?=$|[\s,;])/i;
const NOT_NUMBER_WORDS = /(?<=^|[\s,;])(?:nan|na|inf|infinity)(?=$|[\s,;])/gi;

/** True for a data-line separator (space, tab, comma, semicolon, form feed, vertical tab) or before the line. */
function isSeparator(c: number): boolean {
  return Number.isNaN(c) || c === 32 || c === 9 || c === 44 || c === 59 || c === 12 || c === 11;
}

/** The end of a not-a-number word starting at `i` (ending at a separator or the line end), or `i` if none. */
function notNumberWordAt(s: string, i: number): number {
  let j = i;
  while (j < s.length && j - i < 9 && !isSeparator(s.charCodeAt(j))) j++;
  if (j < s.length && !isSeparator(s.charCodeAt(j))) return i;
  return /^(?:nan|na|inf|infinity)$/i.test(s.slice(i, j)) ? j : i;
}

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

function isDigitOrDot(c: number): boolean {
  return (c >= 48 && c <= 57) || c === 46;
}

/**
 * Is the E/e at `at` an exponent of the AFFN number starting at `start`? E/e are also SQZ +5/−5, so an exponent
 * needs one to three digits (a double's range). A signed one (E+2, e-7) is taken as an exponent; an unsigned one
 * must end the token (line end, separator, sign or `?` next) and, on a compressed line, follow a number with
 * a decimal point.
 */
function hasExponent(s: string, at: number, compressed: boolean, start: number): boolean {
  let k = at + 1;
  const signed = s.charCodeAt(k) === 43 || s.charCodeAt(k) === 45;
  if (signed) k++;
  const digitsFrom = k;
  while (k < s.length && isDigit(s.charCodeAt(k))) k++;
  const digits = k - digitsFrom;
  if (digits < 1 || digits > 3) return false;
  if (signed) return true;
  if (k < s.length && !ENDS_EXPONENT.has(s.charCodeAt(k))) return false;
  return !compressed || s.slice(start, at).includes('.');
}

/** Characters that may follow an exponent: space, tab, comma, semicolon, +, −, ?. */
const ENDS_EXPONENT = new Set([32, 9, 44, 59, 43, 45, 63]);

function notNumeric(text: string, file: string | undefined, line: number): BandshelfError {
  return new BandshelfError('NOT_NUMERIC', `${JSON.stringify(text.slice(0, 30))} is not a number`, {
    file,
    line,
  });
}
