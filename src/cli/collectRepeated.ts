// The commander argument parser for a repeatable option: each use appends its value to the list so far.

/** Shaped as commander calls an option parser (value, previous value); the previous list is never mutated. */
export function collectRepeated(value: string, previous: string[] = []): string[] {
  return [...previous, value];
}
