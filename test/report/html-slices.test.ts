import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadModel } from '../../src/model/index.js';
import { loadScenario } from '../../src/scenario/index.js';
import {
  buildSlices,
  distinctHelds,
  NEAR_SLICE_FRACTION,
  renderVegaLiteSvg,
  sliceData,
  sliceGrid,
  sliceHelds,
  slicePairs,
  sliceSpec,
} from '../../src/report/html/index.js';
import type { Model, RuleTable } from '../../src/types.js';
import { fixtureScores, fixtureTable, writeFixtureRun } from '../browser/report-fixture.js';

/** Rule ids whose box holds `held` in every input outside the pair: written out independently of sliceData. */
function cutting(table: RuleTable, pair: readonly [number, number], held: readonly number[]): string[] {
  const ids: string[] = [];
  for (const { rule } of table.rules) {
    let inside = true;
    for (let k = 0; k < table.inputs.length; k++) {
      if (k === pair[0] || k === pair[1]) continue;
      if (held[k]! < rule.box[k]![0] || held[k]! > rule.box[k]![1]) inside = false;
    }
    if (inside) ids.push(rule.id);
  }
  return ids;
}

/** Outline shapes in an SVG: the rect paths inside the `outline_<status>_marks` groups. */
function outlineCount(svg: string): number {
  let n = 0;
  for (const m of svg.matchAll(/<g class="mark-rect role-mark outline_(?:proven|sampled|refuted|unknown)_marks"[^>]*>(.*?)<\/g>/g)) {
    n += (m[1]!.match(/<path /g) ?? []).length;
  }
  return n;
}

describe('slicePairs', () => {
  it('orders pairs by joint constraint counts, then by single counts', () => {
    // hand count on the fixture: every pair is constrained together by 4 rules; singles:
    // range_m 4, lateral_m 4, climb_mps 6, so the pairs with climb_mps come first
    expect(slicePairs(fixtureTable())).toEqual([
      [0, 2],
      [1, 2],
      [0, 1],
    ]);
    expect(slicePairs(fixtureTable(), 1)).toEqual([[0, 2]]);
  });
});

describe('sliceHelds', () => {
  it('holds the other inputs at the centres of the three largest rules', () => {
    const h = sliceHelds(fixtureTable());
    // R4 (3/8 of the domain), R5 (5/32), then R1, R3 and R6 tie at 1/8 and R1 wins by id
    expect(h.map((x) => x.ruleId)).toEqual(['R4', 'R5', 'R1']);
    expect(h[0]!.x).toEqual([5, 4, 0.375]);
    expect(h[1]!.x).toEqual([2.5, 2.5, -0.5]);
  });

  it('drops held points that give the same plane for a pair', () => {
    // R5 and R1 centres share climb_mps = -0.5: one plane for the pair (range_m, lateral_m)
    const h = sliceHelds(fixtureTable());
    expect(distinctHelds(h, [0, 1]).map((x) => x.ruleId)).toEqual(['R4', 'R5']);
    expect(distinctHelds(h, [0, 2]).map((x) => x.ruleId)).toEqual(['R4', 'R5', 'R1']);
  });
});

