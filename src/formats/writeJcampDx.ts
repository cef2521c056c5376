// Writes a spectrum as JCAMP-DX 4.24 text (cm⁻¹, absorbance) in AFFN, PAC, SQZ, DIF or DIFDUP form.
import { BandshelfError } from '../error.js';
import type { Spectrum } from '../spectrum/types.js';

export type JcampForm = 'affn' | 'pac' | 'sqz' | 'dif' | 'difdup';

export interface WriteJcampDxOptions {
  /** Ordinate compression of `##XYDATA`. Ignored for unevenly spaced x, which is written as AFFN XYPOINTS. @default 'difdup' */
  form?: JcampForm;
  /** `##TITLE`. @default meta.title, else 'untitled' */
  title?: string;
  /**
   * Labels written back (keys as readJcampDx gives them: origin, owner, resolution, state, samplingProcedure,
   * cas, formula, casName, names, date, instrument). Other keys are not JCAMP-DX labels and are left out.
   * @default {}
   */
  meta?: Record<string, string | number | undefined>;
  /**
   * Significant digits of the largest |y| as an integer: YFACTOR = 10^(⌊log10 max|y|⌋ − digits + 1). 8 keeps a
   * quantisation step ≤ 1e-7 of max|y|. @default 8
   */
  significantDigits?: number;
  /** Lines written as `$$` comments after the labels (e.g. the operation that made the spectrum), each cut at 80
   * characters. @default [] */
  comments?: readonly string[];
}

/** The smallest YFACTOR exponent written: 10^-300 is a normal double, and so is 10^300 (the divisor below). */
export const MIN_EXPONENT = -300;

/**
 * Evenly spaced x (every point within 1e-6 of a step from FIRSTX + i·ΔX) → `##XYDATA=(X++(Y..Y))` with FIRSTX,
 * LASTX, DELTAX and NPOINTS; otherwise `##XYPOINTS=(XY..XY)`. Ordinates are integers times YFACTOR, so a
 * write → read round trip is within 0.5·YFACTOR (≤ 5e-8 of max|y| at the default digits; YFACTOR ≥ 1E-300). No line exceeds
 * 80 characters. In DIF forms every line after the first repeats the previous line's last ordinate (the
 * Y check) and a last line repeats the final ordinate, as the standard's own examples do.
 */
