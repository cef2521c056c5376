// Reads JCAMP-DX 4.24 (and tolerated 5.01) infrared spectra: one ParsedSpectrum per spectrum block.
import { BandshelfError } from '../error.js';
import { finiteRange } from '../spectrum/finiteRange.js';
import { checkReadingUnits } from './checkReadingUnits.js';
import { decodeAsdfLines } from './decodeAsdfLines.js';
import { decodeXyPairs } from './decodeXyPairs.js';
import type { JcampBlock, JcampRecord } from './jcampTypes.js';
import { looksPercentTransmittance } from './looksPercentTransmittance.js';
import { markSaturated } from './markSaturated.js';
import { spectrumFromPoints } from './spectrumFromPoints.js';
import { splitJcampRecords } from './splitJcampRecords.js';
import { toWavenumberAbsorbance } from './toWavenumberAbsorbance.js';
import { transmittanceScale } from './transmittanceScale.js';
import { type ParsedSpectrum, type ParseWarning, type XUnit, Y_UNITS, type YUnit } from './types.js';

export interface ReadJcampDxOptions {
  /** File named in errors and warnings. @default undefined */
  file?: string;
  /** Read only the n-th spectrum block (1-based, counting spectrum blocks only). @default undefined (all) */
  block?: number;
  /** Take the abscissa to be in this unit whatever XUNITS says. @default undefined (from XUNITS) */
  xUnit?: XUnit;
  /** Take the ordinate to be in this unit whatever YUNITS says. @default undefined (from YUNITS) */
  yUnit?: YUnit;
  /** Refuse blocks with more points than this. @default 5_000_000 */
  maxPoints?: number;
}

/**
 * JCAMP-DX after McDonald & Wilks, Appl. Spectrosc. 42 (1988). Each block holding `##XYDATA=(X++(Y..Y))`
 * (AFFN, PAC, SQZ, DIF, DUP in any mix) or `##XYPOINTS=(XY..XY)` becomes one spectrum in cm⁻¹ and absorbance,
 * ascending; LINK blocks only group them. Real instrument files bend the rules, so NPOINTS, FIRSTY or line
 * abscissae that disagree with the data, `?` ordinates, missing ##END and the like are read with a warning;
 * a peak table alone is NOT_A_SPECTRUM and a unit that cannot be converted is UNKNOWN_UNIT.
 */
export function readJcampDx(text: string, options: ReadJcampDxOptions = {}): ParsedSpectrum[] {
  const { file } = options;
  checkReadingUnits(options, file === undefined ? {} : { file });
  if (text.trim() === '') throw new BandshelfError('EMPTY_FILE', 'the file is empty', { file });
  const { lines, blocks, warnings: fileWarnings } = splitJcampRecords(text);
  if (blocks.length === 0) {
    throw new BandshelfError('BAD_FORMAT', 'no ##LABEL= records: this is not JCAMP-DX text', { file });
  }

  const spectra: { block: JcampBlock; data: JcampRecord }[] = [];
  const peakTables: JcampRecord[] = [];
  const unsupported: JcampRecord[] = [];
  for (const block of blocks) {
    const data = block.records.find((r) => DATA_LABELS.has(r.label));
    if (!data) continue;
    const dataType = (ownValue(block, 'DATATYPE') ?? '').toUpperCase();
    if (data.label === 'PEAKTABLE' || data.label === 'PEAKASSIGNMENTS' || /PEAK/.test(dataType)) {
      peakTables.push(data);
    } else if (data.label === 'XYDATA' || data.label === 'XYPOINTS') spectra.push({ block, data });
    else unsupported.push(data);
  }
  if (spectra.length === 0) {
    if (peakTables.length > 0) {
      throw new BandshelfError('NOT_A_SPECTRUM', 'a peak table is not a spectrum', {
        file,
        line: peakTables[0]!.line,
        field: peakTables[0]!.rawLabel,
      });
    }
    if (unsupported.length > 0) {
      throw new BandshelfError(
        'BAD_FORMAT',
        `##${unsupported[0]!.rawLabel} data are not read by bandshelf; export the spectrum as ##XYDATA`,
        { file, line: unsupported[0]!.line, field: unsupported[0]!.rawLabel },
      );
    }
    throw new BandshelfError('NOT_A_SPECTRUM', 'the file has no ##XYDATA or ##XYPOINTS data', { file });
  }
  for (const table of peakTables) {
    fileWarnings.push({
      line: table.line,
      message: 'a peak table is not a spectrum; that block was skipped',
    });
  }
  for (const rec of unsupported) {
    fileWarnings.push({
      line: rec.line,
      message: `##${rec.rawLabel} data are not read; that block was skipped`,
    });
  }

  let chosen = spectra.map((s, i) => ({ ...s, index: i + 1 }));
  if (options.block !== undefined) {
    const n = options.block;
    if (!Number.isInteger(n) || n < 1 || n > spectra.length) {
      throw new BandshelfError(
        'BAD_OPTION',
        `block ${n} does not exist: the file holds ${spectra.length} spectr${spectra.length === 1 ? 'um' : 'a'} (1–${spectra.length})`,
        { file, field: 'block' },
      );
    }
    chosen = [chosen[n - 1]!];
  }
  return chosen.map(({ block, data, index }) => {
    const parsed = readBlock(block, data, lines, options);
    parsed.source.block = index;
    parsed.warnings = [...fileWarnings, ...parsed.warnings];
    return parsed;
  });
}

