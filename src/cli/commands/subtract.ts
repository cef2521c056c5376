// `bandshelf subtract`: a difference spectrum, unknown − scale × reference, written as CSV or JCAMP-DX.
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { writeCsv } from '../../formats/writeCsv.js';
import { writeJcampDx } from '../../formats/writeJcampDx.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { describeIoError } from '../../library/store/describeIoError.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import type { Library } from '../../library/types.js';
import { subtractScaled } from '../../spectrum/subtractScaled.js';
import type { CommandSpec } from '../command.js';
import { fileReadingOptions } from '../fileReadingOptions.js';
import { parseWindow } from '../parseWindow.js';
import { readingOptions } from '../readingOptions.js';
import { spectrumArgument } from '../spectrumArgument.js';

function scaleOf(text: string): 'auto' | number {
  if (text === 'auto') return 'auto';
  const k = Number(text);
  if (text.trim() === '' || !Number.isFinite(k)) {
    throw new BandshelfError('BAD_OPTION', `--scale takes auto or a number, not '${text}'`, {
      field: 'scale',
    });
  }
  return k;
}

export const subtractCommand: CommandSpec = {
  name: 'subtract',
  summary: 'subtract a scaled reference (file or library entry) from a spectrum; write the difference',
  example: [
    'bandshelf subtract plasma-07.csv water-liquid --out plasma-07-dry.jdx     # scale fitted over 2300–1900 cm⁻¹',
    'bandshelf subtract film.csv buffer.csv --scale 0.85 --out film-minus-buffer.csv',
    '',
    'The scale is fitted by least squares over --window with an offset and a slope (only scale × reference is',
    'subtracted); its standard error assumes independent residuals, a lower bound on real spectra. The output is',
    'on the unknown’s own wavenumbers where the reference covers them, with the operation in its header, ready',
    'for `match` or `identify`. A REFERENCE that is not a file is a library entry (id or id@revision).',
  ].join('\n'),
  configure(command) {
    command
      .argument('<unknown>', 'the spectrum file to subtract from')
      .argument('<reference>', 'a spectrum file or a library entry id (id@revision for a given revision)')
      .option('--scale <auto|k>', 'fit the scale in the window, or use this factor', 'auto')
      .option('--window <high:low>', 'where the scale is fitted, cm⁻¹', '2300:1900')
      .option(
        '--out <file>',
        'write here (.jdx/.dx: JCAMP-DX, otherwise CSV); default: CSV on standard output',
      )
      .option('--library <path>', 'library file for an entry id', 'bandshelf.sqlite')
      .option('--at <tag>', 'take an entry id from this release')
      .option('--json', 'print the fitted scale and what was written as JSON');
    readingOptions(command);
  },
  async run(args, options, context) {
    const scale = scaleOf(String(options.scale ?? 'auto'));
    const window = parseWindow(String(options.window ?? '2300:1900'), {
      flag: 'window',
      example: '2300:1900',
    });
    const read = fileReadingOptions(readingOptions(undefined, { flags: options }), { command: 'subtract' });
    let opened: Library | undefined;
    const library = () => {
      opened ??= openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
      return opened;
    };
    try {
      const at = typeof options.at === 'string' ? options.at : undefined;
      const unknown = spectrumArgument(String(args[0]), { cwd: context.cwd, read });
      const reference = spectrumArgument(String(args[1]), {
        cwd: context.cwd,
        read,
        library,
        ...(at === undefined ? {} : { at }),
      });
      const result = subtractScaled(unknown.original, reference.original, {
        scale,
        window,
        file: unknown.label,
      });
      const scaleText =
        result.standardError === null
          ? `scale ${result.scale} (given)`
          : `scale ${result.scale.toPrecision(6)} ± ${result.standardError.toPrecision(2)} (least squares over ` +
            `${window.max}–${window.min} cm⁻¹ with an offset and a slope, ${result.points} points; the SE ` +
            'assumes independent residuals)';
      const operation = [
        `bandshelf subtract: ${unknown.label} − scale × ${reference.label}`,
        scaleText,
        `unknown sha256 ${unknown.hash}`,
        `reference ${reference.processed === undefined ? 'sha256' : 'content hash'} ${reference.hash}`,
      ];
      const out = typeof options.out === 'string' ? options.out : undefined;
      const jcamp = out !== undefined && /\.(jdx|dx|jcamp)$/i.test(out);
      const text = jcamp
        ? writeJcampDx(result.spectrum, {
            title: `${unknown.label} minus ${result.scale.toPrecision(6)} x ${reference.label}`,
            comments: operation,
          })
        : `${operation.map((l) => `# ${l}`).join('\n')}\n${writeCsv(result.spectrum)}`;
      if (out !== undefined) {
        try {
          writeFileSync(resolve(context.cwd, out), text);
        } catch (error) {
          throw new BandshelfError('IO_ERROR', `cannot write: ${describeIoError(error, { writing: true })}`, {
            file: out,
            cause: error,
          });
        }
      }
      const warnings = [...unknown.warnings, ...reference.warnings];
      if (options.json) {
        const stdout = JSON.stringify({
          unknown: { file: unknown.label, hash: unknown.hash },
          reference: { name: reference.label, hash: reference.hash },
          scale: result.scale,
          standardError: result.standardError,
          window: result.standardError === null ? null : window,
          points: result.points,
          out: out ?? null,
          format: out === undefined ? null : jcamp ? 'jcamp-dx' : 'csv',
          operation,
        });
        return { stdout, stderr: warnings.join('\n'), exitCode: 0 };
      }
      if (out === undefined)
        return { stdout: text.trimEnd(), stderr: [scaleText, ...warnings].join('\n'), exitCode: 0 };
      return { stdout: `${scaleText}\nwritten to ${out}`, stderr: warnings.join('\n'), exitCode: 0 };
    } finally {
      if (opened !== undefined) closeLibrary(opened);
    }
  },
};
