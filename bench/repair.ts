/**
 * Repair benchmark: the survey-boat demo table mined with the CLI's defaults (no proofs), then
 * every rule settled as `mine --repair` settles it (src/pipeline/settle-rule.ts: the rule's proof,
 * then its repair with the deterministic per-rule budget `repairBudgetOf` and the proof's pieces
 * reused, then the dense check of the sub-rules), in this thread, with the process's CPU clock
 * for the per-rule safety net. Reports how the rules settle, the sub-rules, the proven coverage of
 * the domain and the time. Run: `npx tsx bench/run-all.ts repair`.
 */
import { availableParallelism, loadavg } from 'node:os';
import { resolve } from 'node:path';
import { loadScenario } from '../src/scenario/index.js';
import { loadModel } from '../src/model/index.js';
import { mine } from '../src/pipeline/mine.js';
import { readNetworkOf } from '../src/pipeline/read-network.js';
import { REPAIR_FILL_PIECES_PER_DOMAIN, REPAIR_PIECES_FLOOR, REPAIR_PIECES_PER_DOMAIN, settleRule } from '../src/pipeline/settle-rule.js';
import { MINE_DEFAULTS } from '../src/cli/commands/mine.js';
import { benchMineSettings } from './_mine-defaults.js';
import { provenCoverage } from '../src/repair/index.js';
import type { CheckedRule } from '../src/types.js';

/** Process CPU time in milliseconds (user + system, all threads): fair on a shared machine. */
const cpuMs = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};

export async function run(): Promise<string> {
  const scenario = loadScenario(resolve('scenarios/survey-boat/scenario.json'));
  const model = await loadModel(scenario);
  const read = readNetworkOf(model);
  if (!read.supported) throw new Error('survey-boat network not supported by the prover');
  const table = await mine(scenario, model, benchMineSettings(1));

  const cpu0 = cpuMs();
  const wall0 = performance.now();
  const settled: CheckedRule[] = [];
  const outcome = { proven: 0, refuted: 0, unknown: 0, repaired: 0 };
  let subRules = 0;
  for (const checked of table.rules) {
    const out = await settleRule(read.network, checked, scenario, model, {
      maxBoxes: MINE_DEFAULTS.proveBoxes,
      maxSeconds: MINE_DEFAULTS.proveSeconds,
      now: cpuMs,
      repair: true,
      check: { seed: 1, samplesPerRule: MINE_DEFAULTS.checkSamples, confidence: 0.95 },
    });
    settled.push(...out);
    outcome[out[0]!.evidence.status === 'sampled' ? 'unknown' : out[0]!.evidence.status]++;
    const subs = out.slice(1).filter((r) => r.evidence.status === 'proven').length;
    subRules += subs;
    if (subs > 0) outcome.repaired++;
  }
  const cpu = (cpuMs() - cpu0) / 1000;
  const wall = (performance.now() - wall0) / 1000;
  await model.close();
  const coverage = provenCoverage(settled, scenario.inputs, scenario.advisories);
  const n = table.rules.length;
  return [
    '## Repair',
    '',
    `The survey-boat table mined with the CLI defaults (seed 1, ${n} rules), every rule settled in one thread as ` +
      '`mine --repair` settles it (proof, repair with the per-rule piece budget ' +
      `${REPAIR_PIECES_FLOOR} + volume share × ${REPAIR_PIECES_PER_DOMAIN}, of which the fill's map may take volume share × ` +
      `${REPAIR_FILL_PIECES_PER_DOMAIN}, dense check of the sub-rules; bench/repair.ts; ` +
      `${availableParallelism()} cores, load average ${loadavg()[0]!.toFixed(1)} at the end).`,
    '',
    '| figure | value | target |',
    '| --- | ---: | --- |',
    `| rules proven as mined | ${outcome.proven} of ${n} | |`,
    `| rules refuted (onnxruntime-confirmed counterexample) | ${outcome.refuted} of ${n} | |`,
    `| rules proven or repaired into ≥ 1 proven sub-rule | ${outcome.proven + outcome.repaired} of ${n} | ≥ 90 % |`,
    `| proven sub-rules | ${subRules} | |`,
    `| proven coverage of the domain | ${(100 * coverage.total).toFixed(2)} % | ≥ 90 % |`,
    `| time, CPU (process, one thread) | ${cpu.toFixed(1)} s | |`,
    `| time, wall clock | ${wall.toFixed(1)} s | |`,
    '',
    `Proven coverage per advisory: ${scenario.advisories.map((a, k) => `${a} ${(100 * coverage.perAdvisory[k]!).toFixed(2)} %`).join(', ')}.`,
    '',
  ].join('\n');
}