const DATA_LABELS = new Set(['XYDATA', 'XYPOINTS', 'PEAKTABLE', 'PEAKASSIGNMENTS', 'NTUPLES', 'DATATABLE']);

/** Labels carried into `meta`, normalised label → key. LONGDATE is preferred over DATE when both exist. */
const META_LABELS: [string, string][] = [
  ['TITLE', 'title'],
  ['JCAMPDX', 'jcampVersion'],
  ['DATATYPE', 'dataType'],
  ['ORIGIN', 'origin'],
  ['OWNER', 'owner'],
  ['LONGDATE', 'date'],
  ['DATE', 'date'],
  ['SPECTROMETERDATASYSTEM', 'instrument'],
  ['RESOLUTION', 'resolution'],
  ['STATE', 'state'],
  ['SAMPLINGPROCEDURE', 'samplingProcedure'],
  ['CASREGISTRYNO', 'cas'],
  ['MOLFORM', 'formula'],
  ['CASNAME', 'casName'],
  ['NAMES', 'names'],
];

function ownRecord(block: JcampBlock, label: string): JcampRecord | undefined {
  return block.records.find((r) => r.label === label);
}

function ownValue(block: JcampBlock, label: string): string | undefined {
  return ownRecord(block, label)?.value;
}

/** The record in this block, or else in a block that holds it (compound files state shared labels once). */
function inheritedRecord(block: JcampBlock, label: string): JcampRecord | undefined {
  for (let b: JcampBlock | undefined = block; b; b = b.parent) {
    const rec = ownRecord(b, label);
    if (rec) return rec;
  }
  return undefined;
}

/** A label's whole value: the `=` line plus its continuation lines, joined. */
function fullValue(rec: JcampRecord, lines: string[], joiner: string): string {
  const parts = [rec.value];
  for (let i = rec.bodyStart; i < rec.bodyEnd; i++) parts.push(lines[i]!.trim());
  return parts.filter((p) => p !== '').join(joiner);
}

function readMeta(block: JcampBlock, lines: string[]): Record<string, string | number> {
  const meta: Record<string, string | number> = {};
  for (const [label, key] of META_LABELS) {
    if (meta[key] !== undefined) continue;
    // A block's own title and data type never come from the LINK block around it.
    const rec =
      label === 'TITLE' || label === 'DATATYPE' ? ownRecord(block, label) : inheritedRecord(block, label);
    if (!rec) continue;
    const value = fullValue(rec, lines, label === 'NAMES' ? '; ' : ' ');
    if (value === '') continue;
    if (key === 'resolution') {
      const m = /^([+-]?(?:\d+\.?\d*|\.\d+))\s*(?:1\/CM|CM-1|CM\^-1|CM⁻¹)?$/i.exec(value);
      meta[key] = m ? Number(m[1]) : value;
    } else meta[key] = value;
  }
  return meta;
}

