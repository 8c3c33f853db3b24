import type { Model, RuleTable, Scenario } from '../types.js';
import { proveTable } from './prove-table.js';
import { readNetworkOf } from './read-network.js';
import type { MineHooks } from './mine-hooks.js';

export interface ProveSettings {
  /** Proof budget per rule: pieces bounded, and seconds as a safety net. */
  readonly proveBoxes: number;
  readonly proveSeconds: number;
  /** Worker threads for proving (1: in this thread). */
  readonly jobs: number;
}

/**
 * Settles a checked table by proof: every rule proven, refuted with a counterexample onnxruntime
 * confirms, or left unknown with its proven share. Returns the table with the new evidence,
 * the proof settings in the manifest, and a note when the graph cannot be proved.
 */
export async function settleTable(table: RuleTable, scenario: Scenario, model: Model, settings: ProveSettings, hooks: MineHooks = {}): Promise<RuleTable> {
  hooks.onStage?.('proving');
  const proved = await proveTable(table.rules, readNetworkOf(model), scenario, model, {
    maxBoxes: settings.proveBoxes,
    maxSeconds: settings.proveSeconds,
    now: hooks.now ?? (() => performance.now()),
    jobs: settings.jobs,
  }, hooks);
  const notes = [...(table.notes ?? []).filter((n) => !n.includes('not supported by the prover')), ...(proved.unsupported ? [proved.unsupported] : [])];
  return {
    ...table,
    manifest: { ...table.manifest, settings: { ...table.manifest.settings, proveBoxes: settings.proveBoxes, proveSeconds: settings.proveSeconds } },
    rules: proved.rules,
    ...(notes.length > 0 ? { notes } : {}),
  };
}
