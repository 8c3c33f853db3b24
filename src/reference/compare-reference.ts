import type { Evaluator, Rule } from '../types.js';
import { gridBoxes } from './grid-boxes.js';
import type { ReferenceGrid } from './reference-grid.js';

/** Agreement at the grid points whose table advisory is one advisory. */
export interface AdvisoryAgreement {
  readonly advisory: number;
  /** Grid points where the table gives this advisory. */
  readonly points: number;
  /** Of those, points where the network gives it too. */
  readonly agree: number;
}

/**
 * A group of disagreeing grid points: every grid point inside `rule.box` has the table's
 * advisory `table` and the network's advisory `rule.allowed[0]`. The statement covers the grid
 * points in the box only, not the inputs between them.
 */
export interface Disagreement {
  readonly rule: Rule;
  readonly table: number;
  readonly points: number;
}

/** The network compared with a reference lookup table at the table's grid points. */
export interface ReferenceComparison {
  readonly file: string;
  /** Grid values per input. */
  readonly axes: readonly (readonly number[])[];
  readonly points: number;
  readonly agree: number;
  readonly perAdvisory: readonly AdvisoryAgreement[];
  /** confusion[t][m]: grid points where the table says t and the network m. */
  readonly confusion: readonly (readonly number[])[];
  /** Disagreeing grid points grouped into boxes, most points first. */
  readonly disagreements: readonly Disagreement[];
}

/**
 * Compares the network with a reference lookup table at every grid point of the table: the
 * network (run by the evaluator: onnxruntime on the model file) gives an advisory at each point;
 * agreement is counted overall and per table advisory, with the table × network confusion
 * matrix. Disagreeing points are grouped, per (table, network) advisory pair, into boxes of grid
 * points (`gridBoxes`), written as rules `when … expect <network advisory>` over the grid values.
 * Nothing is said about inputs between grid points.
 * @param k number of advisories
 */
export async function compareReference(grid: ReferenceGrid, evaluate: Evaluator, k: number): Promise<ReferenceComparison> {
  const { n } = grid;
  const net = (await evaluate(grid.x, n)).advisory;
  const flat = new Float64Array(k * k);
  let agree = 0;
  for (let i = 0; i < n; i++) {
    flat[grid.advisory[i]! * k + net[i]!]!++;
    if (grid.advisory[i] === net[i]) agree++;
  }
  const confusion = Array.from({ length: k }, (_, t) => Array.from(flat.subarray(t * k, t * k + k)));
  const perAdvisory = confusion.map((row, t) => ({ advisory: t, points: row.reduce((s, c) => s + c, 0), agree: row[t]! }));
  const shape = grid.axes.map((a) => a.length);
  const groups: Array<Omit<Disagreement, 'rule'> & { box: Array<[number, number]>; network: number }> = [];
  const marked = new Uint8Array(n);
  for (let t = 0; t < k; t++) {
    for (let m = 0; m < k; m++) {
      if (t === m || flat[t * k + m] === 0) continue;
      for (let i = 0; i < n; i++) marked[i] = grid.advisory[i] === t && net[i] === m ? 1 : 0;
      for (const b of gridBoxes(marked, shape)) {
        const box = grid.axes.map((a, f): [number, number] => [a[b.lo[f]!]!, a[b.hi[f]!]!]);
        groups.push({ box, network: m, table: t, points: b.points });
      }
    }
  }
  groups.sort((p, q) => q.points - p.points || p.table - q.table || p.network - q.network);
  const disagreements = groups.map((g, i): Disagreement => ({
    rule: { id: `D${i + 1}`, box: g.box, allowed: [g.network], origin: { kind: 'mined' } },
    table: g.table,
    points: g.points,
  }));
  return { file: grid.file, axes: grid.axes, points: n, agree, perAdvisory, confusion, disagreements };
}
