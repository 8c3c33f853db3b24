import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../../../src/cli/main.js';
import type { InputSpec, Rule, RuleStatus } from '../../../src/types.js';
import { capture } from '../../cli/helpers/capture.js';

/** A mined rule as `mine --json` prints it. */
interface JsonRule {
  readonly id: string;
  readonly allowed: string[];
  readonly box: Record<string, [number, number]>;
  readonly evidence: { readonly status: RuleStatus };
}

/** The mined table of a `specula mine --json` run, read back into the pipeline's types. */
export interface MinedTable {
  readonly inputs: InputSpec[];
  readonly advisories: string[];
  readonly rules: Rule[];
  readonly status: RuleStatus[];
  readonly fidelity: { overall: { value: number }; balanced: number };
}

/**
 * Runs `specula mine SCENARIO --json` through the CLI's main() in a fresh folder and returns the
 * table; throws with the CLI's stderr when the run does not exit 0.
 */
export async function mineDemo(scenarioPath: string, args: readonly string[]): Promise<MinedTable> {
  const io = capture(mkdtempSync(join(tmpdir(), 'specula-validate-')));
  const code = await main(['mine', scenarioPath, '--out', 'run', '--json', ...args], io);
  if (code !== 0) throw new Error(`mine exited ${code}: ${io.err()}`);
  const doc = JSON.parse(io.out()) as { inputs: InputSpec[]; advisories: string[]; rules: JsonRule[]; fidelity: MinedTable['fidelity'] };
  const rules = doc.rules.map((r): Rule => ({
    id: r.id,
    box: doc.inputs.map((input) => r.box[input.name]!),
    allowed: r.allowed.map((a) => doc.advisories.indexOf(a)),
    origin: { kind: 'mined' },
  }));
  return { inputs: doc.inputs, advisories: doc.advisories, rules, status: doc.rules.map((r) => r.evidence.status), fidelity: doc.fidelity };
}
