// The in-browser matcher page: loads the published data, takes a dropped or chosen file, and shows the match
// pipeline's report: top hits, the mixture (components, unexplained bands) and the identified bands.
import { BandshelfError } from '../../error.js';
import type { MatchSource } from '../../match/pipeline/types.js';
import type { MatchReport } from '../../schema/matchReport.js';
import { decodeSearchMatrix } from '../decodeSearchMatrix.js';
import { formatNumber } from '../formatNumber.js';
import { base64Bytes } from './base64Bytes.js';
import { matchSpectrumFile, type PublishedSearchSet } from './matchSpectrumFile.js';
import { pageHref } from './pageHref.js';
import { type PublishedEntryDocument, publishedMatchSource } from './publishedMatchSource.js';
import { siteData } from './siteData.js';

export interface MountMatcherOptions {
  /** Hits listed.
   * @default 10 */
  k?: number;
}

type MatrixMeta = Omit<PublishedSearchSet, 'processed'> & { rows: number; cols: number };

/** A small table of header labels and rows of cell texts. */
function tableOf(doc: Document, head: string[], rows: string[][]): HTMLTableElement {
  const table = doc.createElement('table');
  const tr = table.createTHead().insertRow();
  for (const h of head) {
    const th = doc.createElement('th');
    th.textContent = h;
    tr.append(th);
  }
  const body = table.createTBody();
  for (const cells of rows) {
    const row = body.insertRow();
    for (const c of cells) row.insertCell().textContent = c;
  }
  return table;
}

/** The mixture and band sections of a report, as the report pages show them. */
function reportSections(doc: Document, report: MatchReport): HTMLElement[] {
  const out: HTMLElement[] = [];
  const mixture = report.mixture;
  if (mixture) {
    const section = doc.createElement('section');
    section.id = 'match-mixture';
    const h = doc.createElement('h2');
    h.textContent = 'Mixture fit';
    const note = doc.createElement('p');
    note.className = 'muted';
    note.textContent = `R² ${mixture.r2 === null ? '–' : formatNumber(mixture.r2, { decimals: 4 })}; ${mixture.criterion}`;
    section.append(
      h,
      note,
      tableOf(
        doc,
        ['Component', 'Class', 'Share', 'Forced'],
        mixture.components.map((c) => [
          `${c.name ?? c.id} ${c.id}`,
          c.class ?? '',
          formatNumber(c.share, { decimals: 3 }),
          c.forced ? 'yes' : 'no',
        ]),
      ),
    );
    const residual = doc.createElement('p');
    residual.className = 'match-residual-bands';
    residual.textContent =
      mixture.residualBands.length === 0
        ? 'Unexplained bands: none above the noise.'
        : `Unexplained bands (cm⁻¹): ${mixture.residualBands.map((b) => formatNumber(b.position, { decimals: 1 })).join(', ')}`;
    section.append(residual);
    out.push(section);
  }
  const bands = doc.createElement('section');
  bands.id = 'match-bands';
  const h = doc.createElement('h2');
  h.textContent = 'Band identification';
  bands.append(
    h,
    tableOf(
      doc,
      ['Band (cm⁻¹)', 'Assignments', 'Library candidates', 'Explained by the fit'],
      report.bands.map((b) => [
        formatNumber(b.position, { decimals: 1 }),
        b.assignments.map((a) => a.label).join('; '),
        b.candidates.map((c) => c.id).join(', '),
        b.explained === null ? '–' : b.explained ? 'yes' : 'no',
      ]),
    ),
  );
  out.push(bands);
  return out;
}

