import type { CheckedRule, Fidelity, Model, Rule, Scenario } from '../types.js';
import { DEFAULT_BATCH_SIZE, type OnnxModel } from '../model/index.js';
import { evaluatorLabeller, type RowLabeller } from '../sampling/index.js';
import { checkRules, fidelityChunkSizes, fidelityFromCounts, measureFidelity, type CheckOptions, type FidelityCounts, type FidelityOptions } from '../check/index.js';
import { workerPool } from '../pool/index.js';
import type { ModelResult, ModelTask, ModelWorkerInit } from './model-worker-protocol.js';
import { sharedSampleArrays } from './shared-sample-arrays.js';

/**
 * Batches handed to one model worker at a time while sampling: with two, a worker starts its
 * next batch as soon as one is done instead of waiting a round trip for the main thread.
 */
export const LABEL_DEPTH = 2;

/** The model's work of a run — labelling samples, dense checks, fidelity — on `jobs` threads. */
export interface ModelJobs {
  readonly jobs: number;
  /** For sampleDomain: labels batches of the sample set (on worker threads when jobs ≥ 2). */
  readonly labeller: RowLabeller;
  /** As check's checkRules, one rule per task. */
  checkRules(rules: readonly Rule[], options: CheckOptions): Promise<CheckedRule[]>;
  /** As check's measureFidelity, one chunk per task. */
  measureFidelity(rules: readonly Rule[], options: FidelityOptions): Promise<Fidelity>;
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
 * place, nothing is copied.
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
  const d = scenario.inputs.length;
  const labeller: RowLabeller = {
    concurrency: jobs * LABEL_DEPTH,
    allocate: (n) => sharedSampleArrays(n, d),
    labelInPlace: async ({ x, advisory, margin }, from, rows) => {
      await pool.run({ kind: 'label', x, advisory, margin, from, rows });
    },
  };
  return {
    jobs,
    labeller,
    async checkRules(rules, options) {
      const { onProgress, ...rest } = options;
      let done = 0;
      return Promise.all(
        rules.map(async (rule) => {
          const checked = (await pool.run({ kind: 'check', rule, options: rest })) as CheckedRule;
          onProgress?.(++done, rules.length);
          return checked;
        }),
      );
    },
    async measureFidelity(rules, options) {
      const sizes = fidelityChunkSizes(options.samples);
      const counts = await Promise.all(
        sizes.map((rows, chunk) => pool.run({ kind: 'fidelity', rules, seed: options.seed, chunk, rows, advisories: options.advisories }) as Promise<FidelityCounts>),
      );
      return fidelityFromCounts(counts, options);
    },
    close: () => pool.close(),
  };
}
