/**
 * The data passed between Specula's pipeline stages, and nothing else.
 *
 * Scenario -> Model -> SampleSet -> Tree -> Rule[] -> Evidence[] -> RuleTable -> files
 *
 * Conventions: inputs are in the scenario's units everywhere except inside `model/`, which
 * applies the optional normalisation and converts to float32 at the ONNX boundary. Sample
 * matrices are row-major with explicit `n` (rows) and `d` (inputs).
 */

/** One physical input of the controller. */
export interface InputSpec {
  readonly name: string;
  readonly unit: string;
  readonly min: number;
  readonly max: number;
  readonly description: string;
}

/** How the network's scores become an advisory: the largest or the smallest score wins. */
export type Decision = 'argmax' | 'argmin';

/** The network sees `(x - offset) / scale` per input; rules stay in the scenario's units. */
export interface Normalization {
  readonly offset: readonly number[];
  readonly scale: readonly number[];
}

/** A validated scenario file (see docs/formats.md). */
export interface Scenario {
  readonly name: string;
  readonly title: string;
  /** Absolute path of scenario.json. */
  readonly scenarioPath: string;
  /** SHA-256 (hex) of the scenario file's bytes. */
  readonly scenarioSha256: string;
  /** Absolute path of the model file named in the scenario. */
  readonly modelPath: string;
  readonly decision: Decision;
  readonly inputs: readonly InputSpec[];
  /** Advisory names in the network's output order. */
  readonly advisories: readonly string[];
  readonly normalize?: Normalization;
}

/** The network's answer for a batch of n inputs. */
export interface Evaluation {
  /** n × k raw scores, row-major, float32 as the network computed them. */
  readonly scores: Float32Array;
  /** Winning advisory index per row (argmax or argmin by the scenario's decision). */
  readonly advisory: Int32Array;
  /**
   * Decision margin per row: how far the winner is ahead of the runner-up, in score units
   * (best - second for argmax, second - best for argmin); >= 0, 0 on ties.
   */
  readonly margin: Float32Array;
}

/**
 * Evaluates the controller on a batch of inputs in the scenario's units.
 * @param x row-major n × d matrix, float64, scenario units (not normalised)
 * @param n number of rows
 */
export type Evaluator = (x: Float64Array, n: number) => Promise<Evaluation>;

/** The loaded controller. Only `model/` creates one. */
export interface Model {
  readonly path: string;
  /** SHA-256 (hex) of the model file's bytes. */
  readonly sha256: string;
  readonly inputCount: number;
  readonly outputCount: number;
  readonly evaluate: Evaluator;
  close(): Promise<void>;
}

/** Labelled samples of the network over the input box. */
export interface SampleSet {
  readonly d: number;
  readonly n: number;
  /** n × d, float64, scenario units. */
  readonly x: Float64Array;
  readonly advisory: Int32Array;
  readonly margin: Float32Array;
  readonly seed: number;
}

/**
 * A binary decision tree over the inputs (CART). Node 0 is the root. A sample goes to
 * `left[i]` when `x[feature[i]] <= threshold[i]`, else to `right[i]`.
 */
export interface Tree {
  readonly d: number;
  readonly classes: number;
  readonly nodeCount: number;
  /** Split input per node; -1 at a leaf. */
  readonly feature: Int32Array;
  readonly threshold: Float64Array;
  readonly left: Int32Array;
  readonly right: Int32Array;
  /** nodeCount × classes training sample counts reaching each node. */
  readonly counts: Float64Array;
  /** Majority class per node. */
  readonly label: Int32Array;
}

/** Where a rule came from. */
export type RuleOrigin =
  | { readonly kind: 'mined' }
  | { readonly kind: 'expected'; readonly line: number; readonly file?: string }
  | { readonly kind: 'repaired'; readonly from: string };

/** `inputs in box ⇒ advisory ∈ allowed`. The box is closed: [min, max] per input. */
export interface Rule {
  readonly id: string;
  /** One closed interval per input, in scenario units; the full range where unconstrained. */
  readonly box: ReadonlyArray<readonly [number, number]>;
  /** Allowed advisory indices, ascending, non-empty. */
  readonly allowed: readonly number[];
  readonly origin: RuleOrigin;
}

export type RuleStatus = 'proven' | 'sampled' | 'refuted' | 'unknown';

/** A concrete input, confirmed by running the model, where a rule fails. */
export interface Counterexample {
  /** Inputs in scenario units. */
  readonly x: readonly number[];
  readonly scores: readonly number[];
  readonly advisory: number;
  /** How far the wrong advisory is ahead of the best allowed one, in score units (> 0). */
  readonly margin: number;
}

export interface ProofDetails {
  readonly method: string;
  readonly pieces: number;
  /** Share of the rule box's volume proven (0..1). */
  readonly provenFraction: number;
  readonly seconds: number;
  /** The numerical margin a piece needed to count as proven, in score units. */
  readonly margin: number;
  readonly note?: string;
}

export interface Evidence {
  readonly status: RuleStatus;
  /** Dense samples drawn inside the box. */
  readonly samples: number;
  readonly violations: number;
  /** One-sided exact (Clopper–Pearson) upper bound on the violation rate. */
  readonly violationBound: number;
  readonly confidence: number;
  /** Share of the whole input domain's volume inside this rule's box. */
  readonly volumeFraction: number;
  readonly counterexample?: Counterexample;
  readonly proof?: ProofDetails;
}

export interface CheckedRule {
  readonly rule: Rule;
  readonly evidence: Evidence;
}

/** A proportion with its exact two-sided confidence interval. */
export interface Proportion {
  readonly value: number;
  readonly lower: number;
  readonly upper: number;
  readonly n: number;
}

/** How well the rule table reproduces the network on a fresh uniform sample. */
export interface Fidelity {
  readonly samples: number;
  readonly confidence: number;
  /** Share of samples where the table's label equals the network's advisory. */
  readonly overall: Proportion;
  /** Mean over advisories of the per-advisory recall. */
  readonly balanced: number;
  /** Per advisory: share of its region the table labels right (recall). */
  readonly perAdvisory: readonly Proportion[];
  /** Per advisory: share of the domain the network gives it. */
  readonly share: readonly number[];
  /** Share of samples covered by no rule. */
  readonly uncovered: number;
}

export interface Manifest {
  readonly tool: string;
  readonly toolVersion: string;
  readonly command: string;
  readonly date: string;
  readonly scenario: { readonly path: string; readonly sha256: string; readonly name: string };
  readonly model: { readonly path: string; readonly sha256: string };
  readonly seed: number;
  readonly settings: Readonly<Record<string, number | string | boolean>>;
  readonly counts: Readonly<Record<string, number>>;
}

/** The canonical result of a run: written as rules.json. */
export interface RuleTable {
  readonly manifest: Manifest;
  readonly inputs: readonly InputSpec[];
  readonly advisories: readonly string[];
  readonly decision: Decision;
  readonly rules: readonly CheckedRule[];
  readonly fidelity?: Fidelity;
  /** Share of the domain's volume covered by proven rules, in total and per advisory. */
  readonly coverage?: Coverage;
  /** Remarks a reviewer must see (e.g. why nothing was proved). */
  readonly notes?: readonly string[];
}

/** Share of the input domain's volume covered by proven rules (union of their boxes). */
export interface Coverage {
  readonly total: number;
  readonly perAdvisory: readonly number[];
}