function numberLabel(block: JcampBlock, label: string, file: string | undefined): number | undefined {
  const rec = ownRecord(block, label);
  if (!rec || rec.value === '') return undefined;
  if (!AFFN.test(rec.value)) {
    throw new BandshelfError('NOT_NUMERIC', `##${rec.rawLabel}=${clip(rec.value)} is not a number`, {
      file,
      line: rec.line,
      field: rec.rawLabel,
    });
  }
  const v = Number(rec.value);
  if (!Number.isFinite(v)) {
    throw new BandshelfError('NOT_FINITE', `##${rec.rawLabel}=${clip(rec.value)} is not a finite number`, {
      file,
      line: rec.line,
      field: rec.rawLabel,
    });
  }
  return v;
}

function factorLabel(block: JcampBlock, label: string, file: string | undefined): number {
  const v = numberLabel(block, label, file);
  if (v === undefined) return 1;
  if (v === 0) {
    const rec = ownRecord(block, label)!;
    throw new BandshelfError('BAD_FORMAT', `##${rec.rawLabel}=0 would turn every value into 0`, {
      file,
      line: rec.line,
      field: rec.rawLabel,
    });
  }
  return v;
}

function readXUnit(block: JcampBlock, file: string | undefined, warnings: ParseWarning[]): XUnit {
  const rec = inheritedRecord(block, 'XUNITS');
  if (!rec || rec.value === '') {
    warnings.push({ line: block.line, message: 'no ##XUNITS; x read as wavenumber in 1/CM' });
    return 'cm-1';
  }
  const v = rec.value.toUpperCase().replace(/\s+/g, '');
  if (
    /^(1\/CM|CM-1|CM\^-1|CM\^\(-1\)|CM\*\*-1|CM−1|CM⁻¹|1\/CENTIMETERS?|WAVENUMBERS?(\(CM-1\)|\(1\/CM\))?)$/.test(
      v,
    )
  ) {
    return 'cm-1';
  }
  if (/^(MICROMET(ER|RE)S?|MICRONS?|UM|µM|ΜM|μM)$/.test(v)) return 'um';
  if (/^(NANOMET(ER|RE)S?|NM)$/.test(v)) return 'nm';
  throw new BandshelfError(
    'UNKNOWN_UNIT',
    `##${rec.rawLabel}=${clip(rec.value)} is not a unit bandshelf reads (1/CM, MICROMETERS, NANOMETERS); give the x unit as an option`,
    { file, line: rec.line, field: rec.rawLabel },
  );
}

