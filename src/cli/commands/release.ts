// `bandshelf release TAG`: freezes the current revision of every entry under a tag (or lists the releases).
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { createRelease } from '../../library/store/createRelease.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { listReleases } from '../../library/store/listReleases.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import type { CommandSpec } from '../command.js';
import { textTable } from '../textTable.js';

export const releaseCommand: CommandSpec = {
  name: 'release',
  summary: 'freeze the current state under a tag (without TAG: list releases)',
  example: [
    'bandshelf release 2026.1 --message "first reviewed set"',
    'bandshelf release 2026.2 --reviewed-only     # only revisions a second person approved',
    'bandshelf release                            # list releases',
    'bandshelf list --at 2026.1',
  ].join('\n'),
  configure(command) {
    command
      .argument('[tag]', 'release tag (letters, digits, ".", "_", "+", "-")')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--reviewed-only', "each entry's newest reviewed revision; entries never reviewed are left out")
      .option('--message <text>', 'release note', '')
      .option('--json', 'print the release (or the list) as JSON');
  },
  async run(args, options, context) {
    const tag = args[0] as string | undefined;
    const path = libraryPath(options.library, context.cwd);
    if (tag === undefined) {
      const library = openLibrary(path, { readonly: true });
      try {
        const releases = listReleases(library);
        if (options.json) return { stdout: JSON.stringify(releases), exitCode: 0 };
        if (releases.length === 0) return { stdout: 'no releases yet', exitCode: 0 };
        const rows = [
          ['TAG', 'WHEN', 'ENTRIES', 'REVIEWED-ONLY', 'MESSAGE'],
          ...releases.map((r) => [
            r.tag,
            r.createdAt.replace('T', ' ').slice(0, 19),
            String(r.entries),
            r.reviewedOnly ? 'yes' : 'no',
            r.message,
          ]),
        ];
        return { stdout: textTable(rows, { right: [2] }), exitCode: 0 };
      } finally {
        closeLibrary(library);
      }
    }
    const library = openLibrary(path);
    try {
      const release = createRelease(library, tag, {
        message: String(options.message ?? ''),
        reviewedOnly: Boolean(options.reviewedOnly),
      });
      if (options.json) return { stdout: JSON.stringify(release), exitCode: 0 };
      return {
        stdout: `release ${release.tag}: ${release.entries} entr${release.entries === 1 ? 'y' : 'ies'}${release.reviewedOnly ? ' (reviewed only)' : ''}`,
        stderr: release.entries === 0 ? 'note: the release holds no entries' : '',
        exitCode: 0,
      };
    } finally {
      closeLibrary(library);
    }
  },
};
