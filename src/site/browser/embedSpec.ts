// Draws a Vega-Lite spec with the page's vega-embed, in the mode the Content-Security-Policy allows.
import type { EmbedOptions, Result, VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';

export interface EmbedSpecOptions {
  /** `svg` keeps plots crisp in print and leaves marks in the DOM; `canvas` is faster for very many points.
   * @default 'svg' */
  renderer?: 'svg' | 'canvas';
  /** Name (without extension) of the SVG and PNG files the plot's export links save.
   * @default 'plot' */
  downloadFileName?: string;
}

type VegaEmbed = (el: HTMLElement, spec: VisualizationSpec, options: EmbedOptions) => Promise<Result>;

/**
 * vega-embed comes from its own script tag (copied from node_modules). `ast` + the vega-interpreter evaluate
 * expressions without `new Function`, so the page needs no 'unsafe-eval'; `defaultStyle: false` and the tooltip's
 * `disableDefaultStyle` keep vega-embed from injecting <style> elements the policy would block (site.css styles
 * them instead). Of vega-embed's actions only its export is offered (SVG, and PNG at twice the screen resolution
 * for print): the source views and the editor link, which would point at another host, are off.
 */
export function embedSpec(
  element: HTMLElement,
  spec: VisualizationSpec,
  options: EmbedSpecOptions = {},
): Promise<Result> {
  const embed = (globalThis as { vegaEmbed?: VegaEmbed }).vegaEmbed;
  if (typeof embed !== 'function') {
    element.textContent = 'The plotting scripts did not load, so the plot cannot be drawn.';
    return Promise.reject(new Error('vega-embed is not loaded'));
  }
  return embed(element, spec, {
    renderer: options.renderer ?? 'svg',
    actions: { export: { svg: true, png: true }, source: false, compiled: false, editor: false },
    downloadFileName: options.downloadFileName ?? 'plot',
    scaleFactor: { png: 2 },
    ast: true,
    expr: expressionInterpreter,
    defaultStyle: false,
    tooltip: { disableDefaultStyle: true },
  });
}
