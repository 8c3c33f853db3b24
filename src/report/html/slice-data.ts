import type { RuleStatus, RuleTable } from '../../types.js';

/**
 * How close (as a share of each held input's range) a counterexample must be to the slice's
 * plane, in every input outside the pair, to be drawn on it: 5 % keeps the points that the
 * plot's picture still describes, without hiding those a little off the plane.
 */
export const NEAR_SLICE_FRACTION = 0.05;

/** A run of equal advisories along one row of the grid, in units. */
export interface SliceCell {
  readonly x0: number;
  readonly x1: number;
  readonly y0: number;
  readonly y1: number;
  readonly advisory: string;
}

/** A rule's box cut by the slice plane, in units of the pair. */
export interface SliceOutline {
  readonly id: string;
  readonly status: RuleStatus;
  readonly allowed: string;
  readonly x0: number;
  readonly x1: number;
  readonly y0: number;
  readonly y1: number;
}

export interface SlicePoint {
  readonly id: string;
  readonly x: number;
  readonly y: number;
  readonly advisory: string;
}

export interface SliceData {
  readonly pair: readonly [number, number];
  readonly cells: readonly SliceCell[];
  readonly outlines: readonly SliceOutline[];
  readonly points: readonly SlicePoint[];
}

/**
 * The drawable content of one slice: the grid's advisories merged into runs along each row
 * (the same picture as one rectangle a cell, with ~10–40× fewer shapes), the boxes of the rules
 * whose intervals hold the held point in every input outside the pair (closed intervals, as the
 * rules are), and the counterexamples within NEAR_SLICE_FRACTION of the plane.
 * @param grid advisories from `sliceGrid` (n × n, row-major, cx fastest)
 */
export function sliceData(table: RuleTable, pair: readonly [number, number], held: readonly number[], grid: Int32Array, n: number): SliceData {
  const [p, q] = pair;
  const a = table.inputs[p]!;
  const b = table.inputs[q]!;
  const dx = (a.max - a.min) / n;
  const dy = (b.max - b.min) / n;
  const cells: SliceCell[] = [];
  for (let cy = 0; cy < n; cy++) {
    let start = 0;
    for (let cx = 1; cx <= n; cx++) {
      if (cx === n || grid[cy * n + cx] !== grid[cy * n + start]) {
        cells.push({
          x0: a.min + start * dx,
          x1: cx === n ? a.max : a.min + cx * dx,
          y0: b.min + cy * dy,
          y1: cy === n - 1 ? b.max : b.min + (cy + 1) * dy,
          advisory: table.advisories[grid[cy * n + start]!] ?? '?',
        });
        start = cx;
      }
    }
  }
  const others = table.inputs.map((_, k) => k).filter((k) => k !== p && k !== q);
  const outlines: SliceOutline[] = [];
  const points: SlicePoint[] = [];
  for (const { rule, evidence } of table.rules) {
    if (others.every((k) => rule.box[k]![0] <= held[k]! && held[k]! <= rule.box[k]![1])) {
      outlines.push({
        id: rule.id,
        status: evidence.status,
        allowed: rule.allowed.map((j) => table.advisories[j]).join(' or '),
        x0: rule.box[p]![0],
        x1: rule.box[p]![1],
        y0: rule.box[q]![0],
        y1: rule.box[q]![1],
      });
    }
    const cx = evidence.counterexample;
    if (cx && others.every((k) => Math.abs(cx.x[k]! - held[k]!) <= NEAR_SLICE_FRACTION * (table.inputs[k]!.max - table.inputs[k]!.min))) {
      points.push({ id: rule.id, x: cx.x[p]!, y: cx.x[q]!, advisory: table.advisories[cx.advisory] ?? '?' });
    }
  }
  return { pair, cells, outlines, points };
}
