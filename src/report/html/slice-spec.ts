import type { RuleTable } from '../../types.js';
import { advisoryPalette } from './palette.js';
import { HALO_WIDTH, OUTLINE_ORDER, OUTLINE_STYLES, POINT_FILL } from './outline-styles.js';
import type { SliceData } from './slice-data.js';

/** Plot area of a slice, in pixels. */
export const SLICE_PLOT_SIZE = 340;
/** Above this many rule outlines on one slice, their id labels are left off (they would overlap). */
export const MAX_LABELLED_OUTLINES = 20;

/** Stroke width (pixels) drawn around each colour-map run in its own colour, to hide seams. */
const SEAM_STROKE = 1;

type Spec = Record<string, unknown>;

function axisTitle(table: RuleTable, i: number): string {
  const inp = table.inputs[i]!;
  return inp.unit ? `${inp.name} (${inp.unit})` : inp.name;
}

/**
 * The vega-lite specification of one slice plot: the network's advisory regions as a colour map
 * (palette: palette.ts), each rule box cutting the slice outlined by status (outline-styles.ts),
 * rule ids beside the outlines, and nearby counterexamples as crosses. Layers are named so that
 * the SVG groups carry classes `cells_marks`, `outline_<status>_marks`, `counterexamples_marks`.
 */
export function sliceSpec(table: RuleTable, data: SliceData): Spec {
  const [p, q] = data.pair;
  const a = table.inputs[p]!;
  const b = table.inputs[q]!;
  const xScale = { domain: [a.min, a.max], nice: false, zero: false };
  const yScale = { domain: [b.min, b.max], nice: false, zero: false };
  const xt = axisTitle(table, p);
  const yt = axisTitle(table, q);
  const box = {
    x: { field: 'x0', type: 'quantitative', scale: xScale, title: xt },
    x2: { field: 'x1' },
    y: { field: 'y0', type: 'quantitative', scale: yScale, title: yt },
    y2: { field: 'y1' },
  };
  const palette = advisoryPalette(table.advisories.length);
  const layer: Spec[] = [
    {
      name: 'cells',
      data: { values: data.cells },
      // aria off: per-cell labels would make the SVG ~2.5x larger and say nothing useful.
      // A thin stroke in the cell's own colour closes the anti-aliasing seams between rows.
      mark: { type: 'rect', aria: false, strokeWidth: SEAM_STROKE },
      encoding: {
        ...box,
        stroke: { field: 'advisory', type: 'nominal', scale: { domain: [...table.advisories], range: palette }, legend: null },
        color: {
          field: 'advisory',
          type: 'nominal',
          scale: { domain: [...table.advisories], range: palette },
          legend: { title: "network's advisory", orient: 'right' },
        },
      },
    },
  ];
  if (data.outlines.length > 0) {
    layer.push({ name: 'halo', data: { values: data.outlines }, mark: { type: 'rect', filled: false, stroke: '#ffffff', strokeWidth: HALO_WIDTH, aria: false }, encoding: box });
  }
  for (const status of OUTLINE_ORDER) {
    const values = data.outlines.filter((o) => o.status === status);
    if (values.length === 0) continue;
    const s = OUTLINE_STYLES[status];
    layer.push({
      name: `outline_${status}`,
      data: { values },
      mark: { type: 'rect', filled: false, stroke: s.stroke, strokeWidth: s.strokeWidth, ...(s.dash.length ? { strokeDash: [...s.dash] } : {}) },
      encoding: { ...box, description: { field: 'label' }, href: { field: 'href' } },
      transform: [
        { calculate: `datum.id + ' (' + datum.status + '): expect ' + datum.allowed`, as: 'label' },
        { calculate: `'#ev-' + datum.id`, as: 'href' },
      ],
    });
  }
  if (data.outlines.length > 0 && data.outlines.length <= MAX_LABELLED_OUTLINES) {
    // a white copy under the black text keeps the ids readable on dark regions
    for (const [name, extra] of [
      ['label_halo', { stroke: '#ffffff', strokeWidth: 3, fill: '#ffffff' }],
      ['outline_labels', { fill: '#000000' }],
    ] as const) {
      layer.push({
        name,
        data: { values: data.outlines },
        mark: { type: 'text', align: 'left', baseline: 'top', dx: 3, dy: 3, fontSize: 10, fontWeight: 'bold', aria: false, ...extra },
        encoding: { x: box.x, y: { field: 'y1', type: 'quantitative', scale: yScale, title: yt }, text: { field: 'id' } },
      });
    }
  }
  if (data.points.length > 0) {
    layer.push({
      name: 'counterexamples',
      data: { values: data.points },
      mark: { type: 'point', shape: 'cross', filled: true, fill: POINT_FILL, stroke: '#ffffff', strokeWidth: 1, size: 90, opacity: 1 },
      encoding: {
        x: { field: 'x', type: 'quantitative', scale: xScale, title: xt },
        y: { field: 'y', type: 'quantitative', scale: yScale, title: yt },
        description: { field: 'label' },
      },
      transform: [{ calculate: `'counterexample of ' + datum.id + ': network gives ' + datum.advisory`, as: 'label' }],
    });
  }
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: SLICE_PLOT_SIZE,
    height: SLICE_PLOT_SIZE,
    background: '#ffffff',
    config: { axis: { grid: false, labelFontSize: 11, titleFontSize: 12 }, legend: { labelFontSize: 11, titleFontSize: 12 } },
    layer,
  };
}
