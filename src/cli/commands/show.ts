// `bandshelf show ID`: one entry's metadata, data, peaks, QC and recipe.
import { BandshelfError } from '../../error.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { entryDocument } from '../../library/store/entryDocument.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { readEntry } from '../../library/store/readEntry.js';
import type { EntryView } from '../../library/types.js';
import { gridAxis } from '../../spectrum/gridAxis.js';
import type { CommandSpec } from '../command.js';
import { textTable } from '../textTable.js';

/** The entry's one JSON form, plus what only the store knows about the revision. */
function asJson(view: EntryView): unknown {
  return {
    ...entryDocument(view),
    kind: view.kind,
    retired: view.retired,
    dataHash: view.dataHash,
    coverage: view.coverage,
    read: view.read,
    author: view.author,
    message: view.message,
    reviews: view.reviews,
    releases: view.releases,
  };
}

function fmt(v: number, digits = 4): string {
  return Number.isFinite(v) ? Number(v.toPrecision(digits)).toString() : '—';
}

function asText(view: EntryView): string {
  const lines: string[] = [];
  const m = view.meta;
  lines.push(
    `${view.id}  revision ${view.revision} (${view.kind}${view.retired ? ', retired' : ''})  ${view.reviewState}`,
  );
  lines.push(`hash ${view.hash}`);
  lines.push('');
  const metaRows = Object.entries(m)
    .filter(([k]) => k !== 'id')
    .map(([k, v]) => [
      k,
      Array.isArray(v) ? v.join('; ') : typeof v === 'object' ? JSON.stringify(v) : String(v),
    ]);
  lines.push(textTable(metaRows));
  lines.push('');
  const x = view.original.wavenumber;
  lines.push(
    `original: ${x.length} points, ${fmt(x[x.length - 1] ?? Number.NaN, 6)}–${fmt(x[0] ?? Number.NaN, 6)} cm⁻¹ (${view.files
      .map((f) => `${f.role} ${f.name}`)
      .join(', ')})`,
  );
  lines.push(
    view.coverage
      ? `processed: ${view.coverage.points} grid points covered, ${fmt(view.coverage.max, 6)}–${fmt(view.coverage.min, 6)} cm⁻¹`
      : 'processed: nothing covered',
  );
  const r = view.recipe;
  lines.push(
    `recipe: baseline ${r.baseline.method}, normalise ${r.normalise.method}, smooth ${r.smooth ? `SG ${r.smooth.width === undefined ? `${r.smooth.window ?? 9} points` : `${r.smooth.width} cm⁻¹`}/${r.smooth.order}` : 'none'}` +
      `${r.reference ? `, subtract ${r.reference.id} r${r.reference.revision}` : ''}${r.emsc ? `, EMSC ${r.emsc.id} r${r.emsc.revision}` : ''}` +
      `${r.timeDomain ? `, time-domain (${r.timeDomain.apodisation}, zero-fill ×${r.timeDomain.zeroFill})` : ''}`,
  );
  const e = view.extras;
  if (e.dynamicRangeOrders !== undefined)
    lines.push(`reference dynamic range: ${fmt(e.dynamicRangeOrders, 3)} orders`);
  if (e.timingSpreadAs !== undefined)
    lines.push(`timing spread after alignment: ${fmt(e.timingSpreadAs, 3)} as`);
  if (e.referenceScale !== undefined) lines.push(`reference scale: ${fmt(e.referenceScale, 5)}`);
  lines.push('');
  if (view.peaks.length > 0) {
    const top = [...view.peaks].sort((a, b) => b.prominence - a.prominence).slice(0, 20);
    top.sort((a, b) => b.position - a.position);
    lines.push(
      `peaks (${view.peaks.length}${view.peaks.length > top.length ? `, the ${top.length} most prominent` : ''}):`,
    );
    lines.push(
      textTable(
        [
          ['cm⁻¹', 'height', 'prominence', 'FWHM'],
          ...top.map((p) => [p.position.toFixed(1), fmt(p.height), fmt(p.prominence), p.fwhm.toFixed(1)]),
        ],
        { right: [0, 1, 2, 3] },
      ),
    );
  } else lines.push('peaks: none');
  lines.push('');
  if (view.qc.length > 0) {
    lines.push('QC:');
    for (const f of view.qc) lines.push(`  ${f.level} ${f.code}: ${f.message}`);
  } else lines.push('QC: no flags');
  if (e.warnings && e.warnings.length > 0) {
    lines.push('reader warnings:');
    for (const w of e.warnings) lines.push(`  ${w.line !== undefined ? `line ${w.line}: ` : ''}${w.message}`);
  }
  lines.push('');
  lines.push(`by ${view.author} at ${view.createdAt}${view.message ? `: ${view.message}` : ''}`);
  if (view.reviews.length > 0) {
    for (const rv of view.reviews)
      lines.push(`${rv.state} by ${rv.reviewer} at ${rv.createdAt}${rv.note ? `: ${rv.note}` : ''}`);
  }
  if (view.releases.length > 0) lines.push(`in releases: ${view.releases.join(', ')}`);
  return lines.join('\n');
}

export const showCommand: CommandSpec = {
  name: 'show',
  summary: 'show one entry: metadata, data, peaks, QC, recipe',
  example: [
    'bandshelf show serum-07',
    'bandshelf show serum-07 --revision 1',
    'bandshelf show serum-07 --at 2026.1 --json',
  ].join('\n'),
  configure(command) {
    command
      .argument('<id>', 'entry id')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--at <tag>', 'the revision a release froze')
      .option('--revision <n>', 'a given revision (default the newest)')
      .option('--processed', 'with the text output, also list the processed grid vector')
      .option('--json', 'print the entry as JSON (processed: null where not covered)');
  },
  async run(args, options, context) {
    const id = String(args[0]);
    let revision: number | undefined;
    if (options.revision !== undefined) {
      revision = Number(options.revision);
      if (!Number.isInteger(revision) || revision < 1) {
        throw new BandshelfError(
          'BAD_OPTION',
          `--revision wants a revision number from 1 (not '${options.revision}')`,
          {
            field: 'revision',
          },
        );
      }
    }
    const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
    try {
      const view = readEntry(library, id, {
        at: options.at as string | undefined,
        ...(revision !== undefined ? { revision } : {}),
      });
      if (options.json) return { stdout: JSON.stringify(asJson(view)), exitCode: 0 };
      let text = asText(view);
      if (options.processed) {
        const axis = gridAxis(view.grid);
        const rows = Array.from(view.processed, (v, i) => [
          String(axis[i]),
          Number.isFinite(v) ? String(v) : 'not covered',
        ]);
        text += `\n\nprocessed vector:\n${textTable(rows, { right: [0] })}`;
      }
      return { stdout: text, exitCode: 0 };
    } finally {
      closeLibrary(library);
    }
  },
};
