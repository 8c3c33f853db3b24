import type { CheckedRule, Fidelity, Model, Rule, Scenario } from '../types.js';
import { DEFAULT_BATCH_SIZE, type OnnxModel } from '../model/index.js';
import { evaluatorLabeller, type RowLabeller } from '../sampling/index.js';
import { checkRules, fidelityChunk, fidelityChunkSizes, fidelityFromCounts, measureFidelity, type CheckOptions, type FidelityCounts, type FidelityOptions } from '../check/index.js';
import { workerPool } from '../pool/index.js';
import type { ModelResult, ModelTask, ModelWorkerInit } from './model-worker-protocol.js';
import { sharedSampleArrays } from './shared-sample-arrays.js';

/**
 * Batches handed to one model worker at a time while sampling: with two, a worker starts its
 * next batch as soon as one is done instead of waiting a round trip for the main thread.
 */
export const LABEL_DEPTH = 2;

/**
 * Network evaluations of a run (samples, dense checks of up to maxRules rules, fidelity) below
 * which a run (mine; check and diff for their dense checks) keeps the model's work in this
 * thread whatever `jobs` says (proofs still use it). A model worker takes 0.3–1.5 s to start (onnxruntime and the model loaded;
 * docs/performance.md, "Worker threads"), while 2,000,000 evaluations of the demo network take
 * about a second on one thread: below that, two threads save less than their start-up costs
 * (the demo — 200,000 samples, 56 rules, ~1.4 M evaluations — took 4.5–5.0 s end to end with
 * --jobs 1 and 5.0–6.3 s with model and proof workers on this loaded 2-core machine). The
 * results are the same either way.
 */
export const WORKER_MIN_EVALUATIONS = 2_000_000;

/**
 * Threads for the model's work of a run of `evaluations` network evaluations: `jobs` from
 * `minEvaluations` (default WORKER_MIN_EVALUATIONS) on, else 1. Never changes a result.
 */
export function threadsForWork(evaluations: number, jobs: number, minEvaluations = WORKER_MIN_EVALUATIONS): number {
  return evaluations >= minEvaluations ? jobs : 1;
}

/** The model's work of a run — labelling samples, dense checks, fidelity — on `jobs` threads. */
export interface ModelJobs {
  readonly jobs: number;
  /** For sampleDomain: labels batches of the sample set (on worker threads when jobs ≥ 2). */
  readonly labeller: RowLabeller;
  /** As check's checkRules, one rule per task. */
  checkRules(rules: readonly Rule[], options: CheckOptions): Promise<CheckedRule[]>;
  /** As check's measureFidelity, one chunk per task. */
  measureFidelity(rules: readonly Rule[], options: FidelityOptions): Promise<Fidelity>;
  /** Resolves once every worker has started (at once in this thread); work need not wait for it. */
  ready(): Promise<void>;
  close(): Promise<void>;
}

function isOnnxModel(model: Model): model is OnnxModel {
  return typeof (model as Partial<OnnxModel>).labelInPlace === 'function';
}

/** The same work in this thread, in order. */
function inThread(scenario: Scenario, model: Model): ModelJobs {
  const { inputs } = scenario;
  const d = inputs.length;
  const labeller: RowLabeller = isOnnxModel(model)
    ? {
        concurrency: 1,
        allocate: (n) => ({ x: new Float64Array(n * d), advisory: new Int32Array(n), margin: new Float32Array(n) }),
        labelInPlace: (a, from, rows) => model.labelInPlace(a.x, from, rows, a.advisory, a.margin),
      }
    : evaluatorLabeller(model.evaluate, d);
  return {
    jobs: 1,
    labeller,
    checkRules: (rules, options) => checkRules(rules, inputs, model.evaluate, options),
    measureFidelity: (rules, options) => measureFidelity(rules, inputs, model.evaluate, options),
    ready: async () => undefined,
    close: async () => undefined,
  };
}

/**
 * Runs the model's share of a run on `jobs` worker threads (src/pool), each with its own
 * onnxruntime session on the same file (checked by SHA-256) and batch size; in this thread when
 * jobs is 1. Work is cut into pieces that do not depend on the number of threads — batches of
 * rows at fixed places, one rule, one fidelity chunk with its own seed — and the results are
 * put back in order, so every figure is bit for bit the one a single thread computes.
 * Sampling's arrays live in shared memory: workers read the points and write the labels in
 * place, nothing is copied. While no worker has started yet, this thread takes pieces itself,
 * one at a time, so the workers' start-up does not hold the run up.
 * @param jobs threads (≥ 1)
 */
export function modelJobs(scenario: Scenario, model: Model, jobs: number): ModelJobs {
  if (jobs <= 1) return inThread(scenario, model);
  const init: ModelWorkerInit = {
    scenario,
    modelPath: model.path,
    modelSha256: model.sha256,
    batchSize: isOnnxModel(model) ? model.requestedBatchSize : DEFAULT_BATCH_SIZE,
  };
  const pool = workerPool<ModelTask, ModelResult>({ base: import.meta.url, name: './model-worker', workerData: init, size: jobs, depth: LABEL_DEPTH });
  const local = inThread(scenario, model);
  // Until the first worker has started (loading onnxruntime takes a few hundred ms), this
  // thread takes one piece at a time itself: the same pieces, so the same results.
  let localBusy = false;
  const either = async <R>(here: () => Promise<R>, there: () => Promise<R>): Promise<R> => {
    if (pool.started > 0 || localBusy) return there();
    localBusy = true;
    try {
      return await here();
    } finally {
      localBusy = false;
    }
  };
  /** Runs one task per item, at most `window` at once, results in item order. */
  const runAll = async <T, R>(items: readonly T[], piece: (item: T, i: number) => Promise<R>, onDone?: (done: number) => void): Promise<R[]> => {
    const out: R[] = new Array(items.length);
    let next = 0;
    let done = 0;
    const lane = async (): Promise<void> => {
      while (next < items.length) {
        const i = next++;
        out[i] = await piece(items[i]!, i);
        onDone?.(++done);
      }
    };
    await Promise.all(Array.from({ length: Math.min(items.length, jobs * LABEL_DEPTH) }, lane));
    return out;
  };
  const d = scenario.inputs.length;
  const labeller: RowLabeller = {
    concurrency: jobs * LABEL_DEPTH,
    allocate: (n) => sharedSampleArrays(n, d),
    labelInPlace: (arrays, from, rows) =>
      either(
        () => local.labeller.labelInPlace(arrays, from, rows),
        async () => {
          const { x, advisory, margin } = arrays;
          await pool.run({ kind: 'label', x, advisory, margin, from, rows });
        },
      ),
  };
  return {
    jobs,
    labeller,
    checkRules(rules, options) {
      const { onProgress, ...rest } = options;
      return runAll(
        rules,
        (rule) => either(async () => (await local.checkRules([rule], rest))[0]!, () => pool.run({ kind: 'check', rule, options: rest }) as Promise<CheckedRule>),
        (done) => onProgress?.(done, rules.length),
      );
    },
    async measureFidelity(rules, options) {
      const sizes = fidelityChunkSizes(options.samples);
      const counts = await runAll(sizes, (rows, chunk) =>
        either(
          () => fidelityChunk(rules, scenario.inputs, model.evaluate, options.seed, chunk, rows, options.advisories),
          () => pool.run({ kind: 'fidelity', rules, seed: options.seed, chunk, rows, advisories: options.advisories }) as Promise<FidelityCounts>,
        ),
      );
      return fidelityFromCounts(counts, options);
    },
    ready: () => pool.ready(),
    close: () => pool.close(),
  };
}
