// `bandshelf site`: builds the static, offline website of the library and its match reports.
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { MATCH_CAUTION } from '../../schema/matchReport.js';
import { buildSite } from '../../site/buildSite.js';
import { collectSiteData } from '../../site/collectSiteData.js';
import { readReports } from '../../site/readReports.js';
import type { CommandSpec } from '../command.js';

/** The site's caution: the match reports' own, plus that bandshelf is not a diagnostic device. */
const CAUTION = `${MATCH_CAUTION} bandshelf is not a diagnostic device.`;

function megabytes(bytes: number): string {
  return (bytes / (1024 * 1024)).toFixed(bytes < 10 * 1024 * 1024 ? 2 : 1);
}

export const siteCommand: CommandSpec = {
  name: 'site',
  summary: 'build the static, offline website of the library and its match reports',
  example: [
    'bandshelf site --out public/',
    'bandshelf site --at 2026.1 --reports reports/ --out /srv/www/spectra --base /spectra/',
    'bandshelf site --reports reports/ --redact --out public/   # reports name each unknown by its SHA-256 only',
    'bandshelf site --out public/ --clean        # empty a folder holding files of its own first',
    '',
    'Serve the folder with any static web server, e.g. `npx @11ty/eleventy-dev-server --dir public`',
    'or `python3 -m http.server -d public -b 127.0.0.1`, and open the address it prints.',
  ].join('\n'),
  configure(command) {
    command
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--at <tag>', 'publish the state a release froze (default: the working state)')
      .option(
        '--reports <dir>',
        'a folder of match and contrast reports (JSON from `match --report DIR`, `contrast --report DIR`)',
      )
      .requiredOption(
        '--out <dir>',
        'the output folder (created; refused if it holds files the build did not make)',
      )
      .option('--redact', "withhold the unknowns' file names and titles from the reports (SHA-256 only)")
      .option('--base <path>', 'path prefix the site is served under, e.g. /spectra/', '/')
      .option('--clean', 'empty the output folder first even if it holds other files')
      .option('--json', 'print {out, files, bytes, entries, reports, pathPrefix} as JSON');
  },
  async run(_args, options, context) {
    if (typeof options.out !== 'string' || options.out.trim() === '') {
      throw new BandshelfError('BAD_OPTION', 'name the output folder with --out DIR', { field: '--out' });
    }
    const path = libraryPath(options.library, context.cwd);
    // Reports are validated first: a bad one stops the build before anything is written.
    const { reports, contrasts } =
      typeof options.reports === 'string'
        ? readReports(resolve(context.cwd, options.reports), { shownAs: options.reports })
        : { reports: [], contrasts: [] };
    const library = openLibrary(path, { readonly: true });
    try {
      const source = collectSiteData(library, {
        at: typeof options.at === 'string' ? options.at : undefined,
      });
      const built = await buildSite(source, {
        out: options.out,
        base: typeof options.base === 'string' ? options.base : '/',
        clean: options.clean === true,
        reports,
        contrasts,
        redact: options.redact === true,
        protect: [path, `${path}.cache`],
        cwd: context.cwd,
        caution: CAUTION,
        version: 'bandshelf 0.1.0',
        progress: context.progress,
      });
      if (options.json) {
        return { stdout: JSON.stringify(built), exitCode: 0 };
      }
      const lines = [
        `site written to ${built.out}: ${built.entries} entr${built.entries === 1 ? 'y' : 'ies'}, ${built.reports} report${built.reports === 1 ? '' : 's'}, ${built.files} files, ${megabytes(built.bytes)} MB`,
        source.entries.length === 0 ? 'the library has no entries: the site says so' : '',
        `every link is relative: open ${options.out}/index.html from disk, or serve the folder from any path on a static web server`,
      ].filter((l) => l !== '');
      return { stdout: lines.join('\n'), exitCode: 0 };
    } finally {
      closeLibrary(library);
    }
  },
};
