// The sidecar naming rule, `serum-07.csv` → `serum-07.meta.json`, so `add DIR` pairs data and metadata.

export interface SidecarNameForOptions {
  /**
   * What replaces the data file's extension.
   * @default '.meta.json'
   */
  suffix?: string;
}

/**
 * The sidecar file name for a data file: its last extension replaced by `.meta.json`. Any folder part of the
 * name is kept (either separator), and a name without an extension (or a dotfile such as `.hidden`) just
 * gains the suffix.
 */
export function sidecarNameFor(dataFileName: string, options: SidecarNameForOptions = {}): string {
  const suffix = options.suffix ?? '.meta.json';
  const slash = Math.max(dataFileName.lastIndexOf('/'), dataFileName.lastIndexOf('\\'));
  const folder = dataFileName.slice(0, slash + 1);
  const base = dataFileName.slice(slash + 1);
  const dot = base.lastIndexOf('.');
  const stem = dot > 0 ? base.slice(0, dot) : base;
  return `${folder}${stem}${suffix}`;
}
