import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../../../src/cli/main.js';
import { fromRulesJson } from '../../../src/report/export/index.js';
import type { RulesJsonDocument } from '../../../src/report/index.js';
import type { InputSpec, Rule } from '../../../src/types.js';
import { capture } from '../../cli/helpers/capture.js';

/** The mined table of a `specula mine --json` run, read back into the pipeline's types. */
export interface MinedTable {
  readonly inputs: readonly InputSpec[];
  readonly advisories: readonly string[];
  readonly rules: Rule[];
}

/**
 * Runs `specula mine SCENARIO --json` through the CLI's main() in a fresh folder and reads the
 * printed table back (as `check` reads a rules.json); throws with the CLI's stderr when the run
 * does not exit 0.
 */
export async function mineDemo(scenarioPath: string, args: readonly string[]): Promise<MinedTable> {
  const io = capture(mkdtempSync(join(tmpdir(), 'specula-validate-')));
  const code = await main(['mine', scenarioPath, '--out', 'run', '--json', ...args], io);
  if (code !== 0) throw new Error(`mine exited ${code}: ${io.err()}`);
  const table = fromRulesJson(JSON.parse(io.out()) as RulesJsonDocument);
  return { inputs: table.inputs, advisories: table.advisories, rules: table.rules.map((r) => r.rule) };
}
