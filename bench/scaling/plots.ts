/**
 * The study's figures: vega-lite specifications rendered to SVG on the server side by the
 * report's own renderer (src/report/html/render-svg.ts). Times on log scales; the inputs plot
 * adds the fitted exponential curve of a hard rule's proof pieces.
 */
import type { CostModel, MeasuredPoint } from '../../src/scale/index.js';
import { renderVegaLiteSvg } from '../../src/report/html/render-svg.js';

const WIDTH = 420;
const HEIGHT = 260;

/** Label of the job for legends: prove of expectation rules is its own series. */
function series(p: MeasuredPoint): string {
  return p.label.endsWith('-expectations') ? `${p.job.kind} (expectation rules)` : p.job.kind;
}

function timeChart(title: string, rows: object[], x: { field: string; title: string; log: boolean }, dashBySeries = false): Record<string, unknown> {
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title, width: WIDTH, height: HEIGHT, background: 'white',
    data: { values: rows },
    mark: { type: 'line', point: true },
    encoding: {
      x: { field: x.field, type: 'quantitative', title: x.title, scale: x.log ? { type: 'log' } : { zero: false } },
      y: { field: 'seconds', type: 'quantitative', title: 'CPU seconds (log)', scale: { type: 'log' } },
      color: { field: 'job', type: 'nominal', title: 'job', legend: { labelLimit: 320 } },
      ...(dashBySeries ? { shape: { field: 'series', type: 'nominal', title: 'series', legend: { labelLimit: 320 } }, detail: { field: 'series', type: 'nominal' } } : {}),
    },
  };
}

/** Renders every figure; returns file name → SVG text. */
export async function scalingPlots(points: readonly MeasuredPoint[], model: CostModel): Promise<Map<string, string>> {
  const out = new Map<string, string>();
  const of = (sweep: string) => points.filter((p) => p.sweep === sweep);
  const rows = (ps: MeasuredPoint[], x: (p: MeasuredPoint) => number, s = '') => ps.map((p) => ({ x: x(p), seconds: p.cpuSeconds, job: series(p), series: s }));
  out.set('inputs-time.svg', await renderVegaLiteSvg(timeChart('Time against inputs (trained d-32-32-4 networks)', rows(of('inputs'), (p) => p.job.inputs), { field: 'x', title: 'inputs', log: false })));
  const net = of('network');
  const widthRows = rows(net.filter((p) => p.label.endsWith('x2')), (p) => p.job.weights, 'width 16 → 256, depth 2');
  const depthRows = rows(net.filter((p) => p.label.startsWith('64x') || p.label === '64x2'), (p) => p.job.weights, 'depth 2 → 8, width 64');
  out.set('network-time.svg', await renderVegaLiteSvg(timeChart('Time against network size (random 5-input networks, 10 rules)', [...widthRows, ...depthRows, ...rows(net.filter((p) => p.label === '256x8'), (p) => p.job.weights, 'corner: 256 × 8')], { field: 'x', title: 'weights (log)', log: true }, true)));
  out.set('rules-time.svg', await renderVegaLiteSvg(timeChart('Time against rules (--max-rules 10 → 400, 50,000 samples)', rows(of('rules'), (p) => p.rulesOut), { field: 'x', title: 'rules in the table (log)', log: true })));
  out.set('samples-time.svg', await renderVegaLiteSvg(timeChart('mine and check time against --samples', rows(of('samples'), (p) => p.job.samples), { field: 'x', title: 'samples (log)', log: true })));
  // proof pieces of the hardest rule not refuted, with the fitted exponential
  const hard = of('inputs').filter((p) => p.job.kind === 'prove' && (p.maxPieces ?? 0) > 0);
  const measured = hard.map((p) => ({ inputs: p.job.inputs, pieces: p.maxPieces, what: (p.statuses['unknown'] ?? 0) > 0 ? 'measured, budget hit (lower bound, not fitted)' : 'measured, all settled (fitted)' }));
  const fitted = [2, 3, 4, 5, 6, 7, 8, 9, 10].map((d) => ({ inputs: d, pieces: Math.exp(model.hardLog + model.hardGrowth * d), what: `fit: ×${Math.exp(model.hardGrowth).toFixed(2)} per input` }));
  out.set('inputs-pieces.svg', await renderVegaLiteSvg({
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: 'Branch-and-bound pieces of the hardest rule proved (not refuted)', width: WIDTH, height: HEIGHT, background: 'white',
    layer: [
      { data: { values: fitted }, mark: { type: 'line', strokeDash: [4, 3] }, encoding: { x: { field: 'inputs', type: 'quantitative' }, y: { field: 'pieces', type: 'quantitative', scale: { type: 'log' } }, color: { field: 'what', type: 'nominal', title: '', legend: { labelLimit: 320, orient: 'bottom', direction: 'vertical' } } } },
      { data: { values: measured }, mark: { type: 'point', filled: true, size: 60 }, encoding: { x: { field: 'inputs', type: 'quantitative', title: 'inputs' }, y: { field: 'pieces', type: 'quantitative', title: 'pieces (log)', scale: { type: 'log' } }, color: { field: 'what', type: 'nominal', title: '' } } },
    ],
  }));
  const memRows = points.filter((p) => p.sweep !== 'samples').map((p) => ({ weights: p.job.weights, rules: p.rulesOut, mib: p.peakRssMiB, job: p.job.kind, sweep: p.sweep }));
  out.set('memory.svg', await renderVegaLiteSvg({
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: 'Peak resident memory of each job (all sweeps)', width: WIDTH, height: HEIGHT, background: 'white',
    data: { values: memRows },
    mark: { type: 'point', filled: true, size: 50 },
    encoding: {
      x: { field: 'weights', type: 'quantitative', title: 'weights (log)', scale: { type: 'log' } },
      y: { field: 'mib', type: 'quantitative', title: 'peak RSS, MiB', scale: { zero: false } },
      color: { field: 'job', type: 'nominal' },
      shape: { field: 'sweep', type: 'nominal' },
    },
  }));
  return out;
}
