// An entry page's "overlay with…": the processed spectra of this entry and of entries the user names, on one plot;
// the choice lives in the page address (`?with=id,id`) so the view can be shared.
import { entryPlotData } from '../entryPlotData.js';
import type { EntryDocument, ReportPlotSeries } from '../types.js';
import { base64Bytes } from './base64Bytes.js';
import { embedSpec } from './embedSpec.js';
import { reportPlotSpec } from './reportPlotSpec.js';
import { siteData } from './siteData.js';

export interface MountEntryOverlayOptions {
  /** Id of the entry plot container (its `data-script` and `data-key` name this entry's data).
   * @default 'entry-plot' */
  plotId?: string;
}

/** The processed series of one entry, loaded from its data script (entry pages sit side by side under entries/). */
async function processedSeries(doc: Document, url: string, key: string): Promise<ReportPlotSeries | null> {
  const { document, processed } = await siteData<{ document: EntryDocument; processed: string }>(
    url,
    `entry:${key}`,
    {
      doc,
    },
  );
  const bytes = base64Bytes(processed, { length: document.processed.length * 4 });
  const view = new DataView(bytes.buffer);
  const values = new Float32Array(document.processed.length);
  for (let i = 0; i < values.length; i++) values[i] = view.getFloat32(i * 4, true);
  const trace = entryPlotData(document, values).processed;
  return trace === null ? null : { ...trace, name: String(document.meta.name ?? key), role: 'hit' };
}

/** Ids as typed: split on commas or white space, each kept to the entry-id alphabet, no repeats. */
function idsOf(text: string): string[] {
  return [...new Set(text.split(/[\s,]+/).filter((id) => /^[a-z0-9][a-z0-9._-]*$/.test(id)))];
}

export function mountEntryOverlay(doc: Document, options: MountEntryOverlayOptions = {}): void {
  const plot = doc.getElementById(options.plotId ?? 'entry-plot');
  const target = doc.getElementById('overlay-plot');
  const form = doc.getElementById('overlay-form') as HTMLFormElement | null;
  const input = doc.getElementById('overlay-ids') as HTMLInputElement | null;
  const status = doc.getElementById('overlay-status');
  const own = plot?.dataset.key;
  const ownUrl = plot?.dataset.script;
  if (!target || !form || !input || !own || !ownUrl) return;
  const draw = (ids: string[]): void => {
    target.dataset.rendered = 'false';
    if (ids.length === 0) {
      target.replaceChildren();
      return;
    }
    const others = ids.filter((id) => id !== own);
    Promise.all([
      processedSeries(doc, ownUrl, own),
      ...others.map((id) =>
        processedSeries(
          doc,
          new URL(`../${id}/${id}.data.js`, new URL(ownUrl, doc.location.href)).href,
          id,
        ).catch(() => {
          throw new Error(`no entry '${id}' on this site`);
        }),
      ),
    ])
      .then((series) => {
        const [mine, ...rest] = series;
        const shown = [
          { ...mine!, role: 'unknown' },
          ...rest.filter((s): s is ReportPlotSeries => s !== null),
        ];
        return embedSpec(target, reportPlotSpec(shown), { downloadFileName: target.dataset.download });
      })
      .then(() => {
        target.dataset.rendered = 'true';
        if (status) status.dataset.error = '';
      })
      .catch((error: unknown) => {
        target.replaceChildren();
        target.textContent = `The overlay could not be drawn: ${error instanceof Error ? error.message : String(error)}`;
      });
  };
  const fromAddress = idsOf(new URL(doc.location.href).searchParams.get('with') ?? '');
  input.value = fromAddress.join(', ');
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    const ids = idsOf(input.value);
    const address = new URL(doc.location.href);
    if (ids.length === 0) address.searchParams.delete('with');
    else address.searchParams.set('with', ids.join(','));
    doc.defaultView?.history.replaceState(null, '', address.href);
    draw(ids);
  });
  draw(fromAddress);
}