export function mountMatcher(doc: Document, options: MountMatcherOptions = {}): void {
  const zone = doc.getElementById('match-drop');
  const input = doc.getElementById('match-file') as HTMLInputElement | null;
  const status = doc.getElementById('match-status');
  const table = doc.getElementById('match-results') as HTMLTableElement | null;
  const base = doc.body.dataset.base ?? '/';
  if (!zone || !input || !status || !table) return;
  let set: PublishedSearchSet | undefined;
  let source: MatchSource | undefined;
  const sections = doc.createElement('div');
  sections.id = 'match-report';
  table.after(sections);
  // Script files, not fetch: a browser refuses fetch from file:// but loads scripts (the page lists the matrix's).
  const ready = siteData<{ meta: MatrixMeta; matrix: string }>(
    zone.dataset.script ?? `${base}assets/search-matrix.js`,
    'search-matrix',
    { doc },
  ).then(({ meta, matrix }) => {
    const decoded = decodeSearchMatrix(base64Bytes(matrix));
    if (decoded.rows !== meta.rows || decoded.cols !== meta.cols) {
      throw new Error('the matrix and its description disagree; rebuild the site');
    }
    set = { ...meta, processed: decoded.matrix };
    // An entry's data script sits in its folder under the folder's own name.
    const loadEntry = (path: string): Promise<PublishedEntryDocument> => {
      const slug = path.replace(/\/$/, '').split('/').pop() ?? '';
      return siteData<{ document: PublishedEntryDocument }>(
        `${base}${path}${slug}.data.js`,
        `entry:${slug}`,
        {
          doc,
        },
      ).then((d) => d.document);
    };
    source = publishedMatchSource(set, { loadEntry });
    status.textContent = `Ready: ${meta.rows} reference spectra loaded.`;
    zone.dataset.ready = 'true';
  });
  ready.catch((error: unknown) => {
    status.textContent = `The reference vectors could not be loaded (${error instanceof Error ? error.message : String(error)}).`;
  });

  const show = async (file: File): Promise<void> => {
    status.textContent = `Reading ${file.name} …`;
    table.hidden = true;
    sections.replaceChildren();
    try {
      await ready;
      const bytes = new Uint8Array(await file.arrayBuffer());
      const result = await matchSpectrumFile(bytes, file.name, set!, { k: options.k ?? 10, source: source! });
      const body = table.tBodies[0]!;
      body.replaceChildren();
      result.hits.forEach((hit, i) => {
        const row = body.insertRow();
        row.insertCell().textContent = String(i + 1);
        const cell = row.insertCell();
        if (hit.path) {
          const link = doc.createElement('a');
          link.href = pageHref(doc, hit.path, { base });
          link.textContent = hit.name;
          cell.append(link);
        } else cell.textContent = hit.name;
        const id = doc.createElement('span');
        id.className = 'muted';
        id.textContent = ` ${hit.id}`;
        cell.append(id);
        row.insertCell().textContent = hit.class;
        const score = row.insertCell();
        score.className = 'num';
        score.textContent = formatNumber(hit.score, { decimals: 4 });
        const overlap = row.insertCell();
        overlap.className = 'num';
        overlap.textContent = formatNumber(hit.overlap, { decimals: 0 });
      });
      table.hidden = result.hits.length === 0;
      sections.replaceChildren(...reportSections(doc, result.report));
      const notes = [
        result.spectra > 1 ? `the file holds ${result.spectra} spectra; the first was matched` : '',
        ...result.warnings,
      ].filter((n) => n !== '');
      status.textContent =
        `${result.title}: ${result.hits.length} hits, best ${result.hits[0] ? formatNumber(result.hits[0].score, { decimals: 4 }) : '–'}` +
        (notes.length > 0 ? ` (${notes.join('; ')})` : '.');
      zone.dataset.matched = file.name;
    } catch (error) {
      status.textContent =
        error instanceof BandshelfError
          ? error.file === undefined
            ? `${file.name}: ${error.oneLine()}`
            : error.oneLine()
          : `${file.name} could not be matched: ${error instanceof Error ? error.message : String(error)}`;
    }
  };

  input.addEventListener('change', () => {
    const file = input.files?.[0];
    if (file) void show(file);
  });
  zone.addEventListener('dragover', (event) => {
    event.preventDefault();
    zone.classList.add('dragging');
  });
  zone.addEventListener('dragleave', () => zone.classList.remove('dragging'));
  zone.addEventListener('drop', (event) => {
    event.preventDefault();
    zone.classList.remove('dragging');
    const file = event.dataTransfer?.files[0];
    if (file) void show(file);
  });
}
