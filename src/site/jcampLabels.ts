// Maps entry metadata onto the JCAMP-DX labels the writer carries (browser-safe).

export interface JcampLabelsOptions {
  /** `##ORIGIN` when the metadata names neither an origin nor a contributor.
   * @default 'bandshelf library' */
  origin?: string;
}

/**
 * ORIGIN and OWNER are required labels: the file's own, else the contributor, else the defaults. STATE falls back
 * to the sample form and SAMPLING PROCEDURE to the technique, which is what those labels describe.
 */
export function jcampLabels(
  meta: Record<string, unknown>,
  options: JcampLabelsOptions = {},
): Record<string, string | number | undefined> {
  const text = (v: unknown): string | undefined =>
    typeof v === 'string' && v !== '' ? v : typeof v === 'number' ? String(v) : undefined;
  const synonyms = Array.isArray(meta.synonyms) ? meta.synonyms.filter((s) => typeof s === 'string') : [];
  return {
    origin: text(meta.origin) ?? text(meta.contributor) ?? options.origin ?? 'bandshelf library',
    owner: text(meta.owner) ?? text(meta.contributor) ?? text(meta.licence),
    resolution: typeof meta.resolution === 'number' ? meta.resolution : undefined,
    state: text(meta.state) ?? text(meta.sampleForm),
    samplingProcedure: text(meta.samplingProcedure) ?? text(meta.technique),
    cas: text(meta.cas),
    formula: text(meta.formula),
    date: text(meta.date),
    names: synonyms.length > 0 ? synonyms.join('; ') : undefined,
  };
}
