// Lays out rows as a plain-text table with aligned columns, for the terminal output of listing commands.

export interface TextTableOptions {
  /** Column indexes to right-align (numbers).
   * @default [] */
  right?: number[];
}

export function textTable(rows: readonly (readonly string[])[], options: TextTableOptions = {}): string {
  const right = new Set(options.right ?? []);
  const widths: number[] = [];
  for (const row of rows) {
    row.forEach((cell, i) => {
      widths[i] = Math.max(widths[i] ?? 0, [...cell].length);
    });
  }
  return rows
    .map((row) =>
      row
        .map((cell, i) => {
          const pad = ' '.repeat((widths[i] ?? 0) - [...cell].length);
          return right.has(i) ? pad + cell : i === row.length - 1 ? cell : cell + pad;
        })
        .join('  ')
        .trimEnd(),
    )
    .join('\n');
}