function readYUnit(
  block: JcampBlock,
  y: Float64Array,
  file: string | undefined,
  warnings: ParseWarning[],
): YUnit {
  const rec = inheritedRecord(block, 'YUNITS');
  const { max } = finiteRange(y);
  if (!rec || rec.value === '') {
    warnings.push({
      line: block.line,
      message:
        'no ##YUNITS; y read as absorbance' +
        (looksPercentTransmittance(y)
          ? ` (values reach ${max}, which looks like %T: give the y unit if so)`
          : ''),
    });
    return 'absorbance';
  }
  const v = rec.value.toUpperCase().replace(/\s+/g, ' ').trim();
  const percentWords =
    /^(%\s?T|%\s?TRANSMITTANCE|PERCENT ?TRANSMITTANCE|PERCENT ?TRANSMISSION|TRANSMITTANCE ?\(%\)|T ?\(%\)|TRANSMITTANCE ?%|%)$/.test(
      v,
    );
  if (percentWords || /^(TRANSMITTANCE|TRANSMISSION|T)$/.test(v)) {
    const scale = transmittanceScale(y, {
      stated: percentWords ? 'percent' : 'unstated',
      file,
      line: rec.line,
    });
    if (scale.warning) {
      warnings.push({
        ...scale.warning,
        message: `##${rec.rawLabel}=${rec.value}: ${scale.warning.message}`,
      });
    }
    return scale.unit;
  }
  if (isAbsorbanceShaped(v)) {
    warnings.push({
      line: rec.line,
      message: `##${rec.rawLabel}=${clip(rec.value)} is a decadic absorption coefficient; read as absorbance-shaped (the unit text is kept in the metadata)`,
    });
    return 'absorbance';
  }
  if (/^ARBITRARY/.test(v)) {
    throw new BandshelfError(
      'UNKNOWN_UNIT',
      `##${rec.rawLabel}=${clip(rec.value)} does not say absorbance or transmittance; give the y unit (--y-unit ${Y_UNITS.join('|')})`,
      { file, line: rec.line, field: rec.rawLabel },
    );
  }
  if (/^(ABSORBANCE|ABSORBANCE UNITS|A|AU|ABS|OPTICAL DENSITY|OD)$/.test(v)) return 'absorbance';
  throw new BandshelfError(
    'UNKNOWN_UNIT',
    `##${rec.rawLabel}=${clip(rec.value)} is not absorbance or transmittance; give the y unit as an option`,
    { file, line: rec.line, field: rec.rawLabel },
  );
}

/** Decadic absorptivity or absorption-coefficient units: absorbance per amount and length, shaped like absorbance. */
function isAbsorbanceShaped(v: string): boolean {
  return (
    /BASE ?10|DECADIC|ABSORPTIVITY|ABSORPTION COEFFICIENT|EXTINCTION COEFFICIENT/.test(v) ||
    /^\(?[A-ZΜµ/ ]+\)?-1 ?\(?[A-Z]+\)?-1$/.test(v)
  );
}

/**
 * The most ordinates an ASDF body may decode to is EXPANSION_ALLOWANCE + EXPANSION_PER_BYTE × its bytes: a
 * repeat count (DUP) can otherwise make a file of a few hundred bytes hold millions of points. 65,536 covers a whole
 * high-resolution spectrum of constant value; real compressed data take 1–4 bytes per point (JCAMP-DX 4.24 DIFDUP,
 * common practice), far inside 16 points per byte.
 */
const EXPANSION_ALLOWANCE = 65_536;
const EXPANSION_PER_BYTE = 16;

function readBlock(
  block: JcampBlock,
  data: JcampRecord,
  lines: string[],
  options: ReadJcampDxOptions,
): ParsedSpectrum {
  const { file, maxPoints = 5_000_000 } = options;
  const warnings: ParseWarning[] = [];
  const meta = readMeta(block, lines);
  checkDataType(block, file, warnings);
  const xFactor = factorLabel(block, 'XFACTOR', file);
  const yFactor = factorLabel(block, 'YFACTOR', file);
  const nPoints = numberLabel(block, 'NPOINTS', file);
  const body = lines.slice(data.bodyStart, data.bodyEnd);
  const form = data.value.toUpperCase().replace(/\s+/g, '');
  const table = { block, data, body, file, maxPoints, xFactor, nPoints, warnings };
  let points: Points;
  if (data.label === 'XYDATA' && /^\(X\+\+\((Y\.\.Y|R\.\.R)\)\)$/.test(form)) points = xyDataPoints(table);
  else if (form === '(XY..XY)' || form === '(XYW..XYW)')
    points = xyPointsPoints(table, form === '(XY..XY)' ? 2 : 3);
  else {
    throw new BandshelfError(
      'BAD_FORMAT',
      `##${data.rawLabel}=${clip(data.value)} is not a variable list bandshelf reads ((X++(Y..Y)) or (XY..XY))`,
      { file, line: data.line, field: data.rawLabel },
    );
  }
  const yReal = realOrdinates(block, points.yRaw, yFactor, file, warnings);
  const { xs, ys, ls } = withoutMissing(points, yReal, warnings);
  const xUnit = options.xUnit ?? readXUnit(block, file, warnings);
  const yUnit = options.yUnit ?? readYUnit(block, ys, file, warnings);
  const converted = toWavenumberAbsorbance({ x: xs, y: ys }, { xUnit, yUnit, file, lines: ls });
  const { spectrum, warnings: pointWarnings } = spectrumFromPoints(converted, { file, lines: ls });
  warnings.push(...pointWarnings);
  const yUnitsText = inheritedRecord(block, 'YUNITS')?.value;
  if (yUnitsText && isAbsorbanceShaped(yUnitsText.toUpperCase().replace(/\s+/g, ' ').trim())) {
    meta.yUnitsText = yUnitsText.trim();
  }
  const parsed: ParsedSpectrum = { spectrum, meta, source: { format: 'jcamp-dx', xUnit, yUnit }, warnings };
  if (yUnit !== 'absorbance') {
    const { saturated, warning } = markSaturated(spectrum);
    if (saturated) parsed.saturated = saturated;
    if (warning) warnings.push(warning);
  }
  return parsed;
}

