/**
 * What the sampling benchmark and its fresh-process runs share: the network, the scenario,
 * raw onnxruntime sessions, and the CLI's default settings. Not a benchmark (run-all skips `_`
 * files).
 */
import { availableParallelism } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as ort from 'onnxruntime-node';
import type { DenseLayer } from '../src/model/index.js';
import { threadsForWork } from '../src/pipeline/model-jobs.js';
import { createRng } from '../src/sampling/index.js';
import { loadScenario } from '../src/scenario/index.js';
import type { InputSpec, Scenario } from '../src/types.js';
import { benchMineSettings } from './_mine-defaults.js';

/** The network: D inputs, LAYERS hidden ReLU layers of HIDDEN units, K outputs. */
export const D = 5;
export const HIDDEN = 50;
export const LAYERS = 6;
export const K = 5;
/** Rows of raw's fixed float32 batch. */
export const RAW_BATCH = 10_000;
/** `specula mine`'s defaults, with its default --jobs (the available cores). */
export const CLI = benchMineSettings(availableParallelism());

/**
 * Threads the CLI's model work runs on for a mine run of `samples` with its default settings:
 * mine's count of network evaluations (samples, dense checks of every rule, fidelity; see
 * src/pipeline/mine.ts) through `threadsForWork`; the benchmark has two workers, so at most 2.
 */
export function cliThreads(samples: number): number {
  const evaluations = samples + CLI.maxRules * CLI.checkSamples + CLI.fidelitySamples;
  return Math.min(2, threadsForWork(evaluations, CLI.jobs));
}

/** The survey-boat scenario's input box (the benchmark's network is its own, seeded below). */
export const INPUTS: readonly InputSpec[] = loadScenario(fileURLToPath(new URL('../scenarios/survey-boat/scenario.json', import.meta.url))).inputs;

/** A seeded random ReLU network (He-scaled weights) so that its advisories vary over the box. */
export function network(seed: number): DenseLayer[] {
  const rng = createRng(seed);
  const layer = (inSize: number, outSize: number, activation: 'relu' | 'none'): DenseLayer => {
    const scale = Math.sqrt(6 / inSize);
    return {
      inSize,
      outSize,
      weights: Array.from({ length: inSize * outSize }, () => (2 * rng() - 1) * scale),
      bias: Array.from({ length: outSize }, () => 0.1 * (2 * rng() - 1)),
      activation,
    };
  };
  const layers = [layer(D, HIDDEN, 'relu')];
  for (let i = 1; i < LAYERS; i++) layers.push(layer(HIDDEN, HIDDEN, 'relu'));
  layers.push(layer(HIDDEN, K, 'none'));
  return layers;
}

export function median(v: number[]): number {
  const s = [...v].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

export async function rawRun(session: ort.InferenceSession, input: ort.Tensor, samples: number): Promise<number> {
  const t0 = performance.now();
  for (let done = 0; done < samples; done += RAW_BATCH) await session.run({ input });
  return performance.now() - t0;
}

/** The benchmark's scenario around the model file at `modelPath`. */
export function benchScenario(modelPath: string): Scenario {
  return {
    name: 'bench',
    title: 'sampling benchmark',
    scenarioPath: join(dirname(modelPath), 'scenario.json'),
    scenarioSha256: '',
    modelPath,
    decision: 'argmax',
    inputs: INPUTS,
    advisories: ['a', 'b', 'c', 'd', 'e'],
    normalize: { offset: INPUTS.map((s) => (s.min + s.max) / 2), scale: INPUTS.map((s) => (s.max - s.min) / 2) },
  };
}

/** A session with the model stage's settings on `threads` intra-op threads. */
export function rawSession(modelPath: string, threads: number): Promise<ort.InferenceSession> {
  return ort.InferenceSession.create(modelPath, { intraOpNumThreads: threads, interOpNumThreads: 1, executionMode: 'sequential', graphOptimizationLevel: 'all' });
}

/** Raw's fixed float32 batch (seeded values in the network's normalised range). */
export function rawInput(): ort.Tensor {
  const rng = createRng(1);
  return new ort.Tensor('float32', Float32Array.from({ length: RAW_BATCH * D }, () => 2 * rng() - 1), [RAW_BATCH, D]);
}
