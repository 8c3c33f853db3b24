import type * as VegaLite from 'vega-lite';

/**
 * vega and vega-lite, loaded on the first plot: they take most of a second to import, and a
 * command that writes no report (every shard, `--no-report`, `check --json`) should not pay it.
 */
let libraries: Promise<[typeof import('vega'), typeof import('vega-lite')]> | undefined;
function plottingLibraries(): Promise<[typeof import('vega'), typeof import('vega-lite')]> {
  libraries ??= Promise.all([import('vega'), import('vega-lite')]);
  return libraries;
}

/**
 * A logger that keeps vega and vega-lite quiet: library code never prints, and the warnings
 * they raise (e.g. a channel dropped for a mark) are specification matters caught by tests.
 */
const SILENT = {
  level(): number {
    return 0;
  },
  error(): void {},
  warn(): void {},
  info(): void {},
  debug(): void {},
};

/**
 * Renders a vega-lite specification to an SVG string in Node, without a browser or a canvas
 * (text widths are estimated). Compiles with vega-lite, then renders through a headless vega View.
 * @param spec a vega-lite specification with inline data
 */
export async function renderVegaLiteSvg(spec: Record<string, unknown>): Promise<string> {
  const [vega, vl] = await plottingLibraries();
  const compiled = vl.compile(spec as unknown as VegaLite.TopLevelSpec, { logger: SILENT as never }).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: 'none', logger: SILENT as never });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}
