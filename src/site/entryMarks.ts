// The cautions a hit carries beside its name: an entry not yet reviewed, or processed with a recipe of its own.

export interface EntryMarksOptions {
  /** The entry's newest review decision ('draft', 'reviewed', 'rejected').
   * @default 'reviewed' (no mark) */
  reviewState?: string;
  /** The entry was processed with its own recipe, not the library's default.
   * @default false */
  ownRecipe?: boolean;
}

/** Empty for a reviewed entry on the library's recipe. */
export function entryMarks(options: EntryMarksOptions = {}): string[] {
  const marks: string[] = [];
  const state = options.reviewState ?? 'reviewed';
  if (state !== 'reviewed') marks.push(state);
  if (options.ownRecipe) marks.push('recipe differs');
  return marks;
}
