import type { Model, Rule, RuleTable, Scenario } from '../types.js';
import { modelJobs, threadsForWork } from '../pipeline/model-jobs.js';
import { settleTable } from '../pipeline/settle-table.js';
import type { MineHooks } from '../pipeline/mine-hooks.js';
import { toolVersion } from '../version.js';

export interface CheckTableSettings {
  readonly seed: number;
  /** Dense samples per rule. */
  readonly checkSamples: number;
  /** Confidence of the one-sided exact bounds, e.g. 0.95. */
  readonly confidence: number;
  /** Prove the rules by bound propagation where the graph is supported. */
  readonly prove: boolean;
  readonly proveBoxes: number;
  readonly proveSeconds: number;
  /** Worker threads for dense checks (when the work outweighs their start-up) and proving; default 1 (in this thread). */
  readonly jobs?: number;
  /** Follow refuted and unknown rules by proven sub-rules (the prover's repair); default false. */
  readonly repair?: boolean;
}

export interface CheckTableOptions {
  /** The manifest's command, e.g. `check` or `diff`. */
  readonly command: string;
  /** Where the rules came from (a path, or a description), stored in the manifest's settings. */
  readonly source: string;
  /** Remarks for the reviewer, e.g. bounds clipped to the domain. */
  readonly notes?: readonly string[];
}

/**
 * Checks given rules against one model: dense samples in every box with the exact one-sided
 * Clopper–Pearson bound (`checkRules`), then, unless turned off, a proof of every rule by bound
 * propagation and branch and bound (`settleTable`: proven, refuted with an onnxruntime-confirmed
 * counterexample, or unknown with the proven share; with `repair`, refuted and unknown rules are
 * followed by proven sub-rules). Where the prover cannot read the graph, the rules keep their
 * sampled status and the table carries a note saying why.
 * @returns a rule table without fidelity figures (given rules need not cover the domain)
 */
export async function checkTable(
  scenario: Scenario,
  model: Model,
  rules: readonly Rule[],
  settings: CheckTableSettings,
  options: CheckTableOptions,
  hooks: MineHooks = {},
): Promise<RuleTable> {
  const repair = settings.repair ?? false;
  // settleTable treats rules of origin 'repaired' as sub-rules of its own making: it drops them
  // and, with repair on, derives new ones from their refuted parents on this model. With repair
  // off, given sub-rules are checked like any other rule: they go in as 'mined' and get their
  // origin back afterwards.
  const relabelled = new Map(rules.filter((r) => r.origin.kind === 'repaired').map((r) => [r.id, r.origin]));
  const given = repair ? rules.filter((r) => !relabelled.has(r.id)) : rules.map((r) => (relabelled.has(r.id) ? { ...r, origin: { kind: 'mined' as const } } : r));
  hooks.onStage?.('checking');
  // dense checks on model worker threads when the work outweighs their start-up (as in mine);
  // one rule per task with its own seed, so the evidence is the same for any jobs
  const threads = modelJobs(scenario, model, threadsForWork(given.length * settings.checkSamples, settings.jobs ?? 1));
  let checked;
  try {
    checked = await threads.checkRules(given, {
      seed: settings.seed,
      samplesPerRule: settings.checkSamples,
      confidence: settings.confidence,
      decision: scenario.decision,
      onProgress: (done, total) => hooks.onProgress?.('checking', done, total),
    });
  } finally {
    await threads.close();
  }
  const { tool, version } = toolVersion();
  // jobs changes the speed, never the result, so it is left out of the manifest (as mine does)
  const { jobs: _jobs, ...recorded } = settings;
  const table: RuleTable = {
    manifest: {
      tool,
      toolVersion: version,
      command: options.command,
      date: new Date().toISOString(),
      scenario: { path: scenario.scenarioPath, sha256: scenario.scenarioSha256, name: scenario.name },
      model: { path: model.path, sha256: model.sha256 },
      seed: settings.seed,
      settings: { ...recorded, rules: options.source },
      counts: { rules: given.length },
    },
    inputs: scenario.inputs,
    advisories: scenario.advisories,
    decision: scenario.decision,
    rules: checked,
    ...(options.notes && options.notes.length > 0 ? { notes: [...options.notes] } : {}),
  };
  if (!settings.prove) return table;
  const proveSettings = {
    proveBoxes: settings.proveBoxes,
    proveSeconds: settings.proveSeconds,
    jobs: settings.jobs ?? 1,
    repair,
    seed: settings.seed,
    checkSamples: settings.checkSamples,
    confidence: settings.confidence,
  };
  const settled = await settleTable(table, scenario, model, proveSettings, hooks);
  if (repair || relabelled.size === 0) return settled;
  return {
    ...settled,
    rules: settled.rules.map((c) => {
      const origin = relabelled.get(c.rule.id);
      return origin === undefined ? c : { ...c, rule: { ...c.rule, origin } };
    }),
  };
}
