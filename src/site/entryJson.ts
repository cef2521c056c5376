// The JSON download of an entry: the entry's one JSON form (`entryDocument`, as `bandshelf show ID --json`
// prints it) with the processed vector named, not inlined.
import { entryDocument } from '../library/store/entryDocument.js';
import type { SiteEntryDetail } from './types.js';

export interface EntryJsonOptions {
  /** File name of the processed vector written beside the JSON.
   * @default `${id}.processed.f32` */
  processedFile?: string;
}

export function entryJson(detail: SiteEntryDetail, options: EntryJsonOptions = {}): string {
  const s = detail.summary;
  const document = entryDocument(
    {
      ...detail,
      id: s.id,
      revision: s.revision,
      reviewState: s.reviewState,
      createdAt: s.createdAt,
      meta: s.meta,
    },
    { processedFile: options.processedFile ?? `${s.id}.processed.f32` },
  );
  return `${JSON.stringify(document)}\n`;
}
