// `bandshelf check`: verifies the library file and reproduces every stored revision; non-zero exit on a problem.
import { BandshelfError } from '../../error.js';
import { checkLibrary } from '../../library/store/checkLibrary.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { verifySearchMatrixCache } from '../../match/verifySearchMatrixCache.js';
import type { CommandSpec } from '../command.js';

export const checkCommand: CommandSpec = {
  name: 'check',
  summary: 'verify integrity, hashes and that every processed vector is reproducible',
  example: [
    'bandshelf check --library serum-refs.sqlite',
    '',
    'Checks: SQLite integrity and foreign keys, the immutability triggers, the SHA-256 of every stored file, every',
    "revision's record, data and content hash, that its original re-reads from its files and that its processed",
    'vector and peaks recompute from original + recipe (within 1e-6 of the largest value).',
  ].join('\n'),
  configure(command) {
    command
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--json', 'print {ok, revisions, problems:[{where, problem}]} as JSON');
  },
  async run(_args, options, context) {
    const path = libraryPath(options.library, context.cwd);
    const library = openLibrary(path, { readonly: true });
    try {
      const revisions = library.db.prepare('SELECT count(*) FROM revisions').pluck().get() as number;
      const problems = [
        ...checkLibrary(library, { progress: context.progress }),
        ...verifySearchMatrixCache(path),
      ];
      if (options.json) {
        return {
          stdout: JSON.stringify({ ok: problems.length === 0, revisions, problems }),
          exitCode: problems.length === 0 ? 0 : 1,
        };
      }
      if (problems.length === 0) {
        return { stdout: `ok: ${revisions} revision${revisions === 1 ? '' : 's'} verified`, exitCode: 0 };
      }
      const lines = problems.map((p) => `${p.where}: ${p.problem}`);
      const first = new BandshelfError(
        'CHECK_FAILED',
        `${problems.length} problem${problems.length === 1 ? '' : 's'}; first: ${lines[0]}`,
        { file: options.library === undefined ? path : String(options.library) },
      );
      return { stdout: lines.join('\n'), stderr: `bandshelf: ${first.oneLine()}`, exitCode: 1 };
    } finally {
      closeLibrary(library);
    }
  },
};
