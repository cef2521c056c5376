// The one wording for a library file SQLite finds damaged: what was seen, how to verify, how to restore.
export function damagedLibraryAdvice(seen: string): string {
  return `the library file is damaged (${seen}); verify it with \`bandshelf check\` and restore it from a backup made by \`bandshelf backup\` (copy the backup over the damaged file)`;
}
