// The plot colours: the Okabe–Ito palette (Okabe & Ito, "Color Universal Design", 2008), safe for colour-blind readers.

export interface OkabeItoOptions {
  /** Leave out black (for series drawn on a dark-text page where black reads as an axis).
   * @default false */
  withoutBlack?: boolean;
}

export function okabeIto(options: OkabeItoOptions = {}): string[] {
  // Ordered so the first few series differ most: blue, vermillion, bluish green, orange, reddish purple, sky blue.
  const colours = ['#0072B2', '#D55E00', '#009E73', '#E69F00', '#CC79A7', '#56B4E9', '#F0E442'];
  return options.withoutBlack ? colours : ['#000000', ...colours];
}
