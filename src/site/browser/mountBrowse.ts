// Filters and sorts the browse table in place, from the data attributes each row carries; no page reload.

export interface MountBrowseOptions {
  /** Id of the table.
   * @default 'browse-table' */
  tableId?: string;
}

export function mountBrowse(doc: Document, options: MountBrowseOptions = {}): void {
  const table = doc.getElementById(options.tableId ?? 'browse-table') as HTMLTableElement | null;
  const form = doc.getElementById('browse-filters') as HTMLFormElement | null;
  const count = doc.getElementById('browse-count');
  const body = table?.tBodies[0];
  if (!table || !form || !body) return;
  const rows = Array.from(body.rows);
  const field = (name: string): string =>
    (form.elements.namedItem(name) as HTMLSelectElement | null)?.value ?? '';
  const collator = new Intl.Collator('en', { sensitivity: 'base', numeric: true });
  const apply = (): void => {
    const want = {
      class: field('class'),
      technique: field('technique'),
      tag: field('tag'),
      sampleForm: field('sampleForm'),
      reviewState: field('reviewState'),
    };
    const [key, direction] = (field('sort') || 'name-asc').split('-') as [
      'name' | 'date' | 'coverage',
      'asc' | 'desc',
    ];
    const sign = direction === 'desc' ? -1 : 1;
    const sorted = [...rows].sort((a, b) => {
      const primary =
        key === 'date'
          ? (a.dataset.date ?? '').localeCompare(b.dataset.date ?? '')
          : key === 'coverage'
            ? Number(a.dataset.coverage ?? 0) - Number(b.dataset.coverage ?? 0)
            : collator.compare(a.dataset.name ?? '', b.dataset.name ?? '');
      return sign * primary || collator.compare(a.dataset.name ?? '', b.dataset.name ?? '');
    });
    let shown = 0;
    for (const row of sorted) {
      const d = row.dataset;
      const visible =
        (want.class === '' || d.class === want.class) &&
        (want.technique === '' || d.technique === want.technique) &&
        (want.tag === '' || (d.tags ?? '').includes(`|${want.tag}|`)) &&
        (want.sampleForm === '' || d.sampleForm === want.sampleForm) &&
        (want.reviewState === '' || d.reviewState === want.reviewState);
      row.hidden = !visible;
      if (visible) shown++;
      body.appendChild(row);
    }
    if (count) count.textContent = `${shown} of ${rows.length} entries`;
  };
  form.addEventListener('change', apply);
  form.addEventListener('submit', (event) => event.preventDefault());
  apply();
}
