// The URL fragment of a release on the releases page, the same wherever a page links to it.

export interface ReleaseAnchorOptions {
  /** Prefix of the fragment.
   * @default 'release-' */
  prefix?: string;
}

/** Tags are free text; the fragment keeps letters, digits, `-`, `_` and `.` and turns anything else into `_`. */
export function releaseAnchor(tag: string, options: ReleaseAnchorOptions = {}): string {
  return `${options.prefix ?? 'release-'}${tag.replace(/[^A-Za-z0-9._-]/g, '_')}`;
}