/** One data table as decoded: abscissae, raw ordinates (NaN for `?`) and the line of each point. */
interface Points {
  x: Float64Array;
  yRaw: Float64Array;
  pointLine: Uint32Array;
}

/** What the decoders of a data table read from. */
interface DataTable {
  block: JcampBlock;
  data: JcampRecord;
  body: string[];
  file: string | undefined;
  maxPoints: number;
  xFactor: number;
  nPoints: number | undefined;
  warnings: ParseWarning[];
}

/** Another spectroscopy named outright in ##DATA TYPE is refused; an unknown type and a newer version are warned of. */
function checkDataType(block: JcampBlock, file: string | undefined, warnings: ParseWarning[]): void {
  const dataType = (ownValue(block, 'DATATYPE') ?? '').toUpperCase();
  if (dataType !== '' && !/INFRARED|\bIR\b/.test(dataType)) {
    // Another spectroscopy named outright is refused: its axis would be misread as an infrared one.
    if (/UV|VIS|NMR|MASS|RAMAN|FLUORESCENCE|X-?RAY|CHROMATOGRAM/.test(dataType)) {
      throw new BandshelfError(
        'NOT_A_SPECTRUM',
        `##DATA TYPE=${clip(dataType)} is not an infrared spectrum; bandshelf reads infrared absorbance or transmittance only`,
        { file, line: ownRecord(block, 'DATATYPE')?.line, field: 'DATA TYPE' },
      );
    }
    warnings.push({
      line: ownRecord(block, 'DATATYPE')?.line,
      message: `##DATA TYPE=${clip(dataType)} is not an infrared spectrum; read all the same`,
    });
  }
  const version = ownValue(block, 'JCAMPDX') ?? inheritedRecord(block, 'JCAMPDX')?.value;
  if (version !== undefined && Number.parseFloat(version) >= 6) {
    warnings.push({
      message: `JCAMP-DX version ${clip(version)} is newer than 5.01; read by the 5.01 rules`,
    });
  }
}

