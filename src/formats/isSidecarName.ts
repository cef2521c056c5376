// Tells a metadata sidecar from a data file by name, so `add DIR` skips sidecars instead of reading them.

export interface IsSidecarNameOptions {
  /**
   * The sidecar suffix (compared without regard to case).
   * @default '.meta.json'
   */
  suffix?: string;
}

/** True for names ending in `.meta.json` (any case, any folder part). */
export function isSidecarName(fileName: string, options: IsSidecarNameOptions = {}): boolean {
  const suffix = (options.suffix ?? '.meta.json').toLowerCase();
  const lower = fileName.toLowerCase();
  const base = lower.slice(Math.max(lower.lastIndexOf('/'), lower.lastIndexOf('\\')) + 1);
  return base.length > suffix.length && base.endsWith(suffix);
}
