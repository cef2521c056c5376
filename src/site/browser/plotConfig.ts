// The look shared by every plot of the site: readable type, quiet axes, no border around the view.
import type { Config } from 'vega-lite';

export interface PlotConfigOptions {
  /** Base font size in px.
   * @default 13 */
  fontSize?: number;
}

export function plotConfig(options: PlotConfigOptions = {}): Config {
  const size = options.fontSize ?? 13;
  const font =
    'system-ui, -apple-system, "Segoe UI", Roboto, "Noto Sans", "Liberation Sans", Arial, sans-serif';
  return {
    font,
    view: { stroke: null },
    axis: {
      labelFontSize: size - 1,
      titleFontSize: size,
      titleFontWeight: 600,
      titleColor: '#1b1d21',
      labelColor: '#3b3f46',
      gridColor: '#e6e3dc',
      domainColor: '#8f8a80',
      tickColor: '#8f8a80',
    },
    legend: { labelFontSize: size - 1, titleFontSize: size, orient: 'top', labelLimit: 320, columns: 3 },
    line: { strokeWidth: 1.4 },
  };
}
