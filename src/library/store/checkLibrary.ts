// Verifies a library end to end: SQLite integrity, immutability triggers, every stored hash, and that every
// revision's original and processed vector can be re-derived from its files and recipe.
import { errorLine } from '../../error.js';
import { bandAssignmentSchema } from '../../schema/bandAssignment.js';
import { entryMetaSchema } from '../../schema/meta.js';
import { recipeSchema } from '../../schema/recipe.js';
import { gridLength } from '../../spectrum/gridLength.js';
import { blobFloat32 } from '../codecs/blobFloat32.js';
import { blobFloat64 } from '../codecs/blobFloat64.js';
import { blobPeaks } from '../codecs/blobPeaks.js';
import type { SourceFile } from '../ingest/ingestTypes.js';
import { processOriginal } from '../ingest/processOriginal.js';
import type { CheckProblem, Library, ReadOptions } from '../types.js';
import { contentHashes } from './contentHashes.js';
import { gridAxisMemo } from './gridAxisMemo.js';
import { IMMUTABILITY_TRIGGERS } from './migrateLibrary.js';
import { readOriginals } from './readOriginals.js';
import { recordHash } from './recordHash.js';
import type { RevisionFileRow, RevisionRow } from './rowTypes.js';
import { type SealChains, sealChains } from './sealChains.js';
import { sha256Hex } from './sha256Hex.js';
import { TABLES_OF_RECORD, tableDigests } from './tableDigests.js';

export interface CheckLibraryOptions {
  /** Largest difference allowed between a stored and a recomputed processed value, relative to the vector's
   * largest magnitude (stored vectors are Float32, so 1e-6 leaves room only for rounding).
   * @default 1e-6 */
  tolerance?: number;
  /** Called after each revision. */
  progress?: (done: number, total: number, label: string) => void;
}

