/**
 * Sharding benchmark: the CPU time of `check --shard K/4` for K = 1 … 4, run one after the
 * other, plus `merge`, against one `check` of the same rules with the same seed and settings
 * (the demo's expert expectations and eight boxes inside single advisories, CHECK_SAMPLES dense
 * samples per rule, --jobs 1). Measured twice:
 * - in this process (`main()` called in turn, modules already loaded): the cost of splitting
 *   the work itself (target: ≤ 1.1× the single run);
 * - as separate processes of the built CLI under /usr/bin/time, as a job array runs them: adds
 *   Node's start and the module imports once per shard.
 * The in-process pair is measured ROUNDS times, alternating, and the least CPU time of each side
 * is kept: on a shared machine contention only ever adds CPU time (cache and core sharing).
 * Also checks that the merged rules.json equals the single run's apart from date and seconds.
 * Run: `npx tsx bench/run-all.ts shards` (builds dist/ first when it is missing).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { main } from '../src/cli/main.js';

const SHARDS = 4;
/** Alternating in-process measurements of each side; the least is kept. */
const ROUNDS = 1;
const DEMO = resolve('scenarios/survey-boat');
const EXTRA_RULES = [
  'P1: when cpa_nm >= 1.2 expect keep_course',
  'P2: when cpa_nm >= 1.1 and tcpa_min >= 5 expect keep_course',
  'P3: when tcpa_min <= -1 expect keep_course',
  'P4: when cpa_nm <= 0.3 and tcpa_min in [2, 6] and bearing_deg in [40, 90] expect starboard_large',
  'P5: when cpa_nm >= 1.3 and bearing_deg <= -30 expect keep_course',
  'P6: when cpa_nm >= 1.3 and bearing_deg >= 30 expect keep_course',
  'P7: when tcpa_min >= 19 expect keep_course',
  'P8: when cpa_nm in [1.2, 1.5] and tcpa_min in [10, 20] expect keep_course',
];
/**
 * Dense samples per rule: fifty times the default, so that dense checking is a real share of
 * the job beside the proofs (the single run still takes only 15–20 s of CPU here, so Node's
 * start per shard stays visible in the separate-process row).
 */
const CHECK_SAMPLES = '1000000';
const SETTINGS = ['--jobs', '1', '--no-report', '--quiet', '--check-samples', CHECK_SAMPLES];
/** Separate-process measurements of each side; the least is kept, as in one process. */
const PROCESS_ROUNDS = 1;

/** Process CPU time in seconds (user + system, all threads). */
const cpuSeconds = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};

const silent = (cwd: string) => ({ stdout: () => {}, stderr: (t: string) => process.stderr.write(t), isTTY: false, cwd });

/** rules.json without the date and the proofs' seconds. */
function undated(path: string): string {
  const doc = JSON.parse(readFileSync(path, 'utf8'));
  delete doc.manifest.date;
  for (const r of doc.rules) if (r.evidence.proof) delete r.evidence.proof.seconds;
  return JSON.stringify(doc);
}

/** CPU seconds (user + system) of one CLI process, from /usr/bin/time. */
function processSeconds(cli: string, args: string[], cwd: string): number {
  const r = spawnSync('/usr/bin/time', ['-f', 'CPU %U %S', process.execPath, cli, ...args], { cwd, encoding: 'utf8' });
  const m = /CPU ([\d.]+) ([\d.]+)\s*$/.exec(r.stderr);
  if (!m || (r.status !== 0 && r.status !== 1)) throw new Error(`${args[0]} failed: ${r.stderr}`);
  return Number(m[1]) + Number(m[2]);
}

