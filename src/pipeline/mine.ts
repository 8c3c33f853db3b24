import type { Model, Rule, RuleTable, Scenario, Tree } from '../types.js';
import { sampleDomain } from '../sampling/index.js';
import { learnTree, pruneSequence } from '../learn/index.js';
import { mergeRules, roundThresholds, treeToRules } from '../rules/index.js';
import { toolVersion } from '../version.js';
import { settleTable } from './settle-table.js';
import { recountTree } from './recount-tree.js';
import { relabelRules } from './relabel-rules.js';
import type { MineHooks } from './mine-hooks.js';
import { modelJobs, threadsForWork, type ModelJobs } from './model-jobs.js';

export type { MineHooks } from './mine-hooks.js';

export interface MineSettings {
  readonly seed: number;
  /** Samples of the network used to learn the tree. */
  readonly budget: number;
  /** Share of the budget spent refining near decision boundaries (the rest covers the box evenly). */
  readonly boundaryShare: number;
  /** Largest number of rules in the table (after merging). */
  readonly maxRules: number;
  /** Smallest number of samples in a leaf of the full tree before pruning. */
  readonly minLeaf: number;
  /** Largest loss of agreement with the samples allowed for readable thresholds (0..1). */
  readonly roundTolerance: number;
  /** Dense samples per rule for checking. */
  readonly checkSamples: number;
  /** Fresh uniform samples for the fidelity figures. */
  readonly fidelitySamples: number;
  /** Confidence of bounds and intervals, e.g. 0.95. */
  readonly confidence: number;
  /** Prove the rules by bound propagation (when the graph is supported). */
  readonly prove: boolean;
  /** Proof budget per rule: pieces bounded, and seconds as a safety net. */
  readonly proveBoxes: number;
  readonly proveSeconds: number;
  /** Worker threads for sampling, checking, fidelity and proving (1: in this thread); never changes the result. */
  readonly jobs: number;
  /** Split refuted and unknown rules into proven readable sub-rules. */
  readonly repair: boolean;
  /** Model workers only from this much network work on (default WORKER_MIN_EVALUATIONS); never changes the result. */
  readonly workerMinEvaluations?: number;
}



/** Rules of a tree after merging same-advisory neighbours. */
function rulesOf(tree: Tree, scenario: Scenario): Rule[] {
  return mergeRules(treeToRules(tree, scenario.inputs));
}

/**
 * Picks the largest tree of the minimal cost-complexity pruning sequence (Breiman et al. 1984,
 * ch. 3) whose merged rule table has at most `maxRules` rules. The sequence is ordered from the
 * full tree to the root; merged counts fall (almost) monotonically along it. Counting means
 * merging a tree's rules, which costs more than linear time in its leaves, so the search starts
 * at the small end: the first tree with at most `maxRules` leaves fits without merging; from
 * there it steps towards larger trees in doubling steps until one does not fit, then halves the
 * gap. Where counts fall monotonically this finds the same tree as a search from the full tree,
 * while merging only trees a few times the rule budget (a search from the full tree merged
 * every large tree it probed: 40 % of a 1,000,000-sample run, quadratic in the samples).
 */
export function pickPrunedTree(tree: Tree, scenario: Scenario, maxRules: number): Tree {
  const seq = pruneSequence(tree);
  const fits = (i: number): boolean => seq[i]!.leaves <= maxRules || rulesOf(seq[i]!.tree, scenario).length <= maxRules;
  // hi: a tree that fits; lo: a larger one that does not (-1: none found yet)
  let hi = seq.findIndex((step) => step.leaves <= maxRules);
  if (hi < 0) hi = seq.length - 1;
  let lo = -1;
  for (let step = 1; lo < 0 && hi > 0; step *= 2) {
    const i = Math.max(0, hi - step);
    if (fits(i)) hi = i;
    else lo = i;
  }
  if (lo < 0) return seq[hi]!.tree;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (fits(mid)) hi = mid;
    else lo = mid;
  }
  return seq[hi]!.tree;
}

/**
 * The mining pipeline: samples the network over the input box, learns a CART tree, prunes it
 * to the rule budget, rounds thresholds to readable values, turns leaves into merged rules,
 * checks every rule on dense samples and measures the table's fidelity.
 */
