// Draws a Vega-Lite spec with the page's vega-embed, in the mode the Content-Security-Policy allows.
import type { EmbedOptions, Result, VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';

export interface EmbedSpecOptions {
  /** `svg` keeps plots crisp in print and leaves marks in the DOM; `canvas` is faster for very many points.
   * @default 'svg' */
  renderer?: 'svg' | 'canvas';
}

type VegaEmbed = (el: HTMLElement, spec: VisualizationSpec, options: EmbedOptions) => Promise<Result>;

/**
 * vega-embed comes from its own script tag (copied from node_modules). `ast` + the vega-interpreter evaluate
 * expressions without `new Function`, so the page needs no 'unsafe-eval'; `defaultStyle: false` and the tooltip's
 * `disableDefaultStyle` keep vega-embed from injecting <style> elements the policy would block (site.css styles
 * them instead); no actions menu, because its editor link would point at another host.
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
    actions: false,
    ast: true,
    expr: expressionInterpreter,
    defaultStyle: false,
    tooltip: { disableDefaultStyle: true },
  });
}