export function writeJcampDx(spectrum: Spectrum, options: WriteJcampDxOptions = {}): string {
  const { form = 'difdup', meta = {}, significantDigits = 8 } = options;
  const { wavenumber: x, absorbance: y } = spectrum;
  const n = Math.min(x.length, y.length);
  if (!FORMS.includes(form)) {
    throw new BandshelfError('BAD_OPTION', `form ${JSON.stringify(form)} is not one of ${FORMS.join(', ')}`, {
      field: 'form',
    });
  }
  if (!Number.isInteger(significantDigits) || significantDigits < 1 || significantDigits > 15) {
    throw new BandshelfError('BAD_OPTION', 'significantDigits must be a whole number from 1 to 15', {
      field: 'significantDigits',
    });
  }
  if (n < 2) throw new BandshelfError('TOO_FEW_POINTS', 'a spectrum to write needs at least two points');
  let maxAbs = 0;
  let minY = Number.POSITIVE_INFINITY;
  let maxY = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    const yi = y[i]!;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) {
      throw new BandshelfError('NOT_FINITE', `point ${i} (${xi}, ${yi}) is not finite`);
    }
    if (Math.abs(yi) > maxAbs) maxAbs = Math.abs(yi);
  }

  // The exponent stops at MIN_EXPONENT: 1E-331 would read as 0 (a YFACTOR the reader refuses), and ordinates
  // that small round to 0 within the documented 0.5·YFACTOR.
  const exponent =
    maxAbs > 0 ? Math.max(MIN_EXPONENT, Math.floor(Math.log10(maxAbs)) - significantDigits + 1) : 0;
  const yFactorText = `1E${exponent}`;
  const yFactor = Number(yFactorText);
  const ints = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const v = Math.round(y[i]! / yFactor);
    ints[i] = v === 0 ? 0 : v; // no −0: it would print as 0 but compare unequal in DUP runs on some engines
    // Dividing by an exact power of ten keeps MAXY/MINY free of binary noise such as 0.5506261100000001.
    const real = exponent < 0 ? v / 10 ** -exponent : v * 10 ** exponent;
    if (real < minY) minY = real;
    if (real > maxY) maxY = real;
  }

  const uniform = isUniform(x, n);
  const title = oneLine(String(options.title ?? meta.title ?? 'untitled'));
  const out: string[] = [
    ...labelLines('TITLE', title),
    '##JCAMP-DX=4.24',
    '##DATA TYPE=INFRARED SPECTRUM',
    ...labelLines('ORIGIN', oneLine(String(meta.origin ?? ''))),
    ...labelLines('OWNER', oneLine(String(meta.owner ?? ''))),
  ];
  for (const [key, label] of META_OUT) {
    const value = meta[key];
    if (value === undefined || value === '') continue;
    if (key === 'names')
      out.push(
        ...labelLines(
          label,
          String(value)
            .split(/\s*;\s*/)
            .join('\n'),
        ),
      );
    else out.push(...labelLines(label, oneLine(String(value))));
  }
  for (const comment of options.comments ?? []) out.push(`$$ ${oneLine(comment)}`.slice(0, MAX_LINE));
  out.push(
    '##XUNITS=1/CM',
    '##YUNITS=ABSORBANCE',
    '##XFACTOR=1',
    `##YFACTOR=${yFactorText}`,
    `##FIRSTX=${num(x[0]!)}`,
    `##LASTX=${num(x[n - 1]!)}`,
  );
  if (uniform) out.push(`##DELTAX=${num((x[n - 1]! - x[0]!) / (n - 1))}`);
  out.push(
    `##MAXY=${num(maxY)}`,
    `##MINY=${num(minY)}`,
    `##NPOINTS=${n}`,
    `##FIRSTY=${num(ints[0]! * yFactor)}`,
  );
  if (uniform) {
    out.push('##XYDATA=(X++(Y..Y))');
    if (form === 'dif' || form === 'difdup') difLines(x, ints, n, form === 'difdup', out);
    else plainLines(x, ints, n, form, out);
  } else {
    out.push('##XYPOINTS=(XY..XY)');
    for (let i = 0; i < n; i++) out.push(`${num(x[i]!)}, ${ints[i]}`);
  }
  out.push('##END=');
  return `${out.join('\n')}\n`;
}

const FORMS: readonly JcampForm[] = ['affn', 'pac', 'sqz', 'dif', 'difdup'];
const MAX_LINE = 80;

const META_OUT: [string, string][] = [
  ['date', 'LONG DATE'],
  ['instrument', 'SPECTROMETER/DATA SYSTEM'],
  ['resolution', 'RESOLUTION'],
  ['state', 'STATE'],
  ['samplingProcedure', 'SAMPLING PROCEDURE'],
  ['casName', 'CAS NAME'],
  ['names', 'NAMES'],
  ['formula', 'MOLFORM'],
  ['cas', 'CAS REGISTRY NO'],
];

/** Reader-safe text: one line, and no `$$` (which would start a comment). */
function oneLine(text: string): string {
  return text.replace(/[\r\n]+/g, ' ').replace(/\$\$/g, '$ $');
}

/** A label whose value may be longer than a line: wrapped at spaces into continuation lines. */
function labelLines(label: string, value: string): string[] {
  const result: string[] = [];
  const parts = value.split('\n').map((p) => oneLine(p));
  let first = true;
  for (const part of parts) {
    let rest = part;
    let prefix = first ? `##${label}=` : '';
    while (prefix.length + rest.length > MAX_LINE) {
      const room = MAX_LINE - prefix.length;
      const cut = rest.lastIndexOf(' ', room);
      if (cut <= 0) break;
      result.push(prefix + rest.slice(0, cut));
      rest = rest.slice(cut + 1);
      prefix = '';
    }
    // A continuation line must never look like a label.
    const line = prefix + rest;
    result.push(prefix === '' && line.trimStart().startsWith('##') ? line.replace('##', '# #') : line);
    first = false;
  }
  return result;
}