/** `##XYDATA=(X++(Y..Y))`: the ASDF body, bounded against repeat counts, with the abscissae rebuilt from the labels. */
function xyDataPoints(table: DataTable): Points {
  const { block, data, body, file, maxPoints, xFactor, nPoints, warnings } = table;
  // A repeat count (DUP) turns a few bytes into many points: with NPOINTS declared, data that decode to far more
  // (4× + 4,096) are a stray count, refused before the points are built rather than after seconds of work.
  const declaredCap =
    nPoints !== undefined && Number.isInteger(nPoints) && nPoints > 0 ? 4 * nPoints + 4096 : maxPoints;
  // Whatever NPOINTS says, a body may not expand past a fixed allowance plus so many points per byte.
  let bodyBytes = 0;
  for (const line of body) bodyBytes += line.length + 1;
  const expansionCap = EXPANSION_ALLOWANCE + EXPANSION_PER_BYTE * bodyBytes;
  const cap = Math.min(maxPoints, declaredCap, expansionCap);
  const asdf = {
    file,
    firstLine: data.bodyStart + 1,
    maxPoints: cap,
    xHint: spacingHint(block, xFactor, file),
  };
  let decoded: ReturnType<typeof decodeAsdfLines>;
  try {
    decoded = decodeAsdfLines(body, asdf);
  } catch (error) {
    if (
      cap < maxPoints &&
      error instanceof BandshelfError &&
      /^the data hold more than/.test(error.message)
    ) {
      const why =
        cap === declaredCap
          ? `but NPOINTS=${nPoints} (a stray repeat count?)`
          : `from ${bodyBytes} bytes, more than ${EXPANSION_ALLOWANCE} + ${EXPANSION_PER_BYTE} per byte (a stray repeat count?)`;
      throw new BandshelfError('BAD_FORMAT', `the data decode to more than ${cap} points ${why}`, {
        file,
        line: error.line,
      });
    }
    throw error;
  }
  // The line X misled the Y-check call when NPOINTS disagrees; a reading that repeats a value as the check
  // and agrees with NPOINTS is the file's own (an extra point at the end is usually the last line's check).
  const declared = numberLabel(block, 'NPOINTS', file);
  if (declared !== undefined && decoded.y.length !== declared) {
    const again = decodeAsdfLines(body, { ...asdf, matchingValueIsCheck: true });
    if (again.y.length === declared) decoded = again;
  }
  warnings.push(...decoded.warnings);
  const yRaw = decoded.y;
  const pointLine = decoded.pointLine;
  if (yRaw.length === 0) {
    throw new BandshelfError('EMPTY_FILE', `##${data.rawLabel} holds no data`, { file, line: data.line });
  }
  const x = abscissae(block, decoded, xFactor, nPoints, warnings, file, data);
  return { x, yRaw, pointLine };
}

/** `##XYPOINTS=(XY..XY)` or `(XYW..XYW)`: explicit pairs (the weight column ignored). */
function xyPointsPoints(table: DataTable, columns: 2 | 3): Points {
  const { block, data, body, file, maxPoints, xFactor, nPoints, warnings } = table;
  const nPointsRec = ownRecord(block, 'NPOINTS');
  const decoded = decodeXyPairs(body, {
    file,
    firstLine: data.bodyStart + 1,
    columns,
    maxPoints,
  });
  const yRaw = decoded.y;
  const pointLine = decoded.pointLine;
  if (yRaw.length === 0) {
    throw new BandshelfError('EMPTY_FILE', `##${data.rawLabel} holds no data`, { file, line: data.line });
  }
  const x = new Float64Array(decoded.x.length);
  for (let i = 0; i < x.length; i++) x[i] = decoded.x[i]! * xFactor;
  if (nPoints !== undefined && nPoints !== yRaw.length) {
    warnings.push({
      line: nPointsRec?.line,
      message: `NPOINTS=${nPoints} but the data hold ${yRaw.length} points; the data were used`,
    });
  }
  return { x, yRaw, pointLine };
}

/** Ordinates × YFACTOR; FIRSTY is checked against the first ordinate in file order, before any reordering. */
function realOrdinates(
  block: JcampBlock,
  yRaw: Float64Array,
  yFactor: number,
  file: string | undefined,
  warnings: ParseWarning[],
): Float64Array {
  const firstY = numberLabel(block, 'FIRSTY', file);
  const yReal = new Float64Array(yRaw.length);
  let maxAbs = 0;
  for (let i = 0; i < yRaw.length; i++) {
    const v = yRaw[i]! * yFactor;
    yReal[i] = v;
    if (Number.isFinite(v) && Math.abs(v) > maxAbs) maxAbs = Math.abs(v);
  }
  if (firstY !== undefined && Number.isFinite(yReal[0]!)) {
    const tolerance = 1e-3 * maxAbs + Math.abs(yFactor);
    if (Math.abs(firstY - yReal[0]!) > tolerance) {
      warnings.push({
        line: ownRecord(block, 'FIRSTY')?.line,
        message: `FIRSTY=${firstY} but the first ordinate is ${yReal[0]}; the data were used`,
      });
    }
  }

  return yReal;
}