export async function run(): Promise<string> {
  const dir = mkdtempSync(join(tmpdir(), 'specula-bench-shards-'));
  writeFileSync(join(dir, 'bench.rules'), readFileSync(join(DEMO, 'expectations.rules'), 'utf8') + EXTRA_RULES.join('\n') + '\n');
  const check = ['check', join(DEMO, 'scenario.json'), 'bench.rules', ...SETTINGS];
  // warm-up: load every module and JIT the hot paths once, outside the measurements
  await main([...check, '--out', 'warm', '--check-samples', '200', '--prove-boxes', '50'], silent(dir));

  let single = Infinity;
  let shardsOnly = Infinity;
  let mergeOnly = Infinity;
  for (let round = 0; round < ROUNDS; round++) {
    let t = cpuSeconds();
    await main([...check, '--out', 'single'], silent(dir));
    single = Math.min(single, cpuSeconds() - t);
    t = cpuSeconds();
    for (let k = 1; k <= SHARDS; k++) await main([...check, '--out', 'parts', '--shard', `${k}/${SHARDS}`], silent(dir));
    shardsOnly = Math.min(shardsOnly, cpuSeconds() - t);
    t = cpuSeconds();
    await main(['merge', 'parts', '--out', 'merged', '--quiet'], silent(dir));
    mergeOnly = Math.min(mergeOnly, cpuSeconds() - t);
  }
  const sharded = shardsOnly + mergeOnly;
  const same = undated(join(dir, 'single', 'rules.json')) === undated(join(dir, 'merged', 'rules.json'));

  const cli = resolve('dist/src/cli/bin.js');
  if (!existsSync(cli)) spawnSync('npx', ['tsc', '-p', 'tsconfig.build.json'], { stdio: 'inherit' });
  let pSingle = Infinity;
  let pShards = Infinity;
  let pMerge = Infinity;
  for (let round = 0; round < PROCESS_ROUNDS; round++) {
    pSingle = Math.min(pSingle, processSeconds(cli, [...check, '--out', 'p-single'], dir));
    let shards = 0;
    for (let k = 1; k <= SHARDS; k++) shards += processSeconds(cli, [...check, '--out', 'p-parts', '--shard', `${k}/${SHARDS}`], dir);
    pShards = Math.min(pShards, shards);
    pMerge = Math.min(pMerge, processSeconds(cli, ['merge', 'p-parts', '--out', 'p-merged', '--quiet'], dir));
  }
  const pHelp = processSeconds(cli, ['--help'], dir);

  const load = loadavg()[0]!.toFixed(1);
  const f = (s: number): string => s.toFixed(2);
  return `## Sharding (bench/shards.ts)

\`check\` of the demo's expectations plus eight boxes inside single advisories (18 rules),
${Number(CHECK_SAMPLES).toLocaleString('en')} dense samples per rule (fifty times the default) and the default 20,000 proof pieces per rule, \`--jobs 1\`, seed 1: one run
against ${SHARDS} shards run one after the other plus \`merge\`. CPU time is user + system; the least
of ${ROUNDS} round(s) in one process and of ${PROCESS_ROUNDS} rounds of separate processes. Load average during the run: ${load} (on a shared machine
CPU times grow with contention).
Merged rules.json equal to the single run's (apart from date and proof seconds): **${same ? 'yes' : 'NO'}**.

| measured | one run | ${SHARDS} shards | merge | shards + merge | ratio (target ≤ 1.1) |
| --- | --- | --- | --- | --- | --- |
| in one process (modules loaded once) | ${f(single)} s | ${f(shardsOnly)} s | ${f(mergeOnly)} s | ${f(sharded)} s | **${(sharded / single).toFixed(3)}** |
| separate CLI processes (/usr/bin/time) | ${f(pSingle)} s | ${f(pShards)} s | ${f(pMerge)} s | ${f(pShards + pMerge)} s | ${((pShards + pMerge) / pSingle).toFixed(3)} |

Each CLI process costs about ${f(pHelp)} s of CPU before any work (\`specula --help\`: Node's start
and the module imports), so a job array pays that once per shard on top of the split work: with
a fixed cost c a process, N shards of a job of T CPU seconds take 1 + N·c/T of one run, within
1.1× once T ≥ 10·N·c (about 35 s for 4 shards here); jobs worth a batch scheduler are far longer.
`;
}
