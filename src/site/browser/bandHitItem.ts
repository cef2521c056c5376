// One band-search hit as a list item of the search page: the entry's link, then what `bandshelf bands` prints for
// it: bands matched, score, mean |error| and each matched peak with its strength and error.
import type { BandHit, BandQuery } from '../../match/types.js';
import { formatNumber } from '../formatNumber.js';

export interface BandHitItemOptions {
  /** The entry page's href (null: not published, shown as text). */
  href: string | null;
}

export function bandHitItem(
  doc: Document,
  hit: BandHit,
  bands: readonly BandQuery[],
  options: BandHitItemOptions,
): HTMLLIElement {
  const item = doc.createElement('li');
  item.dataset.id = hit.id;
  const name = doc.createElement(options.href === null ? 'span' : 'a');
  if (name instanceof HTMLAnchorElement && options.href !== null) name.href = options.href;
  name.textContent = hit.name;
  const why = doc.createElement('span');
  why.className = 'why';
  why.textContent = `${hit.class} · ${hit.id} · ${hit.matched}/${bands.length} bands · score ${formatNumber(hit.score, { decimals: 3 })} · mean |error| ${formatNumber(hit.meanError, { decimals: 1 })} cm⁻¹`;
  const matched = doc.createElement('span');
  matched.className = 'why band-matches';
  matched.textContent = `matched: ${hit.matches
    .map((m) => {
      const q = bands[m.query]!;
      const err =
        m.error >= 0 ? `+${formatNumber(m.error, { decimals: 1 })}` : formatNumber(m.error, { decimals: 1 });
      return `${formatNumber(q.position, { decimals: 1 })}${q.strength ? `:${q.strength}` : ''} → peak ${formatNumber(m.position, { decimals: 1 })} (${m.strength}, ${err})`;
    })
    .join('; ')}`;
  item.append(name, why, matched);
  return item;
}
