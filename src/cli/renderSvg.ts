// Renders a Vega-Lite spec to SVG text in Node (no browser, no canvas): the `--plot` files of the CLI.
import type { TopLevelSpec } from 'vega-lite';

export interface RenderSvgOptions {
  /** Background colour. @default '#ffffff' */
  background?: string;
}

/** Vega is imported on first use, so commands that draw nothing do not load it at start-up. */
export async function renderSvg(spec: TopLevelSpec, options: RenderSvgOptions = {}): Promise<string> {
  const vega = await import('vega');
  const { compile } = await import('vega-lite');
  const view = new vega.View(vega.parse(compile(spec).spec), { renderer: 'none' });
  view.background(options.background ?? '#ffffff');
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}
