// `bandshelf compare`: spectra (files or library entries) on the library grid, their correlation matrix and a plot.
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { describeIoError } from '../../library/store/describeIoError.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { recipeReferences } from '../../library/store/recipeReferences.js';
import { overlayPlotSpec } from '../../site/browser/overlayPlotSpec.js';
import { correlationMatrix } from '../../spectrum/correlationMatrix.js';
import { gridAxis } from '../../spectrum/gridAxis.js';
import { interpolateAtWavenumbers } from '../../spectrum/interpolateAtWavenumbers.js';
import { processSpectrum } from '../../spectrum/processSpectrum.js';
import type { CommandSpec } from '../command.js';
import { fileReadingOptions } from '../fileReadingOptions.js';
import { readingOptions } from '../readingOptions.js';
import { renderSvg } from '../renderSvg.js';
import { spectrumArgument } from '../spectrumArgument.js';
import { textTable } from '../textTable.js';

export const compareCommand: CommandSpec = {
  name: 'compare',
  summary: 'correlate spectra (files or library entries) on the library grid; overlay them in an SVG plot',
  example: [
    'bandshelf compare albumin-human igg-human serum-07.csv            # the correlation matrix',
    'bandshelf compare albumin-human@1 albumin-human@2 --plot overlay.svg',
    '',
    'Files are processed with the library’s recipe, entries keep their stored processed vectors; --original',
    'compares the originals interpolated onto the grid instead. r is Pearson’s correlation over the points both cover.',
  ].join('\n'),
  configure(command) {
    command
      .argument('<spectra...>', 'two or more spectrum files or library entries (id or id@revision)')
      .option('--library <path>', 'library file (its grid and recipe)', 'bandshelf.sqlite')
      .option('--at <tag>', 'take entry ids from this release')
      .option('--original', 'compare the original spectra, not the processed ones')
      .option('--plot <file.svg>', 'write an overlay plot as SVG')
      .option('--json', 'print the matrix as JSON');
    readingOptions(command);
  },
  async run(args, options, context) {
    const names = (args[0] as string[] | undefined) ?? [];
    if (names.length < 2) {
      throw new BandshelfError('BAD_OPTION', 'name at least two spectra to compare', { field: 'spectra' });
    }
    const read = fileReadingOptions(readingOptions(undefined, { flags: options }), { command: 'compare' });
    const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
    try {
      const at = typeof options.at === 'string' ? options.at : undefined;
      const { grid, recipe } = library;
      const axis = gridAxis(grid);
      const original = options.original === true;
      let references: ReturnType<typeof recipeReferences> | undefined;
      const spectra = names.map((name) =>
        spectrumArgument(name, {
          cwd: context.cwd,
          read,
          library: () => library,
          ...(at === undefined ? {} : { at }),
        }),
      );
      const vectors = spectra.map((s) => {
        if (original) return interpolateAtWavenumbers(s.original, axis, { maxGap: recipe.resample.maxGap });
        if (s.processed !== undefined) return s.processed;
        references ??= recipeReferences(library, recipe, at === undefined ? {} : { at });
        return processSpectrum(s.original, recipe, grid, {
          references,
          file: s.label,
          ...(s.saturated === undefined ? {} : { saturated: s.saturated }),
        }).processed;
      });
      const matrix = correlationMatrix(vectors);
      const basis = original ? 'original' : 'processed';
      const notes = spectra.flatMap((s) => s.warnings.map((w) => `${s.label}: ${w}`));
      if (typeof options.plot === 'string') {
        const svg = await renderSvg(
          overlayPlotSpec(
            { x: axis, series: spectra.map((s, i) => ({ label: s.label, y: Array.from(vectors[i]!) })) },
            { yTitle: original ? 'absorbance' : 'absorbance (processed)' },
          ),
        );
        try {
          writeFileSync(resolve(context.cwd, options.plot), svg);
        } catch (error) {
          throw new BandshelfError('IO_ERROR', `cannot write: ${describeIoError(error, { writing: true })}`, {
            file: options.plot,
            cause: error,
          });
        }
        notes.push(`plot written to ${options.plot}`);
      }
      const r = (v: number) => (Number.isFinite(v) ? v.toFixed(4) : '–');
      if (options.json) {
        const stdout = JSON.stringify({
          basis,
          grid,
          spectra: spectra.map((s) => ({ name: s.label, hash: s.hash })),
          matrix: matrix.map((row) => row.map((v) => (Number.isFinite(v) ? v : null))),
          plot: typeof options.plot === 'string' ? options.plot : null,
        });
        return { stdout, stderr: notes.join('\n'), exitCode: 0 };
      }
      const table = textTable(
        [
          ['', ...spectra.map((_, i) => `#${i + 1}`)],
          ...spectra.map((s, i) => [`#${i + 1} ${s.label}`, ...matrix[i]!.map(r)]),
        ],
        { right: spectra.map((_, i) => i + 1) },
      );
      const stdout = `Pearson r over the points both cover (${basis}, library grid ${grid.start}–${grid.stop} cm⁻¹ step ${grid.step})\n${table}`;
      return { stdout, stderr: notes.join('\n'), exitCode: 0 };
    } finally {
      closeLibrary(library);
    }
  },
};
