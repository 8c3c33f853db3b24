import type { Model, RuleTable, Scenario } from '../types.js';
import { proveTable } from './prove-table.js';
import { readNetworkOf } from './read-network.js';
import { provenCoverage } from '../repair/index.js';
import type { MineHooks } from './mine-hooks.js';

export interface ProveSettings {
  /** Proof budget per rule: pieces bounded, and seconds as a safety net. */
  readonly proveBoxes: number;
  readonly proveSeconds: number;
  /** Worker threads for proving (1: in this thread). */
  readonly jobs: number;
  /** Split refuted and unknown rules into proven readable sub-rules (default true). */
  readonly repair?: boolean;
  /** Seed, dense samples per rule and confidence for checking the sub-rules (default: the table's seed, 20,000, 0.95). */
  readonly seed?: number;
  readonly checkSamples?: number;
  readonly confidence?: number;
}

/** Dense samples per sub-rule when the caller does not say (the mine default). */
const SUB_RULE_SAMPLES_DEFAULT = 20_000;
/** Confidence of the sub-rules' bounds when the caller does not say (the CLI default). */
const CONFIDENCE_DEFAULT = 0.95;

const NOT_SUPPORTED = 'not supported by the prover';

/**
 * Settles a checked table by proof: every rule proven, refuted with a counterexample onnxruntime
 * confirms, or left unknown with its proven share; refuted and unknown rules are followed by
 * their proven sub-rules (repair). Sub-rules of an earlier proof run are dropped first, so
 * re-proving a run gives the same table as proving it once. Adds the proven coverage of the
 * domain, the proof settings in the manifest, and a note when the graph cannot be proved.
 */
export async function settleTable(table: RuleTable, scenario: Scenario, model: Model, settings: ProveSettings, hooks: MineHooks = {}): Promise<RuleTable> {
  hooks.onStage?.('proving');
  const repair = settings.repair ?? true;
  const own = table.rules.filter((r) => r.rule.origin.kind !== 'repaired');
  const proved = await proveTable(own, readNetworkOf(model), scenario, model, {
    maxBoxes: settings.proveBoxes,
    maxSeconds: settings.proveSeconds,
    now: hooks.now ?? (() => performance.now()),
    jobs: settings.jobs,
    repair,
    check: {
      seed: settings.seed ?? table.manifest.seed,
      samplesPerRule: settings.checkSamples ?? SUB_RULE_SAMPLES_DEFAULT,
      confidence: settings.confidence ?? CONFIDENCE_DEFAULT,
    },
  }, hooks);
  const notes = [...(table.notes ?? []).filter((n) => !n.includes(NOT_SUPPORTED)), ...(proved.unsupported ? [proved.unsupported] : [])];
  const { coverage: _old, ...rest } = table;
  return {
    ...rest,
    manifest: {
      ...table.manifest,
      settings: { ...table.manifest.settings, proveBoxes: settings.proveBoxes, proveSeconds: settings.proveSeconds, repair },
    },
    rules: proved.rules,
    ...(proved.unsupported ? {} : { coverage: provenCoverage(proved.rules, table.inputs, table.advisories) }),
    ...(notes.length > 0 ? { notes } : {}),
  };
}