/** `?` ordinates keep their abscissa slot until here, then drop out with one warning naming their lines. */
function withoutMissing(
  points: Points,
  yReal: Float64Array,
  warnings: ParseWarning[],
): { xs: Float64Array; ys: Float64Array; ls: Uint32Array } {
  const { x, yRaw, pointLine } = points;
  let missing = 0;
  const missingLines: number[] = [];
  for (let i = 0; i < yReal.length; i++) {
    if (Number.isNaN(yRaw[i]!)) {
      missing++;
      const line = pointLine[i]!;
      if (missingLines.length < 10 && missingLines[missingLines.length - 1] !== line) missingLines.push(line);
    }
  }
  let xs = x;
  let ys = yReal;
  let ls = pointLine;
  if (missing > 0) {
    const keep = yReal.length - missing;
    xs = new Float64Array(keep);
    ys = new Float64Array(keep);
    ls = new Uint32Array(keep);
    let k = 0;
    for (let i = 0; i < yReal.length; i++) {
      if (Number.isNaN(yRaw[i]!)) continue;
      xs[k] = x[i]!;
      ys[k] = yReal[i]!;
      ls[k] = pointLine[i]!;
      k++;
    }
    warnings.push({
      line: missingLines[0],
      message: `${missing} missing ordinate${missing === 1 ? '' : 's'} (?) skipped, on line${missingLines.length === 1 ? '' : 's'} ${missingLines.join(', ')}${missingLines.length === 10 ? ' …' : ''}`,
    });
  }

  return { xs, ys, ls };
}

/** FIRSTX and the header's step in line units, for telling a Y check from a new point; undefined if unknown. */
function spacingHint(
  block: JcampBlock,
  xFactor: number,
  file: string | undefined,
): { first: number; step: number } | undefined {
  const first = numberLabel(block, 'FIRSTX', file);
  const last = numberLabel(block, 'LASTX', file);
  const n = numberLabel(block, 'NPOINTS', file);
  const delta = numberLabel(block, 'DELTAX', file);
  if (first === undefined) return undefined;
  const step = last !== undefined && n !== undefined && n > 1 ? (last - first) / (n - 1) : delta;
  return step === undefined ? undefined : { first: first / xFactor, step: step / xFactor };
}

/**
 * Abscissae from FIRSTX + i·ΔX. ΔX = (LASTX − FIRSTX)/(NPOINTS − 1) when NPOINTS agrees with the data; when
 * it does not, the X values written on the data lines decide (the data win over the header), then DELTAX.
 * Every line's X is checked against the abscissa of its first ordinate.
 */
