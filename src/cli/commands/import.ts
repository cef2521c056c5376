// `bandshelf import FILE`: brings a bundle (`export --bundle`) into this library, or into a new one.
import { resolve } from 'node:path';
import type { ImportBundleFileOutcome } from '../../library/store/importBundleFile.js';
import { importBundleFile } from '../../library/store/importBundleFile.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import type { CommandSpec } from '../command.js';

function summary(outcome: ImportBundleFileOutcome, library: string): string {
  if (!outcome.changed) {
    return `nothing new: every revision, review, release and assignment row of '${outcome.source}' is already in ${library}`;
  }
  const lines = [
    `${outcome.created ? 'created' : 'imported into'} ${library} from '${outcome.source}': ` +
      `${outcome.revisionsAdded} revisions, ${outcome.reviewsAdded} reviews, ` +
      `${outcome.releases.filter((r) => r.status === 'added').length} releases, ${outcome.assignmentsAdded} assignment rows`,
  ];
  for (const e of outcome.entries) {
    if (e.status === 'conflict') {
      lines.push(
        `conflict: ${e.id} was changed in both libraries; the bundle's history is kept as ${e.importedAs} (${e.revisionsAdded} revisions), ${e.id} is unchanged`,
      );
    } else if (e.status === 'appended') lines.push(`${e.id}: ${e.revisionsAdded} later revisions appended`);
    else if (e.status === 'ahead') lines.push(`${e.id}: this library already holds later revisions; kept`);
  }
  for (const r of outcome.releases) {
    if (r.status === 'added' && r.importedAs !== r.tag)
      lines.push(`release ${r.tag} imported as ${r.importedAs}`);
    if (r.status === 'conflict')
      lines.push(`conflict: release ${r.importedAs} already exists here with other members; not imported`);
  }
  return lines.join('\n');
}

export const importCommand: CommandSpec = {
  name: 'import',
  summary: 'bring a bundle (export --bundle) into the library, keeping every history',
  example: [
    'bandshelf export --bundle alder-row.bundle --library alder-row.sqlite',
    'bandshelf import alder-row.bundle --library our-lab.sqlite    # an existing library, or a new one',
    'bandshelf check --library our-lab.sqlite',
    '',
    'Identical revisions keep their hashes; later revisions are appended; an entry both libraries changed is',
    'imported under ID--SOURCE and reported; releases keep their tag where the library bears the source',
    "library's name (a copy of it), else get TAG+SOURCE. Importing the same bundle again changes nothing.",
  ].join('\n'),
  configure(command) {
    command
      .argument('<file>', 'the bundle file')
      .option(
        '--library <path>',
        'library file (created from the bundle when there is none)',
        'bandshelf.sqlite',
      )
      .option('--json', 'print what was imported as JSON');
  },
  async run(args, options, context) {
    const file = String(args[0]);
    const library = libraryPath(options.library, context.cwd);
    const outcome = importBundleFile({ bundle: resolve(context.cwd, file), library }, { label: file });
    if (options.json) return { stdout: JSON.stringify(outcome), exitCode: 0 };
    const conflicts = outcome.entries.filter((e) => e.status === 'conflict').length;
    return {
      stdout: summary(outcome, String(options.library ?? 'bandshelf.sqlite')),
      stderr:
        conflicts > 0
          ? `note: ${conflicts} entr${conflicts === 1 ? 'y' : 'ies'} imported under a suffixed id`
          : '',
      exitCode: 0,
    };
  },
};
