// Reads a bundle file (gzip-compressed JSON, or plain JSON) and validates it against the bundle schema; any
// problem is one BAD_FORMAT error naming the file.
import { gunzipSync } from 'node:zlib';
import { BandshelfError } from '../../error.js';
import { BUNDLE_FORMAT, BUNDLE_VERSION, type Bundle, bundleSchema } from '../../schema/bundle.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import { readRegularFile } from './readRegularFile.js';

export interface ReadBundleFileOptions {
  /** The file as the user named it, for errors.
   * @default the path */
  label?: string;
  /** Largest bundle accepted, bytes (compressed).
   * @default 1 GiB */
  maxFileBytes?: number;
}

export function readBundleFile(path: string, options: ReadBundleFileOptions = {}): Bundle {
  const file = options.label ?? path;
  const bytes = readRegularFile(path, { label: file, maxFileBytes: options.maxFileBytes ?? 2 ** 30 });
  let document: unknown;
  try {
    const text = bytes[0] === 0x1f && bytes[1] === 0x8b ? gunzipSync(bytes) : Buffer.from(bytes);
    document = JSON.parse(text.toString('utf8'));
  } catch (error) {
    throw new BandshelfError(
      'BAD_FORMAT',
      'not a bandshelf bundle (neither gzip-compressed nor plain JSON)',
      {
        file,
        cause: error,
      },
    );
  }
  const head = document as { format?: unknown; version?: unknown } | null;
  if (head === null || typeof head !== 'object' || head.format !== BUNDLE_FORMAT) {
    throw new BandshelfError('BAD_FORMAT', `not a bandshelf bundle (no "format": "${BUNDLE_FORMAT}")`, {
      file,
    });
  }
  if (head.version !== BUNDLE_VERSION) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `bundle version ${String(head.version)}; this bandshelf reads version ${BUNDLE_VERSION} (upgrade bandshelf)`,
      { file, field: 'version' },
    );
  }
  const parsed = bundleSchema.safeParse(document);
  if (!parsed.success) {
    throw metaErrorFromIssues(parsed.error.issues, {
      code: 'BAD_FORMAT',
      file,
      lead: 'bad bundle',
      knownFields: Object.keys(bundleSchema.shape),
    });
  }
  return parsed.data;
}