/** Shortest text that reads back to the same double; exponents keep an explicit sign so E/e is never SQZ. */
function num(v: number): string {
  const s = String(v);
  if (!s.includes('e')) return s;
  const [mantissa, exp] = s.split('e') as [string, string];
  return `${mantissa}E${exp.startsWith('-') ? exp : `+${exp.replace('+', '')}`}`;
}

/** The abscissa of a data line: 12 significant digits are plenty for the reader's X check (half a step). */
function lineX(v: number): string {
  return num(Number(v.toPrecision(12)));
}

function isUniform(x: Float64Array, n: number): boolean {
  const step = (x[n - 1]! - x[0]!) / (n - 1);
  if (step === 0) return false;
  const tolerance = 1e-6 * Math.abs(step);
  for (let i = 0; i < n; i++) {
    if (Math.abs(x[i]! - (x[0]! + i * step)) > tolerance) return false;
  }
  return true;
}

function pseudo(value: number, zero: string, positive: string, negative: string): string {
  if (value === 0) return zero;
  const digits = String(Math.abs(value));
  const lead = Number(digits[0]);
  const table = value > 0 ? positive : negative;
  return table[lead - 1] + digits.slice(1);
}

const sqz = (v: number): string => pseudo(v, '@', 'ABCDEFGHI', 'abcdefghi');
const dif = (v: number): string => pseudo(v, '%', 'JKLMNOPQR', 'jklmnopqr');
const dup = (count: number): string => pseudo(count, '', 'STUVWXYZs', 'STUVWXYZs');

function plainLines(x: Float64Array, ints: Float64Array, n: number, form: JcampForm, out: string[]): void {
  let i = 0;
  while (i < n) {
    // A space after X, as in the standard's `0 1JT%jX`: X's digits never run into a pseudo-digit E/e.
    let line = `${lineX(x[i]!)} `;
    let j = i;
    while (j < n) {
      const v = ints[j]!;
      const token =
        form === 'affn'
          ? j === i
            ? `${v}`
            : ` ${v}`
          : form === 'pac'
            ? j === i || v < 0
              ? `${v}`
              : `+${v}`
            : sqz(v);
      if (j > i && line.length + token.length > MAX_LINE) break;
      line += token;
      j++;
    }
    out.push(line);
    i = j;
  }
}

function difLines(x: Float64Array, ints: Float64Array, n: number, useDup: boolean, out: string[]): void {
  let i = 0;
  for (;;) {
    let line = `${lineX(x[i]!)} ${sqz(ints[i]!)}`;
    let j = i;
    while (j < n - 1) {
      const d = ints[j + 1]! - ints[j]!;
      let run = 1;
      if (useDup) while (j + run < n - 1 && ints[j + run + 1]! - ints[j + run]! === d) run++;
      let token = dif(d) + (run > 1 ? dup(run) : '');
      // A line always takes at least one difference, so the loop moves on whatever the widths.
      if (j > i && line.length + token.length > MAX_LINE) {
        // Fit what part of the run still fits on this line; the rest goes on the next one.
        if (run === 1) break;
        while (run > 1 && line.length + dif(d).length + (run > 1 ? dup(run).length : 0) > MAX_LINE) run--;
        token = dif(d) + (run > 1 ? dup(run) : '');
        if (line.length + token.length > MAX_LINE) break;
      }
      line += token;
      j += run;
    }
    out.push(line);
    // The next line starts with the last ordinate again (the Y check); after the final point it stands alone.
    if (j === n - 1) {
      out.push(`${lineX(x[n - 1]!)} ${sqz(ints[n - 1]!)}`);
      return;
    }
    i = j;
  }
}