export function checkLibrary(library: Library, options: CheckLibraryOptions = {}): CheckProblem[] {
  const db = library.db;
  const tolerance = options.tolerance ?? 1e-6;
  const problems: CheckProblem[] = [];
  const add = (where: string, problem: string) => problems.push({ where, problem });

  let integrity: string[];
  try {
    integrity = db.prepare('PRAGMA integrity_check').pluck().all() as string[];
  } catch (error) {
    add('database', `integrity check could not run: ${errorLine(error, { internal: false })}`);
    return problems;
  }
  if (!(integrity.length === 1 && integrity[0] === 'ok')) {
    for (const line of integrity.slice(0, 20)) add('database', `integrity check: ${line}`);
    // A damaged file can make every further read misleading; report what SQLite says and stop.
    return problems;
  }
  for (const fk of db.prepare('PRAGMA foreign_key_check').all() as {
    table: string;
    rowid: number;
    parent: string;
  }[]) {
    add(`table ${fk.table}`, `row ${fk.rowid} points to a missing ${fk.parent} row`);
  }
  const triggers = new Set(
    db.prepare("SELECT name FROM sqlite_schema WHERE type = 'trigger'").pluck().all() as string[],
  );
  for (const name of IMMUTABILITY_TRIGGERS) {
    if (!triggers.has(name)) add('database', `the immutability trigger ${name} is missing`);
  }

  const seal = db.prepare('SELECT digests, created_at FROM seals ORDER BY key DESC LIMIT 1').get() as
    | { digests: string; created_at: string }
    | undefined;
  if (seal === undefined)
    add('database', 'the library has no seal (its tables cannot be verified as a whole)');
  else {
    // A chained seal is checked against chains recomputed over every row; an older seal holds whole-table digests.
    const parsed = JSON.parse(seal.digests) as { chains?: SealChains } & Record<string, unknown>;
    const sealed = parsed.chains
      ? Object.fromEntries(Object.entries(parsed.chains).map(([t, c]) => [t, c.digest]))
      : (parsed as Record<string, unknown>);
    const now = parsed.chains
      ? Object.fromEntries(Object.entries(sealChains(db)).map(([t, c]) => [t, c.digest]))
      : tableDigests(db);
    for (const table of TABLES_OF_RECORD) {
      if (sealed[table] !== now[table]) {
        add(
          `table ${table}`,
          `rows were changed, deleted or replaced outside bandshelf since its last write (${seal.created_at})`,
        );
      }
    }
  }

  for (const f of db.prepare('SELECT sha256, bytes FROM files').iterate() as Iterable<{
    sha256: string;
    bytes: Buffer;
  }>) {
    const actual = sha256Hex(f.bytes);
    if (actual !== f.sha256)
      add(`file ${f.sha256.slice(0, 12)}`, `stored bytes hash to ${actual.slice(0, 12)}…`);
  }

  const cols = gridLength(library.grid);
  const axis = gridAxisMemo(library.grid);
  const total = (db.prepare('SELECT count(*) FROM revisions').pluck().get() as number) ?? 0;
  const filesOf = db.prepare(
    `SELECT f.position, f.role, f.name, f.sha256, b.bytes FROM revision_files f
     LEFT JOIN files b ON b.sha256 = f.sha256 WHERE f.revision_key = ? ORDER BY f.position`,
  );
  let done = 0;
  let lastEntry = '';
  let expected = 1;
  for (const row of db
    .prepare('SELECT * FROM revisions ORDER BY entry_id, revision')
    .iterate() as Iterable<RevisionRow>) {
    const where = `${row.entry_id} revision ${row.revision}`;
    if (row.entry_id !== lastEntry) {
      lastEntry = row.entry_id;
      expected = 1;
    }
    if (row.revision !== expected)
      add(where, `revision numbers jump from ${expected - 1} to ${row.revision}`);
    expected = row.revision + 1;
    try {
      checkRevision(row, where);
    } catch (error) {
      add(where, `cannot be verified: ${errorLine(error, { internal: false })}`);
    }
    done++;
    options.progress?.(done, total, row.entry_id);
  }

  for (const m of db
    .prepare(
      `SELECT m.tag, m.entry_id, r.entry_id AS revision_entry FROM release_members m
       JOIN revisions r ON r.key = m.revision_key WHERE m.entry_id != r.entry_id`,
    )
    .all() as { tag: string; entry_id: string; revision_entry: string }[]) {
    add(`release ${m.tag}`, `member ${m.entry_id} points to a revision of ${m.revision_entry}`);
  }
  for (const a of db.prepare('SELECT key, row FROM band_assignments').all() as {
    key: number;
    row: string;
  }[]) {
    try {
      const parsed = bandAssignmentSchema.safeParse(JSON.parse(a.row));
      if (!parsed.success) add(`band assignment ${a.key}`, parsed.error.issues[0]?.message ?? 'invalid row');
    } catch (error) {
      add(`band assignment ${a.key}`, `unreadable: ${errorLine(error, { internal: false })}`);
    }
  }
  return problems;

  function checkRevision(row: RevisionRow, where: string): void {
    const files = filesOf.all(row.key) as (RevisionFileRow & { bytes: Buffer | null })[];
    if (recordHash(row, files) !== row.record_hash) {
      add(where, 'the stored record does not match its record hash (a value was changed outside bandshelf)');
    }
    const meta = entryMetaSchema.safeParse(JSON.parse(row.meta));
    if (!meta.success) add(where, `metadata no longer valid: ${meta.error.issues[0]?.path.join('.')}`);
    else if (meta.data.id !== row.entry_id)
      add(where, `metadata id '${meta.data.id}' differs from the entry id`);
    const recipeParsed = recipeSchema.safeParse(JSON.parse(row.recipe));
    if (!recipeParsed.success) {
      add(where, `recipe no longer valid: ${recipeParsed.error.issues[0]?.path.join('.')}`);
      return;
    }
    const recipe = recipeParsed.data;
    const read = JSON.parse(row.read_options) as ReadOptions;
    const missing = files.filter((f) => f.bytes === null);
    if (missing.length > 0) {
      add(where, `file ${missing[0]!.name} is missing`);
      return;
    }
    const hashes = contentHashes({ files, read, recipe: JSON.parse(row.recipe), meta: JSON.parse(row.meta) });
    if (hashes.data !== row.data_hash)
      add(where, 'the data hash does not match the stored files and read options');
    if (hashes.content !== row.content_hash)
      add(where, 'the content hash does not match data, recipe and metadata');

    const x = blobFloat64(row.original_x, { what: 'original_x' });
    const y = blobFloat64(row.original_y, { what: 'original_y' });
    if (x.length !== y.length) add(where, `original x and y differ in length (${x.length}, ${y.length})`);
    const sources: SourceFile[] = files.map((f) => ({
      role: f.role,
      name: f.name,
      bytes: new Uint8Array(f.bytes!),
    }));
    const derived = readOriginals(
      { files: sources, read, recipe },
      // The stored bytes passed the size limit in force when they were added (it may have been raised).
      { label: files[0]?.name, maxBytes: Number.POSITIVE_INFINITY },
    );
    const again = derived[0];
    if (derived.length !== 1 || again === undefined) {
      add(where, `its files yield ${derived.length} spectra, not one`);
    } else {
      const s = again.spectrum;
      if (s.wavenumber.length !== x.length) {
        add(where, `the original has ${x.length} points but its file gives ${s.wavenumber.length}`);
      } else {
        for (let i = 0; i < x.length; i++) {
          const dx = Math.abs(s.wavenumber[i]! - x[i]!);
          const dy = Math.abs(s.absorbance[i]! - y[i]!);
          if (!(dx <= 1e-9 * Math.abs(x[i]!)) || !(dy <= 1e-9 * Math.max(1, Math.abs(y[i]!)))) {
            add(
              where,
              `original point ${i} (${x[i]} cm⁻¹, ${y[i]}) differs from its file (${s.wavenumber[i]}, ${s.absorbance[i]})`,
            );
            break;
          }
        }
      }
    }

    const stored = blobFloat32(row.processed, { what: 'the processed vector' });
    if (stored.length !== cols) {
      add(where, `the processed vector has ${stored.length} values; the grid has ${cols}`);
      return;
    }
    const recomputed = processOriginal(library, { wavenumber: x, absorbance: y }, recipe, {
      file: where,
      ...(again?.saturated === undefined ? {} : { saturated: again.saturated }),
    });
    // The stored vector is Float32: compare with the recomputation rounded the same way, so values that underflow
    // to zero or a subnormal on storage (a file scaled by 1e-300) compare equal rather than fail forever.
    const rounded = Float64Array.from(recomputed.processed, Math.fround);
    let scale = 0;
    for (const v of recomputed.processed) if (Number.isFinite(v) && Math.abs(v) > scale) scale = Math.abs(v);
    let scale32 = 0;
    for (const v of rounded) if (Number.isFinite(v) && Math.abs(v) > scale32) scale32 = Math.abs(v);
    let covered = 0;
    for (let i = 0; i < cols; i++) {
      const a = stored[i]!;
      const b = rounded[i]!;
      if (!Number.isNaN(a)) covered++;
      if (Number.isNaN(a) !== Number.isNaN(b)) {
        add(where, `processed value at ${axis[i]} cm⁻¹ is ${a} but recomputes to ${b} (coverage differs)`);
        return;
      }
      if (!Number.isNaN(a) && !(a === b || Math.abs(a - b) <= tolerance * scale32)) {
        add(where, `processed value at ${axis[i]} cm⁻¹ is ${a} but recomputes to ${b}`);
        return;
      }
    }
    if (covered !== row.covered_points) {
      add(where, `covered_points says ${row.covered_points}; the vector covers ${covered}`);
    }
    const peaks = blobPeaks(row.peaks);
    const fresh = recomputed.peaks;
    if (peaks.length !== fresh.length) {
      add(where, `${peaks.length} peaks are stored but ${fresh.length} recompute`);
      return;
    }
    const sorted = [...fresh].sort((p, q) => p.position - q.position);
    for (let i = 0; i < peaks.length; i++) {
      const p = peaks[i]!;
      const q = sorted[i]!;
      if (
        !(Math.abs(p.position - q.position) <= 1e-6) ||
        !(Math.abs(p.height - q.height) <= tolerance * scale)
      ) {
        add(where, `stored peak at ${p.position} cm⁻¹ recomputes at ${q.position} cm⁻¹`);
        return;
      }
    }
  }
}
