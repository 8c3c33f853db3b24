/**
 * Writes the generated section of docs/scaling.md (between its `scaling:generated` markers):
 * conditions, fitted coefficients, fit quality, the measured tables, the plots and the derived
 * warning thresholds. The rest of the page is written by hand.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { type CostModel, type MeasuredPoint, estimateSeconds, holds, measuredJob } from '../../src/scale/index.js';
import type { StudyData } from './study-data.js';
import { thresholdLines } from './thresholds.js';

const BEGIN = '<!-- scaling:generated -->';
const END = '<!-- /scaling:generated -->';

function table(points: readonly MeasuredPoint[]): string[] {
  const lines = ['| point | job | inputs | weights | layers | rules | wall s | CPU s | peak RSS MiB | statuses | pieces (max not refuted) |', '| --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- | ---: |'];
  for (const p of points) {
    const st = Object.entries(p.statuses).map(([k, v]) => `${v} ${k}`).join(', ');
    const pieces = p.pieces === undefined ? '' : `${p.pieces} (${p.maxPieces})`;
    lines.push(`| ${p.label} | ${p.job.kind} | ${p.job.inputs} | ${p.job.weights} | ${p.job.layers} | ${p.rulesOut} | ${p.wallSeconds} | ${p.cpuSeconds} | ${p.peakRssMiB.toFixed(0)} | ${st} | ${pieces} |`);
  }
  return lines;
}

/** Ratio estimate / measured CPU seconds per group of jobs: median and the extremes. */
function fitQuality(points: readonly MeasuredPoint[], model: CostModel): string[] {
  const lines = ['| jobs | points | median estimate / measured CPU | lowest | highest |', '| --- | ---: | ---: | ---: | ---: |'];
  const groups: [string, (p: MeasuredPoint) => boolean][] = [
    ['mine', (p) => p.job.kind === 'mine'],
    ['check', (p) => p.job.kind === 'check'],
    ['prove, tables with rules that hold', (p) => p.job.kind === 'prove' && holds(p)],
    ['prove, tables refuted at once', (p) => p.job.kind === 'prove' && !holds(p)],
  ];
  for (const [name, pick] of groups) {
    const r = points.filter(pick).map((p) => estimateSeconds(measuredJob(p), model).seconds / p.cpuSeconds).sort((a, b) => a - b);
    if (r.length === 0) continue;
    lines.push(`| ${name} | ${r.length} | ${r[Math.floor(r.length / 2)]!.toFixed(2)} | ${r[0]!.toFixed(2)} | ${r[r.length - 1]!.toFixed(2)} |`);
  }
  return lines;
}

const fmt = (v: number): string => (v === 0 ? '0' : v.toPrecision(3));

/** Replaces (or appends) the generated section of the page at `path`. */
export function writeScalingDoc(path: string, data: StudyData, m: CostModel): void {
  const of = (s: string) => data.points.filter((p) => p.sweep === s);
  const section = [
    BEGIN,
    '',
    `Measured ${data.date.slice(0, 16).replace('T', ' ')} UTC on ${data.machine}: ${data.points.length} jobs in ${data.studySeconds} s; ` +
      `load average ${data.loadBefore.map((v) => v.toFixed(1)).join(' / ')} before and ${data.loadAfter.map((v) => v.toFixed(1)).join(' / ')} after (1 / 5 / 15 min; other developers share the machine).`,
    '',
    '### Fitted cost model (src/scale/cost-coefficients.ts)',
    '',
    '| coefficient | value | meaning |', '| --- | ---: | --- |',
    `| start | ${fmt(m.start)} s | process start and model load (mine, check) |`,
    `| perSample | ${fmt(m.perSample)} s | per network evaluation |`,
    `| perSampleWeight | ${fmt(m.perSampleWeight)} s | per evaluation and weight |`,
    `| perSampleInput | ${fmt(m.perSampleInput)} s | tree learning, per sample and input |`,
    `| proveStart | ${fmt(m.proveStart)} s | start of prove |`,
    `| perRule | ${fmt(m.perRule)} s | per proved rule (set-up, counterexample search) |`,
    `| perRuleWeight | ${fmt(m.perRuleWeight)} s | per proved rule and weight |`,
    `| perPiece | ${fmt(m.perPiece)} s | per branch-and-bound piece |`,
    `| perPieceWeightLayer | ${fmt(m.perPieceWeightLayer)} s | per piece, weight and layer |`,
    `| hardLog, hardGrowth | ${fmt(m.hardLog)}, ${fmt(m.hardGrowth)} | pieces of a hard rule = exp(hardLog + hardGrowth·d): **×${Math.exp(m.hardGrowth).toFixed(2)} per input** |`,
    `| easyPieces, hardShare | ${fmt(m.easyPieces)}, ${fmt(m.hardShare)} | pieces per rule = easyPieces + hardShare·min(proveBoxes, hard pieces) |`,
    '',
    'How close the fitted model comes to the measured CPU times (test/scale/fit-cost-model.test.ts holds it to this):',
    '',
    ...fitQuality(data.points, m),
    '',
    '### Plots',
    '',
    '![time against inputs](scaling/inputs-time.svg)',
    '![proof pieces against inputs](scaling/inputs-pieces.svg)',
    '![time against network size](scaling/network-time.svg)',
    '![time against rules](scaling/rules-time.svg)',
    '![time against samples](scaling/samples-time.svg)',
    '![peak memory](scaling/memory.svg)',
    '',
    '### Inputs 2 → 10 (trained networks)', '', ...table(of('inputs')), '',
    '### Network size (random networks, 5 inputs)', '', ...table(of('network')), '',
    '### Rule table size (trained 5-input network, 50,000 samples)', '', ...table(of('rules')), '',
    '### Samples (trained 5-input network)', '', ...table(of('samples')), '',
    '### Estimates and warning thresholds', '', ...thresholdLines(m), '',
    END,
  ].join('\n');
  const old = existsSync(path) ? readFileSync(path, 'utf8') : `# Scaling\n\n${BEGIN}\n${END}\n`;
  const a = old.indexOf(BEGIN);
  const b = old.indexOf(END);
  const next = a >= 0 && b > a ? old.slice(0, a) + section + old.slice(b + END.length) : old.trimEnd() + '\n\n' + section + '\n';
  writeFileSync(path, next);
}