describe('sliceData', () => {
  it('outlines exactly the rules whose boxes hold the held point', () => {
    const table = fixtureTable();
    const n = 4;
    const grid = new Int32Array(n * n);
    for (const pair of slicePairs(table)) {
      for (const h of sliceHelds(table)) {
        const d = sliceData(table, pair, h.x, grid, n);
        expect(d.outlines.map((o) => o.id)).toEqual(cutting(table, pair, h.x));
      }
    }
  });

  it('draws a counterexample only within the near-slice distance of the plane', () => {
    const table = fixtureTable();
    const grid = new Int32Array(4);
    // R4's counterexample is at range_m = 5: on the (lateral_m, climb_mps) plane held at range_m = 5
    expect(sliceData(table, [1, 2], [5, 0, 0], grid, 2).points).toEqual([{ id: 'R4', x: 5.2, y: 0.7, advisory: 'climb' }]);
    // just inside and just outside NEAR_SLICE_FRACTION of range_m's 10 m range
    const edge = NEAR_SLICE_FRACTION * 10;
    expect(sliceData(table, [1, 2], [5 + 0.99 * edge, 0, 0], grid, 2).points).toHaveLength(1);
    expect(sliceData(table, [1, 2], [5 + 1.01 * edge, 0, 0], grid, 2).points).toHaveLength(0);
  });

  it('merges equal neighbours of a grid row into one run covering the same cells', () => {
    const table = fixtureTable();
    // 3 × 3 grid over range_m [0, 10] × lateral_m [0, 8]: rows [0, 0, 1], [2, 2, 2], [1, 0, 0]
    const d = sliceData(table, [0, 1], [0, 0, 0], Int32Array.from([0, 0, 1, 2, 2, 2, 1, 0, 0]), 3);
    expect(d.cells).toEqual([
      { x0: 0, x1: 20 / 3, y0: 0, y1: 8 / 3, advisory: 'go_left' },
      { x0: 20 / 3, x1: 10, y0: 0, y1: 8 / 3, advisory: 'go_right' },
      { x0: 0, x1: 10, y0: 8 / 3, y1: 16 / 3, advisory: 'climb' },
      { x0: 0, x1: 10 / 3, y0: 16 / 3, y1: 8, advisory: 'go_right' },
      { x0: 10 / 3, x1: 10, y0: 16 / 3, y1: 8, advisory: 'go_left' },
    ]);
  });
});

describe('sliceGrid through onnxruntime', () => {
  let model: Model;
  beforeAll(async () => {
    const run = writeFixtureRun();
    model = await loadModel(loadScenario(run.scenarioPath));
  });
  afterAll(async () => model?.close());

  it('gives the closed-form argmax of the fixture network at every cell centre', async () => {
    const table = fixtureTable();
    const n = 40;
    const held = [0, 0, 0.3];
    const grid = await sliceGrid(table.inputs, [0, 1], held, model.evaluate, n);
    // cells whose two best closed-form scores are within float32 rounding of each other could
    // go either way: float32 relative error ~6e-8 on scores of magnitude <= 10, so 1e-4 is far
    // above it; none of this grid's centres is that close, and the count is checked
    const TIE = 1e-4;
    let compared = 0;
    for (let cy = 0; cy < n; cy++) {
      for (let cx = 0; cx < n; cx++) {
        const x = ((cx + 0.5) / n) * 10;
        const y = ((cy + 0.5) / n) * 8;
        const s = fixtureScores(x, y, held[2]!);
        const order = [0, 1, 2].sort((a, b) => s[b]! - s[a]!);
        if (s[order[0]!]! - s[order[1]!]! < TIE) continue;
        expect(grid[cy * n + cx], `cell (${cx}, ${cy})`).toBe(order[0]);
        compared++;
      }
    }
    expect(compared).toBe(n * n);
  });

  it('renders one outline per rule cutting each plane, for every pair and held point', async () => {
    const table = fixtureTable();
    const set = await buildSlices(table, model.evaluate, { grid: 16 });
    // 3 pairs; (range_m, lateral_m) has 2 distinct planes, the others 3
    expect(set.figures).toHaveLength(8);
    for (const f of set.figures) {
      const expected = cutting(table, f.pair, set.helds[f.held]!.x);
      expect(f.outlineIds).toEqual(expected);
      expect(outlineCount(f.svg)).toBe(expected.length);
      // each outline links to its rule's evidence
      for (const id of expected) expect(f.svg).toContain(`href="#ev-${id}"`);
    }
  });
});

describe('sliceSpec', () => {
  it('renders the colour map without per-cell accessibility labels and with unit axis titles', async () => {
    const table = fixtureTable();
    const grid = Int32Array.from({ length: 16 }, (_, i) => i % 3);
    const svg = await renderVegaLiteSvg(sliceSpec(table, sliceData(table, [0, 2], [0, 4, 0], grid, 4)));
    const cells = /<g class="mark-rect role-mark cells_marks"[^>]*>(.*?)<\/g>/.exec(svg)![1]!;
    expect(cells).not.toContain('aria-label');
    expect(svg).toContain('range_m (m)');
    expect(svg).toContain('climb_mps (m/s)');
    for (const a of table.advisories) expect(svg).toContain(`>${a}</text>`);
  });
});
