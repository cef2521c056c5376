// Makes an entry's CSV or JCAMP-DX download from its JSON download, with the same writers `bandshelf export` uses.
import { writeCsv } from '../../formats/writeCsv.js';
import { writeJcampDx } from '../../formats/writeJcampDx.js';
import { jcampLabels } from '../jcampLabels.js';
import type { EntryDocument } from '../types.js';

export interface EntryDownloadOptions {
  /** Base of the file name.
   * @default document.id */
  name?: string;
}

export interface EntryDownloadFile {
  file: string;
  type: string;
  text: string;
}

/**
 * Both formats carry the original spectrum with every point (cm⁻¹ ascending, absorbance): CSV at full double
 * precision, JCAMP-DX 4.24 in DIFDUP form. The site publishes one copy of the data (the JSON) and derives these on
 * request, so a large library's site does not hold three copies of every spectrum.
 */
export function entryDownload(
  document: EntryDocument,
  format: 'csv' | 'jcamp-dx',
  options: EntryDownloadOptions = {},
): EntryDownloadFile {
  const name = options.name ?? document.id;
  const spectrum = {
    wavenumber: Float64Array.from(document.original.x),
    absorbance: Float64Array.from(document.original.y),
  };
  if (format === 'csv') return { file: `${name}.csv`, type: 'text/csv', text: writeCsv(spectrum) };
  const title = typeof document.meta.name === 'string' ? document.meta.name : document.id;
  return {
    file: `${name}.jdx`,
    type: 'chemical/x-jcamp-dx',
    text: writeJcampDx(spectrum, { form: 'difdup', title, meta: jcampLabels(document.meta) }),
  };
}