function abscissae(
  block: JcampBlock,
  decoded: { y: Float64Array; lineX: Float64Array; lineFirstIndex: Int32Array; lineNumber: Uint32Array },
  xFactor: number,
  nPoints: number | undefined,
  warnings: ParseWarning[],
  file: string | undefined,
  data: JcampRecord,
): Float64Array {
  const count = decoded.y.length;
  const nLines = decoded.lineX.length;
  const lineXReal = new Float64Array(nLines);
  for (let k = 0; k < nLines; k++) lineXReal[k] = decoded.lineX[k]! * xFactor;
  const firstXLabel = numberLabel(block, 'FIRSTX', file);
  const lastX = numberLabel(block, 'LASTX', file);
  const deltaX = numberLabel(block, 'DELTAX', file);
  const firstX = firstXLabel ?? (nLines > 0 && decoded.lineFirstIndex[0] === 0 ? lineXReal[0]! : undefined);
  if (firstX === undefined) {
    throw new BandshelfError('BAD_FORMAT', 'the block has no ##FIRSTX and its first data line no x', {
      file,
      line: data.line,
    });
  }
  if (nPoints !== undefined && nPoints !== count) {
    warnings.push({
      line: ownRecord(block, 'NPOINTS')?.line,
      message: `NPOINTS=${nPoints} but the data hold ${count} points; the data were used`,
    });
  }
  const x = new Float64Array(count);
  if (count < 2) {
    x.fill(firstX);
    return x;
  }

  const fromLast = lastX === undefined ? undefined : (lastX - firstX) / (count - 1);
  let fromLines: number | undefined;
  for (let k = nLines - 1; k > 0; k--) {
    const di = decoded.lineFirstIndex[k]! - decoded.lineFirstIndex[0]!;
    if (di > 0) {
      fromLines = (lineXReal[k]! - lineXReal[0]!) / di;
      break;
    }
  }
  const agrees = (a: number, b: number | undefined): boolean =>
    b === undefined || Math.abs(a - b) <= 1e-3 * Math.abs(b);
  // NPOINTS that matches the data vouches for the header; without it, the header must agree with the lines.
  let delta: number;
  if (
    fromLast !== undefined &&
    (nPoints === count || (nPoints === undefined && agrees(fromLast, fromLines)))
  ) {
    delta = fromLast;
    if (deltaX !== undefined && !agrees(deltaX, fromLast)) {
      warnings.push({
        line: ownRecord(block, 'DELTAX')?.line,
        message: `DELTAX=${deltaX} disagrees with (LASTX − FIRSTX)/(NPOINTS − 1) = ${fromLast}; the latter was used`,
      });
    }
  } else if (deltaX !== undefined && agrees(deltaX, fromLines)) {
    delta = deltaX;
  } else if (fromLines !== undefined) {
    delta = fromLines;
    if (fromLast !== undefined || deltaX !== undefined) {
      warnings.push({
        line: data.line,
        message: `LASTX/DELTAX disagree with the x values on the data lines; the spacing ${fromLines} was taken from the lines`,
      });
    }
  } else if (fromLast !== undefined) {
    delta = fromLast;
  } else {
    throw new BandshelfError(
      'BAD_FORMAT',
      'cannot tell the x spacing: the block has no ##LASTX or ##DELTAX',
      {
        file,
        line: data.line,
      },
    );
  }
  for (let i = 0; i < count; i++) x[i] = firstX + i * delta;

  let off = 0;
  let firstOff: ParseWarning | undefined;
  const tolerance = 0.5 * Math.abs(delta);
  for (let k = 0; k < nLines; k++) {
    const expected = firstX + decoded.lineFirstIndex[k]! * delta;
    const got = lineXReal[k]!;
    if (Math.abs(got - expected) > tolerance + 1e-9 * Math.abs(expected)) {
      off++;
      firstOff ??= {
        line: decoded.lineNumber[k],
        message: `the line's x is ${got} where FIRSTX and the spacing put ${expected}`,
      };
    }
  }
  if (firstOff) {
    if (off > 1) firstOff.message += ` (${off} lines disagree)`;
    // Uneven x written one point per line is never spread evenly: each line gives its x outright.
    if (onePointPerLine(decoded.lineFirstIndex, count)) {
      warnings.push({
        line: firstOff.line,
        message: `${firstOff.message}: x is not evenly spaced, so the x written on each line was used`,
      });
      return lineXReal.slice();
    }
    // Several points per line: the header's spacing places them; real writers (and hand-edited files) write
    // line X values that stray by steps, so this stays a warning.
    warnings.push(firstOff);
  }
  return x;
}

function onePointPerLine(lineFirstIndex: Int32Array, count: number): boolean {
  if (lineFirstIndex.length !== count) return false;
  for (let k = 0; k < count; k++) if (lineFirstIndex[k] !== k) return false;
  return true;
}

const AFFN = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

function clip(text: string): string {
  return text.length > 40 ? `${text.slice(0, 40)}…` : text;
}
