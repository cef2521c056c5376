// Reads a sidecar (or a `--meta` file) into its sections, adding the one key only the library uses: `read`, the
// reading options (units, JCAMP-DX block) that `export --all` records so a re-add parses the bytes the same way.
import { z } from 'zod';
import { readSidecarSections, type SidecarSections } from '../../formats/readSidecarSections.js';
import { X_UNITS, Y_UNITS } from '../../formats/types.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import type { ReadOptions } from '../types.js';

const readOptionsSchema = z
  .object({
    xUnit: z.enum(X_UNITS).optional(),
    yUnit: z.enum(Y_UNITS).optional(),
    block: z.number().int().positive().optional(),
    column: z.union([z.string().min(1), z.number().int().positive()]).optional(),
    timeUnit: z.enum(['fs', 'ps']).optional(),
  })
  .strict();

export interface LoadedSidecar extends SidecarSections {
  read?: ReadOptions;
}

export interface LoadSidecarOptions {
  /** The sidecar as the user named it, for errors.
   * @default undefined */
  file?: string;
}

export function loadSidecar(text: string, options: LoadSidecarOptions = {}): LoadedSidecar {
  let parsed: unknown;
  try {
    parsed = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch {
    // Let the sidecar reader produce its error (it names the line).
    return readSidecarSections(text, options);
  }
  if (parsed === null || typeof parsed !== 'object' || Array.isArray(parsed) || !('read' in parsed)) {
    return readSidecarSections(text, options);
  }
  const { read, ...rest } = parsed as Record<string, unknown>;
  const checked = readOptionsSchema.safeParse(read);
  if (!checked.success) {
    throw metaErrorFromIssues(checked.error.issues, {
      file: options.file,
      prefix: 'read',
      code: 'BAD_METADATA',
      knownFields: ['xUnit', 'yUnit', 'block', 'column', 'timeUnit'],
    });
  }
  const sections = readSidecarSections(JSON.stringify(rest), options);
  const out: LoadedSidecar = { ...sections };
  const readOptions: ReadOptions = {};
  if (checked.data.xUnit) readOptions.xUnit = checked.data.xUnit;
  if (checked.data.yUnit) readOptions.yUnit = checked.data.yUnit;
  if (checked.data.block) readOptions.block = checked.data.block;
  if (checked.data.column !== undefined) readOptions.column = checked.data.column;
  if (checked.data.timeUnit) readOptions.timeUnit = checked.data.timeUnit;
  out.read = readOptions;
  return out;
}