export async function mine(scenario: Scenario, model: Model, settings: MineSettings, hooks: MineHooks = {}): Promise<RuleTable> {
  const work = settings.budget + settings.maxRules * settings.checkSamples + settings.fidelitySamples;
  const jobs = modelJobs(scenario, model, threadsForWork(work, settings.jobs, settings.workerMinEvaluations));
  let table: RuleTable;
  try {
    table = await mineTable(scenario, model, settings, hooks, jobs);
  } finally {
    await jobs.close();
  }
  return settings.prove ? settleTable(table, scenario, model, settings, hooks) : table;
}

/** The table before proofs: sampling, learning, rules, checks and fidelity, the model's work on `jobs`. */
async function mineTable(scenario: Scenario, model: Model, settings: MineSettings, hooks: MineHooks, jobs: ModelJobs): Promise<RuleTable> {
  const d = scenario.inputs.length;
  const k = scenario.advisories.length;
  hooks.onStage?.('sampling');
  // only x and the advisories are kept: the margins (4 bytes a sample) are free before learning
  const samples = await sampleDomain(scenario.inputs, jobs.labeller, {
    seed: settings.seed,
    budget: settings.budget,
    boundaryShare: settings.boundaryShare,
    onProgress: (done, total) => hooks.onProgress?.('sampling', done, total),
  }).then(({ x, advisory, n }) => ({ x, advisory, n }));
  hooks.onStage?.('learning');
  const data = { x: samples.x, n: samples.n, d, labels: samples.advisory, classes: k };
  const full = learnTree(data, { minLeaf: settings.minLeaf });
  // Prune by volume: the space-filling rows (the first ones; docs/sampling.md) recount the tree.
  const spaceFilling = settings.budget - Math.floor(settings.budget * settings.boundaryShare);
  const pruned = pickPrunedTree(recountTree(full, samples.x, spaceFilling, samples.advisory), scenario, settings.maxRules);
  hooks.onStage?.('rules');
  const readable = roundThresholds(pruned, data, scenario.inputs, { tolerance: settings.roundTolerance });
  let rules = rulesOf(readable, scenario);
  hooks.onStage?.('checking');
  const checkOptions = {
    seed: settings.seed,
    samplesPerRule: settings.checkSamples,
    confidence: settings.confidence,
    decision: scenario.decision,
    onProgress: (done: number, total: number) => hooks.onProgress?.('checking', done, total),
  };
  let checked = await jobs.checkRules(rules, checkOptions);
  // A rule whose advisory the network gives on less than half of its box gets the advisory it
  // gives most often there, and is checked again.
  const wrong = checked.flatMap((c, i) => (c.evidence.violations * 2 > c.evidence.samples ? [i] : []));
  if (wrong.length > 0) {
    const relabelled = await relabelRules(rules, wrong, k, model.evaluate, settings.seed);
    const again = await jobs.checkRules(wrong.map((i) => relabelled[i]!), checkOptions);
    checked = checked.map((c, i) => (wrong.includes(i) ? again[wrong.indexOf(i)]! : c));
    rules = relabelled;
  }
  hooks.onStage?.('fidelity');
  const fidelity = await jobs.measureFidelity(rules, {
    seed: settings.seed,
    samples: settings.fidelitySamples,
    confidence: settings.confidence,
    advisories: k,
  });
  const { tool, version } = toolVersion();
  return {
    manifest: {
      tool,
      toolVersion: version,
      command: 'mine',
      date: new Date().toISOString(),
      scenario: { path: scenario.scenarioPath, sha256: scenario.scenarioSha256, name: scenario.name },
      model: { path: model.path, sha256: model.sha256 },
      seed: settings.seed,
      // jobs changes the speed, never the result, so it is left out of the manifest
      settings: withoutJobs(settings),
      counts: {
        samples: samples.n,
        treeLeavesFull: countLeaves(full),
        treeLeavesPruned: countLeaves(pruned),
        rules: rules.length,
      },
    },
    inputs: scenario.inputs,
    advisories: scenario.advisories,
    decision: scenario.decision,
    rules: checked,
    fidelity,
  };
}

function withoutJobs(s: MineSettings): Record<string, number | boolean> {
  const { jobs: _jobs, workerMinEvaluations: _min, ...rest } = s;
  return rest;
}

function countLeaves(tree: Tree): number {
  let c = 0;
  for (let i = 0; i < tree.nodeCount; i++) if (tree.feature[i] === -1) c++;
  return c;
}
