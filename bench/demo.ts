/**
 * End-to-end demo timings: `specula mine` on the survey-boat scenario as `npm run demo` runs it
 * (defaults: proofs and report on), and the stages alone, in one process one after the other.
 * Targets (design): demo ≤ 60 s; fully settled table (proofs) ≤ 120 s; fidelity ≥ 99 %,
 * balanced ≥ 97 % with ≤ 60 rules; proven coverage ≥ 90 %.
 */
import { mkdtempSync, readFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { main } from '../src/cli/main.js';

const SCENARIO = resolve('scenarios/survey-boat/scenario.json');

async function timed(args: string[]): Promise<{ seconds: number; doc: any }> {
  const dir = mkdtempSync(join(tmpdir(), 'specula-bench-'));
  const io = { stdout: () => {}, stderr: (t: string) => process.stderr.write(t), isTTY: false, cwd: dir };
  const t0 = performance.now();
  const code = await main(['mine', SCENARIO, '--out', 'run', ...args], io);
  const seconds = (performance.now() - t0) / 1000;
  if (code !== 0) throw new Error(`mine exited ${code}`);
  return { seconds, doc: JSON.parse(readFileSync(join(dir, 'run', 'rules.json'), 'utf8')) };
}

export async function run(): Promise<string> {
  const plain = await timed(['--no-prove', '--no-report']);
  const proved = await timed(['--no-report']);
  const full = await timed([]);
  const f = full.doc.fidelity;
  const statuses: Record<string, number> = {};
  for (const r of full.doc.rules) statuses[r.evidence.status] = (statuses[r.evidence.status] ?? 0) + 1;
  const coverage = full.doc.coverage ? `${(100 * full.doc.coverage.total).toFixed(2)} %` : 'not computed';
  const mined = full.doc.rules.filter((r: any) => r.origin.kind === 'mined').length;
  return [
    '## Demo end to end',
    '',
    `\`specula mine scenarios/survey-boat/scenario.json\` in one process, ${availableParallelism()} proof workers (bench/demo.ts).`,
    '',
    '| run | seconds | target |',
    '| --- | ---: | --- |',
    `| sample, learn, rules, check (\`--no-prove --no-report\`) | ${plain.seconds.toFixed(1)} | |`,
    `| + proofs (\`--no-report\`; every rule proven, or refuted with a confirmed counterexample; no repair) | ${proved.seconds.toFixed(1)} | settled table ≤ 120 s |`,
    `| + report.html (\`npm run demo\`) | ${full.seconds.toFixed(1)} | ≤ 60 s |`,
    '',
    `Quality of the demo table: ${mined} mined rules (target ≤ 60); fidelity ${(100 * f.overall.value).toFixed(2)} % ` +
      `(95 % interval ${(100 * f.overall.lower).toFixed(2)}–${(100 * f.overall.upper).toFixed(2)} %, target ≥ 99 %); ` +
      `balanced fidelity ${(100 * f.balanced).toFixed(2)} % (target ≥ 97 %); statuses ${JSON.stringify(statuses)}; ` +
      `proven coverage of the domain without repair ${coverage} (the mined rules as they are; target ≥ 90 % with \`--repair\`: see the Repair section).`,
    '',
  ].join('\n');
}
