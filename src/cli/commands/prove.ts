import { join, relative, resolve } from 'node:path';
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import type { Argv } from 'yargs';
import { readRulesJson, fromRulesJson } from '../../report/export/index.js';
import { openRunModel, buildReportHtml } from '../../report/html/index.js';
import { summaryText, toRulesJson, writeRunFolder } from '../../report/index.js';
import { settleTable } from '../../pipeline/settle-table.js';
import { positiveInt, positiveNumber } from '../option-checks.js';
import { UsageError } from '../../errors.js';
import type { CliIo } from '../io.js';
import { commonOptions } from '../options.js';
import { createProgress } from '../progress.js';
import { EXIT } from '../exit-codes.js';
import { MINE_DEFAULTS } from './mine.js';
import { SHARD_OPTION, shardDone } from './merge.js';
import { makePartial, partialRun, selectShard, shardSpec, writePartial } from '../../shard/index.js';
import { TIME_BUDGET_OPTION, timeBudgetOf, warnIfLong } from '../time-budget.js';
import { createHash } from 'node:crypto';

export function proveBuilder<T>(y: Argv<T>) {
  return commonOptions(y)
    .positional('run', { type: 'string', describe: 'run folder (holding rules.json)', demandOption: true })
    .option('model', { type: 'string', describe: "the run's model file, if it moved (its SHA-256 must match the run's)" })
    .option('scenario', { type: 'string', describe: "the run's scenario file, if it moved (its SHA-256 must match the run's)" })
    .option('prove-boxes', { type: 'number', default: MINE_DEFAULTS.proveBoxes, describe: 'proof budget per rule: pieces of the box bounded' })
    .option('prove-seconds', { type: 'number', default: MINE_DEFAULTS.proveSeconds, describe: 'proof budget per rule: seconds (safety net)' })
    .option('repair', { type: 'boolean', default: false, describe: 'split refuted rules into proven readable sub-rules (slow: minutes on the demo)' })
    .option('threads', { type: 'number', default: 1, describe: 'onnxruntime intra-op threads' })
    .option('jobs', { type: 'number', default: availableParallelism(), describe: 'worker threads for proving (default: the available cores)' })
    .option('shard', SHARD_OPTION)
    .option('time-budget', TIME_BUDGET_OPTION)
    .option('out', { type: 'string', describe: 'with --shard: folder for the partial result (the run folder itself is not changed)' })
    .example('$0 prove runs/demo', 're-prove the rules of runs/demo and rewrite its files')
    .example('$0 prove runs/demo --shard 1/4 --out runs/demo/parts', 'part 1 of 4 of the rules; then: $0 merge runs/demo/parts --out runs/demo')
    .example('$0 prove runs/demo --prove-boxes 100000 --prove-seconds 60', 'give each rule a larger proof budget');
}

type ProveArgs = {
  run?: string;
  model?: string | undefined;
  scenario?: string | undefined;
  'prove-boxes': number;
  'prove-seconds': number;
  threads: number;
  jobs: number;
  repair: boolean;
  shard?: string | undefined;
  out?: string | undefined;
  json: boolean;
  quiet: boolean;
  'time-budget'?: number | undefined;
};

/** `specula prove RUN_DIR`: (re)proves the rules of a run and rewrites its files atomically. */
export async function runProve(args: ProveArgs, io: CliIo): Promise<number> {
  const boxes = args['prove-boxes'];
  const seconds = args['prove-seconds'];
  positiveInt('prove-boxes', boxes);
  positiveInt('jobs', args.jobs);
  positiveNumber('prove-seconds', seconds);
  const shard = args.shard === undefined ? undefined : shardSpec(String(args.shard));
  if (shard && args.out === undefined) throw new UsageError('--shard: name the folder for the partial result with --out');
  const runDir = resolve(io.cwd, String(args.run));
  const { doc, text } = readRulesJson(join(runDir, 'rules.json'));
  const whole = fromRulesJson(doc, join(runDir, 'rules.json'));
  // a shard proves the rules at its indices of the whole table; sub-rules of an earlier repair
  // are dropped and re-derived from their parents, as in the single run (settleTable)
  const items = shard ? selectShard(whole.rules.map((r) => r.rule), shard, (r) => r.origin.kind !== 'repaired') : [];
  const table = shard ? { ...whole, rules: items.map((i) => whole.rules[i.index]!) } : whole;
  const { model, scenario } = await openRunModel(doc, {
    threads: args.threads,
    ...(args.model ? { modelPath: resolve(io.cwd, args.model) } : {}),
    ...(args.scenario ? { scenarioPath: resolve(io.cwd, args.scenario) } : {}),
  });
  const progress = createProgress(io, args.quiet || args.json);
  try {
    const settings = {
      proveBoxes: boxes,
      proveSeconds: seconds,
      jobs: args.jobs,
      repair: args.repair,
      seed: table.manifest.seed,
      checkSamples: numberSetting(table.manifest.settings['checkSamples'], MINE_DEFAULTS.checkSamples),
      confidence: numberSetting(table.manifest.settings['confidence'], 0.95),
    };
    warnIfLong(io, { kind: 'prove', scenario, model, samples: 0, fidelitySamples: 0, rules: table.rules.length, prove: true, ...settings }, timeBudgetOf(args['time-budget']));
    const settled = await settleTable(table, scenario, model, settings, progress);
    if (shard) {
      progress.stop();
      const run = partialRun('prove', {
        scenarioSha256: scenario.scenarioSha256,
        models: { model: model.sha256 },
        inputSha256: createHash('sha256').update(text).digest('hex'),
        settings,
        shards: shard.n,
        ids: whole.rules.map((r) => r.rule.id),
        report: existsSync(join(runDir, 'report.html')),
      });
      const part = makePartial(settled, run, shard.k, items);
      return shardDone(io, args, writePartial(resolve(io.cwd, String(args.out)), part), part);
    }
    const extra = existsSync(join(runDir, 'report.html'))
      ? [{ name: 'report.html', data: await buildReportHtml(toRulesJson(settled), model.evaluate, { title: scenario.title }) }]
      : [];
    progress.stop();
    const files = writeRunFolder(runDir, settled, extra);
    if (args.json) io.stdout(JSON.stringify({ runFolder: runDir, files, ...toRulesJson(settled) }) + '\n');
    else if (!args.quiet) io.stdout(summaryText(settled, { files: files.map((f) => relative(io.cwd, f) || f) }));
    return EXIT.OK;
  } finally {
    progress.stop();
    await model.close();
  }
}

function numberSetting(v: unknown, fallback: number): number {
  return typeof v === 'number' && Number.isFinite(v) ? v : fallback;
}
