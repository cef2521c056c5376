// Turns an entry's metadata into labelled display rows, in the schema's order, with DOIs made into links.
import { techniqueLabel } from './techniqueLabel.js';
import type { SiteRow } from './types.js';

export interface MetaRowsOptions {
  /** Fields left out (shown elsewhere on the page).
   * @default [] */
  omit?: string[];
}

const LABELS: Record<string, string> = {
  id: 'Id',
  name: 'Name',
  synonyms: 'Synonyms',
  class: 'Class',
  formula: 'Formula',
  inchiKey: 'InChIKey',
  cas: 'CAS Registry Number',
  sampleForm: 'Sample form',
  preparation: 'Preparation',
  solvent: 'Solvent',
  concentration: 'Concentration',
  technique: 'Technique',
  resolution: 'Resolution',
  temperature: 'Temperature',
  contributor: 'Contributor',
  date: 'Measured',
  licence: 'Licence',
  source: 'Source',
  tags: 'Tags',
  notes: 'Notes',
  synthetic: 'Synthetic',
  origin: 'Origin',
  owner: 'Owner',
  state: 'State',
  samplingProcedure: 'Sampling procedure',
};

/** The https://doi.org/ address of a DOI written bare, as `doi:…` or as a doi.org URL; undefined otherwise. */
function doiHref(text: string): string | undefined {
  const m = /^(?:doi:\s*|https?:\/\/(?:dx\.)?doi\.org\/)?(10\.\d{4,9}\/\S+)$/i.exec(text.trim());
  if (!m) return undefined;
  // Percent-encode everything but the separators so the address cannot break out of the attribute or the URL.
  return `https://doi.org/${m[1]!.split('/').map(encodeURIComponent).join('/')}`;
}

function display(key: string, value: unknown): string {
  if (value === null || value === undefined) return '';
  if (Array.isArray(value)) return value.map((v) => display(key, v)).join(', ');
  if (key === 'technique' && typeof value === 'string') return techniqueLabel(value);
  if (key === 'resolution' && typeof value === 'number') return `${value} cm⁻¹`;
  if (key === 'temperature' && typeof value === 'number') return `${value} °C`;
  if (key === 'synthetic' && typeof value === 'boolean') return value ? 'yes: invented demo data' : 'no';
  if (key === 'concentration' && typeof value === 'object') {
    const c = value as { value?: unknown; unit?: unknown };
    return `${String(c.value ?? '')} ${String(c.unit ?? '')}`.trim();
  }
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}

/** Known fields first in schema order, then any other stored field under its own key. */
export function metaRows(meta: Record<string, unknown>, options: MetaRowsOptions = {}): SiteRow[] {
  const omit = new Set(options.omit ?? []);
  const keys = [
    ...Object.keys(LABELS).filter((k) => k in meta),
    ...Object.keys(meta)
      .filter((k) => !(k in LABELS))
      .sort(),
  ];
  const rows: SiteRow[] = [];
  for (const key of keys) {
    if (omit.has(key)) continue;
    const value = display(key, meta[key]);
    if (value === '') continue;
    const row: SiteRow = { label: LABELS[key] ?? key, value };
    if (key === 'source') {
      const href = doiHref(value);
      if (href) row.href = href;
    }
    rows.push(row);
  }
  return rows;
}
