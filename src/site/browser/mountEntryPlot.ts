// Wires an entry page: loads the entry's data script (document and processed vector) once, draws the thinned plot, redraws
// when a trace is toggled or the zoom reset, and makes the CSV and JCAMP-DX downloads from the same data on request.
import type { Result } from 'vega-embed';
import { entryPlotData } from '../entryPlotData.js';
import type { EntryDocument } from '../types.js';
import { base64Bytes } from './base64Bytes.js';
import { embedSpec } from './embedSpec.js';
import { entryDownload } from './entryDownload.js';
import { entryPlotSpec } from './entryPlotSpec.js';
import { siteData } from './siteData.js';

export interface MountEntryPlotOptions {
  /** Id of the plot container (its `data-script` attribute names the entry's data script, `data-key` its slug).
   * @default 'entry-plot' */
  plotId?: string;
}

function offerDownload(doc: Document, file: string, type: string, text: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const link = doc.createElement('a');
  link.href = url;
  link.download = file;
  link.hidden = true;
  doc.body.append(link);
  link.click();
  link.remove();
  // The download has started from the object URL; release it once the click has been handled.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function mountEntryPlot(doc: Document, options: MountEntryPlotOptions = {}): void {
  const target = doc.getElementById(options.plotId ?? 'entry-plot');
  const url = target?.dataset.script;
  if (!target || !url) return;
  const boxes = Array.from(doc.querySelectorAll<HTMLInputElement>('#plot-controls input[name="trace"]'));
  const buttons = Array.from(doc.querySelectorAll<HTMLButtonElement>('button[data-derive]'));
  // Loaded from a script file beside the JSON download (a browser refuses fetch from file://, not scripts).
  const data = siteData<{ document: EntryDocument; processed: string }>(
    url,
    `entry:${target.dataset.key ?? ''}`,
    {
      doc,
    },
  );
  const entry: Promise<EntryDocument> = data.then((d) => d.document);
  // The processed vector is little-endian float32; a missing or short one only hides that trace.
  const processed: Promise<Float32Array | null> = data.then(({ document, processed: text }) => {
    try {
      const bytes = base64Bytes(text, { length: document.processed.length * 4 });
      const view = new DataView(bytes.buffer);
      const values = new Float32Array(document.processed.length);
      for (let i = 0; i < values.length; i++) values[i] = view.getFloat32(i * 4, true);
      return values;
    } catch {
      return null;
    }
  });

  for (const button of buttons) {
    button.disabled = false;
    button.addEventListener('click', () => {
      const format = button.dataset.derive === 'csv' ? 'csv' : 'jcamp-dx';
      entry
        .then((document) => {
          const made = entryDownload(document, format, { name: button.dataset.name });
          offerDownload(doc, made.file, made.type, made.text);
        })
        .catch((error: unknown) => {
          button.textContent = `failed: ${error instanceof Error ? error.message : String(error)}`;
        });
    });
  }

  Promise.all([entry, processed])
    .then(([document, vector]) => {
      const data = entryPlotData(document, vector);
      // A trace with no data cannot be toggled on.
      for (const box of boxes) {
        if ((box.value === 'original' && !data.original) || (box.value === 'processed' && !data.processed)) {
          box.checked = false;
          box.disabled = true;
        }
      }
      let current: Result | undefined;
      const draw = (): void => {
        const show = {
          original: boxes.some((b) => b.value === 'original' && b.checked),
          processed: boxes.some((b) => b.value === 'processed' && b.checked),
        };
        current?.finalize();
        current = undefined;
        target.replaceChildren();
        embedSpec(target, entryPlotSpec(data, { show }), {
          downloadFileName: target.dataset.download,
        })
          .then((result) => {
            current = result;
            target.dataset.rendered = 'true';
          })
          .catch((error: unknown) => {
            target.textContent = `The plot could not be drawn: ${error instanceof Error ? error.message : String(error)}`;
          });
      };
      for (const box of boxes) box.addEventListener('change', draw);
      doc.getElementById('plot-reset')?.addEventListener('click', draw);
      draw();
    })
    .catch((error: unknown) => {
      target.textContent = `The spectrum could not be loaded: ${error instanceof Error ? error.message : String(error)}`;
    });
}
