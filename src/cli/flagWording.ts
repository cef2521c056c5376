// The library names options by their API names in backticks (`force`); the CLI says the flag a user types instead.

const FLAGS: Record<string, string> = {
  force: '--force',
  atomic: '--atomic',
  recipe: '--recipe',
  block: '--block',
  column: '--column',
  xUnit: '--x-unit',
  yUnit: '--y-unit',
  timeDomain: '--time-domain',
  references: '--reference',
  'meta.id': '--id',
  maxFileBytes: '--max-file-size (in MB)',
  nearDuplicateThreshold: '--near-duplicate',
  with: '--with',
};

/** `text` with each backticked API option name that has a flag replaced by that flag. */
export function flagWording(text: string): string {
  return text.replace(/`([A-Za-z.]+)`/g, (whole, name: string) => FLAGS[name] ?? whole);
}
