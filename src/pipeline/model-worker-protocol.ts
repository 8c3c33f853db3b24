import type { CheckedRule, Decision, Rule, Scenario } from '../types.js';
import type { FidelityCounts } from '../check/index.js';

/** What a model worker is started with. */
export interface ModelWorkerInit {
  readonly scenario: Scenario;
  readonly modelPath: string;
  /** The SHA-256 the main thread loaded; the worker refuses a file that differs. */
  readonly modelSha256: string;
  /** Rows per onnxruntime call, as the main thread's model (same batches, same bits). */
  readonly batchSize: number;
}

/** Dense-check settings that cross threads (CheckOptions without the progress callback). */
export interface CheckTaskOptions {
  readonly seed: number;
  readonly samplesPerRule: number;
  readonly surfaceShare?: number;
  readonly confidence: number;
  readonly decision: Decision;
}

/**
 * One task of a model worker: label rows of a sample set in shared memory (in place), check
 * one rule on its dense samples, or count one chunk of the fidelity sample.
 */
export type ModelTask =
  | { readonly kind: 'label'; readonly x: Float64Array; readonly advisory: Int32Array; readonly margin: Float32Array; readonly from: number; readonly rows: number }
  | { readonly kind: 'check'; readonly rule: Rule; readonly options: CheckTaskOptions }
  | { readonly kind: 'fidelity'; readonly rules: readonly Rule[]; readonly seed: number; readonly chunk: number; readonly rows: number; readonly advisories: number };

/** A model worker's result: nothing for labelling (written in place), a checked rule, or chunk counts. */
export type ModelResult = null | CheckedRule | FidelityCounts;
