// Decodes `(XY..XY)` tables (XYPOINTS, PEAK TABLE): AFFN numbers in groups of x, y (and w), `?` for missing.
import { BandshelfError } from '../error.js';
import { growPointBuffers, type PointBuffers } from './growPointBuffers.js';

export interface DecodeXyPairsOptions {
  /** File named in errors. @default undefined */
  file?: string;
  /** 1-based line number of `lines[0]` in the file. @default 1 */
  firstLine?: number;
  /** Numbers per group: 2 for (XY..XY), 3 for (XYW..XYW). @default 2 */
  columns?: number;
  /** Refuse more groups than this. @default 5_000_000 */
  maxPoints?: number;
}

export interface XyPairsDecoded {
  /** As written (before XFACTOR). */
  x: Float64Array;
  /** As written (before YFACTOR), NaN where the file had `?`. */
  y: Float64Array;
  /** 1-based file line of each group's x. */
  pointLine: Uint32Array;
}

/** Groups may run across separators `,` `;` spaces and tabs, one or several per line. */
export function decodeXyPairs(lines: readonly string[], options: DecodeXyPairsOptions = {}): XyPairsDecoded {
  const { file, firstLine = 1, columns = 2, maxPoints = 5_000_000 } = options;
  let points: PointBuffers = {
    x: new Float64Array(256),
    y: new Float64Array(256),
    pointLine: new Uint32Array(256),
  };
  let count = 0;
  let column = 0;
  let lastLine = firstLine;
  for (let li = 0; li < lines.length; li++) {
    const lineNo = firstLine + li;
    const fields = lines[li]!.split(/[\s,;]+/);
    for (const field of fields) {
      if (field === '') continue;
      lastLine = lineNo;
      let value: number;
      if (field === '?') value = Number.NaN;
      else {
        value = AFFN.test(field) ? Number(field) : Number.NaN;
        if (Number.isNaN(value)) {
          throw new BandshelfError('NOT_NUMERIC', `${JSON.stringify(field.slice(0, 30))} is not a number`, {
            file,
            line: lineNo,
          });
        }
      }
      if (column === 0) {
        if (Number.isNaN(value)) {
          throw new BandshelfError('NOT_NUMERIC', 'an x value is missing (?)', { file, line: lineNo });
        }
        if (count >= maxPoints) {
          throw new BandshelfError('BAD_FORMAT', `the data hold more than ${maxPoints} points`, {
            file,
            line: lineNo,
          });
        }
        if (count >= points.x.length) points = growPointBuffers(points);
        points.x[count] = value;
        points.pointLine[count] = lineNo;
      } else if (column === 1) {
        points.y[count] = value;
        count++;
      }
      column = (column + 1) % columns;
    }
  }
  if (column !== 0) {
    throw new BandshelfError('BAD_FORMAT', `the table ends inside a group of ${columns} numbers`, {
      file,
      line: lastLine,
    });
  }
  return {
    x: points.x.slice(0, count),
    y: points.y.slice(0, count),
    pointLine: points.pointLine.slice(0, count),
  };
}

const AFFN = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
