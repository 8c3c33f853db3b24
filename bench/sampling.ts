/**
 * Sampling benchmark: raw batched onnxruntime throughput on a 5-input, 6×50 ReLU network, on
 * one intra-op thread and on two, against `sampleDomain` on the same model and the same number
 * of samples with --jobs 1 (this thread) and --jobs 2 (two model workers), and as `specula
 * mine` runs it with its default settings (boundary share, and this thread or workers as
 * `threadsForWork` decides), measured side by side (interleaved repetitions) in one process.
 * Run: `npx tsx bench/run-all.ts sampling`.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import * as ort from 'onnxruntime-node';
import { loadModel, writeMlpOnnx } from '../src/model/index.js';
import { modelJobs, WORKER_MIN_EVALUATIONS } from '../src/pipeline/model-jobs.js';
import { sampleDomain } from '../src/sampling/index.js';
import { FRESH_RUNS, freshShares, RAW_WARM_RUNS } from './_sampling-fresh.js';
import { benchScenario, CLI, cliThreads, D, HIDDEN, INPUTS, K, LAYERS, median, network, RAW_BATCH, rawInput, rawRun, rawSession } from './_sampling-setup.js';

/** The CLI's default budget, and a large one. */
const SIZES = [200_000, 1_000_000] as const;
const REPEATS = Number(process.env.BENCH_REPEATS ?? 10);
/** Untimed runs of every measured path before timing (the JIT settles in the first few). */
const WARM_UPS = 2;
const TARGET_RATIO = 0.6;

/**
 * Allocates arrays the size of a sample set's (x, advisory, margin) and writes every element
 * once: the first-touch cost any sampler returning fresh arrays pays, whatever it computes.
 */
function freshArrays(samples: number): number {
  const t0 = performance.now();
  const x = new Float64Array(samples * D);
  const advisory = new Int32Array(samples);
  const margin = new Float32Array(samples);
  for (let i = 0; i < x.length; i++) x[i] = i;
  for (let i = 0; i < samples; i++) advisory[i] = i;
  for (let i = 0; i < samples; i++) margin[i] = i;
  const ms = performance.now() - t0;
  return ms;
}

/**
 * Sample counts of the memory runs: `specula mine` on survey-boat without proofs or report, in a
 * child process of the built CLI (dist/), peak RSS from GNU time. 10,000,000 takes minutes
 * here: BENCH_MEMORY_SIZES=1000000,10000000 adds it.
 */
const MEMORY_SIZES = (process.env.BENCH_MEMORY_SIZES ?? '1000000').split(',').map(Number).filter((n) => n > 0);

/** The stated memory bound of a 5-input mine run: this much, plus so many bytes a sample (docs/sampling.md). */
const MEMORY_BOUND_MIB = 250;
const MEMORY_BOUND_BYTES_PER_SAMPLE = 200;

/** Peak RSS (MiB) and wall seconds of one `specula mine` run, or undefined without dist/ or GNU time. */
function mineMemory(samples: number, jobs: number): { mb: number; seconds: number } | undefined {
  const bin = resolve('dist/src/cli/bin.js');
  if (!existsSync(bin) || !existsSync('/usr/bin/time')) return undefined;
  const out = mkdtempSync(join(tmpdir(), 'specula-bench-mem-'));
  const args = ['-f', '%M %e', process.execPath, bin, 'mine', resolve('scenarios/survey-boat/scenario.json'), '--samples', String(samples), '--no-prove', '--no-report', '--quiet', '--jobs', String(jobs), '--out', out];
  const r = spawnSync('/usr/bin/time', args, { encoding: 'utf8' });
  rmSync(out, { recursive: true, force: true });
  const m = /(\d+) ([\d.]+)\s*$/.exec(r.stderr);
  if (r.status !== 0 || !m) throw new Error(`mine --samples ${samples} failed: ${r.stderr}`);
  return { mb: Number(m[1]) / 1024, seconds: Number(m[2]) };
}

