import type { Evaluator, RuleTable } from '../../types.js';
import { renderVegaLiteSvg } from './render-svg.js';
import { sliceData } from './slice-data.js';
import { SLICE_GRID, sliceGrid } from './slice-grid.js';
import { distinctHelds, HELD_RULES, sliceHelds } from './slice-helds.js';
import { MAX_SLICE_PAIRS, slicePairs } from './slice-pairs.js';
import { sliceSpec } from './slice-spec.js';

export interface SliceOptions {
  /** Input pairs to plot; default: the pairs the rules constrain most often (slicePairs). */
  readonly pairs?: ReadonlyArray<readonly [number, number]>;
  /** Most pairs when chosen automatically; default MAX_SLICE_PAIRS. */
  readonly maxPairs?: number;
  /** Held points per pair: centres of this many largest rules; default HELD_RULES. */
  readonly heldRules?: number;
  /** Grid cells per side; default SLICE_GRID. */
  readonly grid?: number;
}

/** One rendered slice plot. */
export interface SliceFigure {
  readonly pair: readonly [number, number];
  /** Index into the held points of the page (`SliceSet.helds`). */
  readonly held: number;
  readonly svg: string;
  /** Ids of the rules outlined, and of the rules whose counterexamples are drawn. */
  readonly outlineIds: readonly string[];
  readonly pointIds: readonly string[];
}

export interface SliceSet {
  readonly pairs: ReadonlyArray<readonly [number, number]>;
  readonly helds: ReturnType<typeof sliceHelds>;
  readonly figures: readonly SliceFigure[];
}

/**
 * Renders every (pair, held point) slice plot of a table as SVG: for each pair, the network's
 * advisories on a grid with the other inputs held at each distinct held point, the rule boxes
 * cutting that plane and the counterexamples near it. Tables of one input get no slices.
 * @param evaluate the network in scenario units (the model the table was mined from)
 */
export async function buildSlices(table: RuleTable, evaluate: Evaluator, options: SliceOptions = {}): Promise<SliceSet> {
  const n = options.grid ?? SLICE_GRID;
  const pairs = options.pairs ?? slicePairs(table, options.maxPairs ?? MAX_SLICE_PAIRS);
  const helds = sliceHelds(table, options.heldRules ?? HELD_RULES);
  const figures: SliceFigure[] = [];
  if (table.inputs.length < 2) return { pairs: [], helds, figures };
  for (const pair of pairs) {
    for (const h of distinctHelds(helds, pair)) {
      const grid = await sliceGrid(table.inputs, pair, h.x, evaluate, n);
      const data = sliceData(table, pair, h.x, grid, n);
      const svg = await renderVegaLiteSvg(sliceSpec(table, data));
      figures.push({ pair, held: helds.indexOf(h), svg, outlineIds: data.outlines.map((o) => o.id), pointIds: data.points.map((p) => p.id) });
    }
  }
  return { pairs, helds, figures };
}
