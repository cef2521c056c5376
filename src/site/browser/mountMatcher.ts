// The in-browser matcher page: loads the published vectors, takes a dropped or chosen file, lists the top hits.
import { BandshelfError } from '../../error.js';
import { decodeSearchMatrix } from '../decodeSearchMatrix.js';
import { formatNumber } from '../formatNumber.js';
import { matchSpectrumFile, type PublishedSearchSet } from './matchSpectrumFile.js';

export interface MountMatcherOptions {
  /** Hits listed.
   * @default 10 */
  k?: number;
}

type MatrixMeta = Omit<PublishedSearchSet, 'processed'> & { rows: number; cols: number };

async function fetchOk(url: string): Promise<Response> {
  const response = await fetch(url);
  if (!response.ok) throw new Error(`${url}: HTTP ${response.status}`);
  return response;
}

export function mountMatcher(doc: Document, options: MountMatcherOptions = {}): void {
  const zone = doc.getElementById('match-drop');
  const input = doc.getElementById('match-file') as HTMLInputElement | null;
  const status = doc.getElementById('match-status');
  const table = doc.getElementById('match-results') as HTMLTableElement | null;
  const base = doc.body.dataset.base ?? '/';
  if (!zone || !input || !status || !table) return;
  let set: PublishedSearchSet | undefined;
  const ready = Promise.all([
    fetchOk(zone.dataset.meta ?? `${base}assets/search-matrix.json`).then(
      (r) => r.json() as Promise<MatrixMeta>,
    ),
    fetchOk(zone.dataset.matrix ?? `${base}assets/search-matrix.bin`).then((r) => r.arrayBuffer()),
  ]).then(([meta, buffer]) => {
    const decoded = decodeSearchMatrix(new Uint8Array(buffer));
    if (decoded.rows !== meta.rows || decoded.cols !== meta.cols) {
      throw new Error('the matrix and its description disagree; rebuild the site');
    }
    set = { ...meta, processed: decoded.matrix };
    status.textContent = `Ready: ${meta.rows} reference spectra loaded.`;
    zone.dataset.ready = 'true';
  });
  ready.catch((error: unknown) => {
    status.textContent = `The reference vectors could not be loaded (${error instanceof Error ? error.message : String(error)}).`;
  });

  const show = async (file: File): Promise<void> => {
    status.textContent = `Reading ${file.name} …`;
    table.hidden = true;
    try {
      await ready;
      const bytes = new Uint8Array(await file.arrayBuffer());
      const result = matchSpectrumFile(bytes, file.name, set!, { k: options.k ?? 10 });
      const body = table.tBodies[0]!;
      body.replaceChildren();
      result.hits.forEach((hit, i) => {
        const row = body.insertRow();
        row.insertCell().textContent = String(i + 1);
        const cell = row.insertCell();
        if (hit.path) {
          const link = doc.createElement('a');
          link.href = `${base}${hit.path}`;
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