export async function run(): Promise<string> {
  const dir = mkdtempSync(join(tmpdir(), 'specula-bench-'));
  const modelPath = join(dir, 'model.onnx');
  writeFileSync(modelPath, writeMlpOnnx(network(2024)));
  const scenario = benchScenario(modelPath);
  // raw: sessions with the model stage's settings, one and two intra-op threads, fixed float32 batch
  const raw1 = await rawSession(modelPath, 1);
  const raw2 = await rawSession(modelPath, 2);
  const input = rawInput();
  const model = await loadModel(scenario, { threads: 1 });
  const one = modelJobs(scenario, model, 1);
  const startMs = performance.now();
  const two = modelJobs(scenario, model, 2);
  // the workers' start-up (load onnxruntime and the model in each) is timed on its own
  await two.ready();
  const startUp = performance.now() - startMs;
  for (let w = 0; w < WARM_UPS; w++) {
    await rawRun(raw1, input, 20 * RAW_BATCH);
    await rawRun(raw2, input, 20 * RAW_BATCH);
    freshArrays(200_000);
    await sampleDomain(INPUTS, one.labeller, { seed: 1, budget: 200_000 });
    await sampleDomain(INPUTS, two.labeller, { seed: 1, budget: 200_000 });
    await sampleDomain(INPUTS, one.labeller, { seed: 1, budget: 200_000, boundaryShare: CLI.boundaryShare });
  }

  const loadAtStart = loadavg()[0]!;
  const rows: string[] = [];
  /** ms per MB of the first touch, per size. */
  const faultRates: number[] = [];
  const verdicts: string[] = [];
  let advisoriesSeen = 0;
  for (const samples of SIZES) {
    const times = { raw1: [] as number[], raw2: [] as number[], jobs1: [] as number[], jobs2: [] as number[], cli: [] as number[], fresh: [] as number[] };
    const cliJobs = cliThreads(samples);
    // CPU time of the process, every thread: raw on one thread, and sampleDomain with jobs 2
    const cpu = { raw1: [] as number[], jobs2: [] as number[] };
    const cpuOf = async (f: () => Promise<unknown>, into: number[]): Promise<void> => {
      const c0 = process.cpuUsage();
      await f();
      const c = process.cpuUsage(c0);
      into.push((c.user + c.system) / 1000);
    };
    // one repetition runs every path once; the order rotates from one repetition to the next,
    // so that no path always pays for the garbage the one before it left
    const paths: Array<(r: number) => Promise<void>> = [
      async () => cpuOf(async () => void times.raw1.push(await rawRun(raw1, input, samples)), cpu.raw1),
      async () => void times.raw2.push(await rawRun(raw2, input, samples)),
      async (r) => {
        const t0 = performance.now();
        const set = await sampleDomain(INPUTS, one.labeller, { seed: 100 + r, budget: samples });
        times.jobs1.push(performance.now() - t0);
        advisoriesSeen = new Set(set.advisory).size;
      },
      async (r) => {
        await cpuOf(async () => {
          const t0 = performance.now();
          await sampleDomain(INPUTS, two.labeller, { seed: 100 + r, budget: samples });
          times.jobs2.push(performance.now() - t0);
        }, cpu.jobs2);
      },
      async (r) => {
        const t0 = performance.now();
        await sampleDomain(INPUTS, (cliJobs === 1 ? one : two).labeller, { seed: 100 + r, budget: samples, boundaryShare: CLI.boundaryShare });
        times.cli.push(performance.now() - t0);
      },
      async () => void times.fresh.push(freshArrays(samples)),
    ];
    for (let r = 0; r < REPEATS; r++) {
      for (let p = 0; p < paths.length; p++) await paths[(r + p) % paths.length]!(r);
    }
    const rate = (ms: number[]): number => samples / (median(ms) / 1000);
    // a share of raw is the median of each repetition's own ratio: both ran moments apart, so a
    // change in the machine's load between repetitions cancels out
    const share = (ms: number[], ref: number[]): number => median(ms.map((t, r) => ref[r]! / t));
    const pc = (v: number): string => `${(100 * v).toFixed(0)} %`;
    const m = (ms: number[]): string => (rate(ms) / 1e6).toFixed(2);
    const same1 = share(times.jobs1, times.raw1);
    const same2 = share(times.jobs2, times.raw2);
    const sameCli = share(times.cli, cliJobs === 1 ? times.raw1 : times.raw2);
    const cliPath = cliJobs === 1 ? 'this thread' : `${cliJobs} workers`;
    verdicts.push(`${samples.toLocaleString('en')}: jobs 1 ${pc(same1)}, jobs 2 ${pc(same2)}, CLI default (${cliPath}) ${pc(sameCli)} of raw on as many threads`);
    const fresh = median(times.fresh.map((t, r) => t / times.raw1[r]!));
    faultRates.push(median(times.fresh) / ((samples * (8 * D + 8)) / 1048576));
    // raw's CPU time over jobs 2's (all threads) for the same samples: the share of its CPU
    // time jobs 2 spends in the network, whatever cores the load leaves it
    const efficiency = share(cpu.jobs2, cpu.raw1);
    rows.push(
      `| ${samples.toLocaleString('en')} | ${m(times.raw1)} | ${m(times.raw2)} | **${m(times.jobs1)} (${pc(same1)})** | **${m(times.jobs2)} (${pc(same2)})** | **${m(times.cli)} (${pc(sameCli)}), ${cliPath}** | ${pc(share(times.jobs2, times.raw1))} | ${pc(share(times.raw1, times.raw2))} | ${pc(efficiency)} | ${pc(fresh)} | ${pc(1 / (1 + fresh))} |`,
    );
  }
  // the CLI's one-thread sizes again, each in fresh processes (one at a time, after the rest)
  const freshRuns = SIZES.filter((n) => cliThreads(n) === 1).map((n) => ({ n, shares: freshShares(modelPath, n) }));
  await raw1.release();
  await raw2.release();
  await two.close();
  await model.close();
  rmSync(dir, { recursive: true, force: true });

  let withinBound = true;
  const memory = MEMORY_SIZES.flatMap((n) =>
    [1, 2].map((jobs) => {
      const m = mineMemory(n, jobs);
      if (!m) return '';
      const bound = MEMORY_BOUND_MIB + (MEMORY_BOUND_BYTES_PER_SAMPLE * n) / 1048576;
      withinBound &&= m.mb <= bound;
      return `| ${n.toLocaleString('en')} | ${jobs} | ${m.mb.toFixed(0)} | ${((m.mb * 1048576) / n).toFixed(0)} | ${bound.toFixed(0)} | ${m.seconds.toFixed(1)} |`;
    }),
  ).filter((r) => r !== '');
  const memoryText = memory.length === 0 ? 'Memory: not measured (needs `npm run build` and GNU time).' : `Memory of whole runs: \`specula mine scenarios/survey-boat/scenario.json --samples N --no-prove
--no-report\` (built CLI, child process), peak resident set size from GNU time (\`%M\`). The
sample set takes ${8 * D + 8} bytes a sample (x as float64, advisory, margin); docs/sampling.md says what else
the peak holds.

| samples | --jobs | peak RSS (MB) | bytes a sample | stated bound (MB) | wall (s) |
| ---: | ---: | ---: | ---: | ---: | ---: |
${memory.join('\n')}
`;
  return `## Sampling

Same model every way: a ${D}-input, ${LAYERS}×${HIDDEN} ReLU network with ${K} outputs (seeded
random weights, written with \`writeMlpOnnx\`), onnxruntime-node ${ort.env.versions.common},
${cpus().length}-core machine, Node ${process.version}. **Raw**: \`session.run\` on a fixed float32
batch of ${RAW_BATCH.toLocaleString('en')} rows, repeated to the sample count, in a session with one
intra-op thread and in one with two. **jobs 1**: \`sampleDomain\` with that budget and the
function's default boundary share (jittered grid + Sobol for 40 %, four refinement rounds for
60 %), labelled in this thread by the model stage (\`labelInPlace\`: float64 → normalised
float32, argmax and margin written straight into the sample set; one onnxruntime session with
one intra-op thread), batches of 16,384. **jobs 2**: the same with two model workers
(\`modelJobs\`, one onnxruntime session with one intra-op thread each; the sample set in shared
memory, up to 4 batches in flight while the main thread generates and refines); the sample sets
are identical. **CLI default**: what \`specula mine\` runs with its default settings at that
sample count — boundary share ${CLI.boundaryShare} (${100 - 100 * CLI.boundaryShare} % grid + Sobol), and the model's work on
this thread or on workers as \`threadsForWork\` decides from the run's network evaluations
(samples + ${CLI.maxRules} rules × ${CLI.checkSamples.toLocaleString('en')} dense checks + ${CLI.fidelitySamples.toLocaleString('en')} fidelity samples, workers from
${WORKER_MIN_EVALUATIONS.toLocaleString('en')}) with --jobs = the ${CLI.jobs} available cores; it is compared with raw on as many
threads as it uses (one intra-op thread in this thread; two workers against raw on two). The
workers' start-up (onnxruntime and the model loaded in each) is not in the rates: ${startUp.toFixed(0)} ms
here, once per run. Every path runs ${WARM_UPS} times untimed first, then ${REPEATS} repetitions of all
paths in an order rotating from one to the next: rates are medians, shares are medians of each
repetition's own ratio. One-minute load average when the benchmark started: ${loadAtStart.toFixed(1)} on
${cpus().length} cores (the machine is shared; ratios are the figures to compare).

| samples | raw, 1 thread (M/s) | raw, 2 threads (M/s) | jobs 1 (M/s, % of raw 1 thread) | jobs 2 (M/s, % of raw 2 threads) | CLI default (M/s, % of raw on as many threads), threads | jobs 2, % of raw 1 thread | raw 1 thread, % of raw 2 threads | CPU time: raw 1 thread / jobs 2 (all threads) | first touch of the result arrays, % of raw 1-thread time | one-thread ceiling: raw / (raw + first touch) |
| ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |
${rows.join('\n')}

**Target** (design): sampling ≥ ${100 * TARGET_RATIO} % of raw batched onnxruntime throughput on the same
model. It is judged here on the same number of threads — jobs 1 against raw on one intra-op
thread, jobs 2 against raw on two, the CLI default against raw on as many threads as it uses —
because that ratio is what the sampler's own overhead costs: comparing a path on two threads
with one-thread raw would credit the second core to the sampler (that column is shown for
reference only). Measured: ${verdicts.join('; ')}. The CPU-time column depends little on the
load: it is the share of jobs 2's CPU time (every thread) that raw needs for the same number of
samples, so twice it, in units of one-thread raw, bounds what jobs 2 can reach on two idle
cores. "First touch" allocates arrays the size of the sample set (x, advisory, margin: ${8 * D + 8}
bytes a sample) and writes each element once: fresh memory faulted in at ${faultRates.map((r) => r.toFixed(1)).join(' and ')} ms/MB here
(docs/sampling.md), a cost any sampler that returns new arrays pays on top of the network, and
in one thread it cannot overlap the network (onnxruntime-node runs \`session.run\` on the
calling thread). The last column is therefore the most a one-thread sampler can reach even if
making the points and labelling them cost nothing beyond raw. Advisories seen in the last
sample set: ${advisoriesSeen} of ${K}.

**Fresh process** (what a CLI run meets; the table above is the steady state of one long
process, where freed memory and compiled code are reused): for each size the CLI samples in
this thread, ${FRESH_RUNS} new processes each load the model as the CLI does (a one-row probe run) and time
the first \`sampleDomain\` call with the CLI's default boundary share (compiler cold, result
arrays and onnxruntime's working memory fresh), then raw on one intra-op thread for as many rows
after ${RAW_WARM_RUNS} untimed batches (raw stays the steady-state reference). raw / sampling:
${freshRuns.map(({ n, shares }) => `${n.toLocaleString('en')} samples ${shares.map((v) => `${(100 * v).toFixed(0)} %`).join(', ')} (median ${(100 * median(shares)).toFixed(0)} %)`).join('; ') || 'no size runs in this thread'}.

${memoryText}`;
}
