/**
 * The four sweeps of the scaling study and their settings. Every point runs the built CLI in
 * a child process with one onnxruntime thread and one proof worker, so times add up the same
 * way on any machine and the peak memory is the job's own.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { CostJob, MeasuredPoint } from '../../src/scale/index.js';
import { expectationRules } from './expectations.js';
import { randomNetwork, trainedNetwork, type StudyNetwork } from './make-network.js';
import { measure } from './measure.js';

/** Settings shared by every point unless a sweep changes them. */
export const STUDY = {
  seed: 1,
  samples: 20_000,
  checkSamples: 2_000,
  fidelitySamples: 10_000,
  maxRules: 30,
  inputs: [2, 3, 4, 5, 6, 7, 8, 10],
  /** Proofs of the expectation rules (inputs sweep): a budget that lets hard rules show their growth. */
  hardProof: { boxes: 20_000, seconds: 5 },
  /** Proofs of mined tables: most rules are refuted in a few pieces; this caps the rest. */
  minedProof: { boxes: 200, seconds: 2 },
  widths: [16, 32, 64, 128, 256],
  depths: [2, 3, 4, 6, 8],
  /** Width of the depth sweep, and the one large corner network. */
  depthWidth: 64,
  corner: [256, 8] as const,
  /** Rules of the network sweep (kept small: one proof piece of the corner network takes ~1 s). */
  networkRules: 10,
  networkInputs: 5,
  rules: [10, 25, 50, 100, 200, 400],
  /** Samples of the rules sweep (enough leaves for 400 rules). */
  rulesSamples: 50_000,
  samplesSweep: [20_000, 50_000, 100_000, 200_000],
} as const;

const FLAGS = ['--seed', String(STUDY.seed), '--threads', '1', '--jobs', '1', '--no-report'];

function job(net: StudyNetwork, kind: CostJob['kind'], rest: Partial<CostJob>): CostJob {
  return {
    kind, inputs: net.inputs, weights: net.weights, layers: net.layers,
    samples: 0, fidelitySamples: 0, checkSamples: 0, rules: 0,
    prove: kind === 'prove', proveBoxes: 0, proveSeconds: 0, jobs: 1, ...rest,
  };
}

/** mine (no proofs) → check of its table (no proofs) → prove of its table; returns the three points. */
async function mineCheckProve(
  sweep: string, label: string, net: StudyNetwork, dir: string, cwd: string,
  o: { samples: number; maxRules: number; proof: { boxes: number; seconds: number }; skipProve?: boolean },
): Promise<MeasuredPoint[]> {
  const run = join(dir, `${sweep}-${label}`);
  const m = await measure(sweep, label, job(net, 'mine', { samples: o.samples, fidelitySamples: STUDY.fidelitySamples, checkSamples: STUDY.checkSamples, rules: o.maxRules }), [
    'mine', net.scenarioPath, '--out', run, '--samples', String(o.samples), '--max-rules', String(o.maxRules),
    '--check-samples', String(STUDY.checkSamples), '--fidelity-samples', String(STUDY.fidelitySamples), '--no-prove', ...FLAGS,
  ], cwd);
  const c = await measure(sweep, label, job(net, 'check', { checkSamples: STUDY.checkSamples, rules: m.rulesOut }), [
    'check', net.scenarioPath, join(run, 'rules.json'), '--out', `${run}-check`, '--check-samples', String(STUDY.checkSamples), '--no-prove', ...FLAGS,
  ], cwd);
  if (o.skipProve) return [m, c];
  const p = await measure(sweep, label, job(net, 'prove', { rules: m.rulesOut, proveBoxes: o.proof.boxes, proveSeconds: o.proof.seconds }), [
    'prove', run, '--prove-boxes', String(o.proof.boxes), '--prove-seconds', String(o.proof.seconds), '--threads', '1', '--jobs', '1',
  ], cwd);
  return [m, c, p];
}

/** Inputs 2 → 10: trained networks; the mined table, and the expectation rules proved. */
export async function inputsSweep(dir: string, cwd: string, inputs: readonly number[] = STUDY.inputs): Promise<MeasuredPoint[]> {
  const points: MeasuredPoint[] = [];
  for (const d of inputs) {
    const net = trainedNetwork(dir, d, 100 + d);
    process.stderr.write(`inputs ${d}: trained, agreement with the policy ${(100 * net.agreement!).toFixed(1)} %\n`);
    points.push(...(await mineCheckProve('inputs', `d${d}`, net, dir, cwd, { samples: STUDY.samples, maxRules: STUDY.maxRules, proof: STUDY.minedProof })));
    const rulesFile = join(dir, `expectations-${d}.rules`);
    writeFileSync(rulesFile, expectationRules(d));
    const run = join(dir, `inputs-d${d}-expectations`);
    const c = await measure('inputs', `d${d}-expectations`, job(net, 'check', { checkSamples: STUDY.checkSamples, rules: 5 }), [
      'check', net.scenarioPath, rulesFile, '--out', run, '--check-samples', String(STUDY.checkSamples), '--no-prove', ...FLAGS,
    ], cwd);
    points.push(c);
    points.push(await measure('inputs', `d${d}-expectations`, job(net, 'prove', { rules: 5, proveBoxes: STUDY.hardProof.boxes, proveSeconds: STUDY.hardProof.seconds }), [
      'prove', run, '--prove-boxes', String(STUDY.hardProof.boxes), '--prove-seconds', String(STUDY.hardProof.seconds), '--threads', '1', '--jobs', '1',
    ], cwd));
  }
  return points;
}

/** Widths 16 → 256 (depth 2), depths 2 → 8 (width 64) and one 256 × 8 corner: seeded random networks. */
export async function networkSweep(dir: string, cwd: string, only?: readonly [number, number][]): Promise<MeasuredPoint[]> {
  const shapes: readonly [number, number][] = only ?? [
    ...STUDY.widths.map((w): [number, number] => [w, 2]),
    ...STUDY.depths.filter((l) => l !== 2).map((l): [number, number] => [STUDY.depthWidth, l]),
    [STUDY.corner[0], STUDY.corner[1]],
  ];
  const points: MeasuredPoint[] = [];
  for (const [w, l] of shapes) {
    const net = randomNetwork(dir, STUDY.networkInputs, w, l, 7);
    points.push(...(await mineCheckProve('network', `${w}x${l}`, net, dir, cwd, { samples: STUDY.samples, maxRules: STUDY.networkRules, proof: STUDY.minedProof })));
  }
  return points;
}

/** --max-rules 10 → 400 on one trained 5-input network; and --samples 20k → 200k (mine only). */
export async function rulesAndSamplesSweeps(
  dir: string, cwd: string, rules: readonly number[] = STUDY.rules, samples: readonly number[] = STUDY.samplesSweep,
): Promise<MeasuredPoint[]> {
  const net = trainedNetwork(dir, STUDY.networkInputs, 205);
  const points: MeasuredPoint[] = [];
  for (const r of rules) {
    points.push(...(await mineCheckProve('rules', `r${r}`, net, dir, cwd, { samples: STUDY.rulesSamples, maxRules: r, proof: STUDY.minedProof })));
  }
  for (const s of samples) {
    points.push(...(await mineCheckProve('samples', `s${s / 1000}k`, net, dir, cwd, { samples: s, maxRules: STUDY.maxRules, proof: STUDY.minedProof, skipProve: true })));
  }
  return points;
}
