/**
 * Types of the run-time cost model: the job whose time is estimated, the fitted coefficients,
 * and the measured points they were fitted to (bench/scaling.ts writes those).
 */

/** The kinds of job the model estimates. */
export type CostJobKind = 'mine' | 'check' | 'prove';

/** What is known about a job before it starts. */
export interface CostJob {
  readonly kind: CostJobKind;
  /** Inputs of the scenario (d). */
  readonly inputs: number;
  /** Weights and biases of the network, all layers. */
  readonly weights: number;
  /** Affine (Gemm / MatMul) layers of the network, output layer included. */
  readonly layers: number;
  /** mine: network samples for learning the tree (0 for check and prove). */
  readonly samples: number;
  /** mine: fresh samples for the fidelity figures (0 for check and prove). */
  readonly fidelitySamples: number;
  /** Dense samples per rule for checking (0 for prove). */
  readonly checkSamples: number;
  /** mine: the largest table (--max-rules); check and prove: the rules in the table. */
  readonly rules: number;
  /** Whether proofs follow (always true for prove). */
  readonly prove: boolean;
  /** Proof budget per rule: pieces bounded, and seconds. */
  readonly proveBoxes: number;
  readonly proveSeconds: number;
  /** Worker threads that prove at the same time: min(--jobs, available cores). */
  readonly jobs: number;
}

/** Estimated wall seconds of a job, in total and by part. */
export interface CostEstimate {
  readonly seconds: number;
  /** Process start, model load, writing files. */
  readonly startSeconds: number;
  /** Network evaluations (sampling, checking, fidelity) and tree learning. */
  readonly samplingSeconds: number;
  readonly provingSeconds: number;
  /** If every rule used its whole proof budget (the worst case of proving). */
  readonly worstSeconds: number;
}

/**
 * Coefficients of the cost model (all ≥ 0, so the estimate never falls when a job grows).
 * Units: seconds, per sample, per weight, per piece as named. See estimate-seconds.ts.
 */
export interface CostModel {
  /** Where the coefficients come from (data file and command). */
  readonly source: string;
  /** Process start and model load of mine and check. */
  readonly start: number;
  /** Per network evaluation, independent of size. */
  readonly perSample: number;
  /** Per network evaluation and weight. */
  readonly perSampleWeight: number;
  /** Tree learning, per sample and input. */
  readonly perSampleInput: number;
  /** Process start of prove (reads the run, loads the model, rewrites the files). */
  readonly proveStart: number;
  /** Per proved rule: set-up and counterexample search, and its part per weight. */
  readonly perRule: number;
  readonly perRuleWeight: number;
  /** Per piece of branch and bound, and its part per weight × layer. */
  readonly perPiece: number;
  readonly perPieceWeightLayer: number;
  /** Pieces a hard rule (all free inputs, next to a boundary) needs: exp(hardLog + hardGrowth·d). */
  readonly hardLog: number;
  readonly hardGrowth: number;
  /** Expected pieces per rule: easyPieces + hardShare · min(proveBoxes, hard pieces). */
  readonly easyPieces: number;
  readonly hardShare: number;
}

/** One measured job of the scaling study, as written to docs/scaling/scaling-data.json. */
export interface MeasuredPoint {
  /** The sweep it belongs to (inputs, network, rules, samples) and its label there. */
  readonly sweep: string;
  readonly label: string;
  readonly job: CostJob;
  readonly wallSeconds: number;
  readonly cpuSeconds: number;
  readonly peakRssMiB: number;
  /** prove (and check/mine with proofs): pieces bounded over all rules, and the most in one rule. */
  readonly pieces?: number;
  readonly maxPieces?: number;
  /** Rules in the table the job wrote (mine: actual, ≤ job.rules). */
  readonly rulesOut: number;
  /** Statuses of the written table, e.g. { proven: 3, refuted: 2 }. */
  readonly statuses: Readonly<Record<string, number>>;
}
