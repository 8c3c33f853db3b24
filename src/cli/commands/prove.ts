import { join, relative, resolve } from 'node:path';
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import type { Argv } from 'yargs';
import { readRulesJson, fromRulesJson } from '../../report/export/index.js';
import { openRunModel, buildReportHtml } from '../../report/html/index.js';
import { summaryText, toRulesJson, writeRunFolder } from '../../report/index.js';
import { settleTable } from '../../pipeline/settle-table.js';
import { positiveInt, positiveNumber } from '../option-checks.js';
import type { CliIo } from '../io.js';
import { commonOptions } from '../options.js';
import { createProgress } from '../progress.js';
import { EXIT } from '../exit-codes.js';
import { MINE_DEFAULTS } from './mine.js';

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
    .example('$0 prove runs/demo', 're-prove the rules of runs/demo and rewrite its files')
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
  json: boolean;
  quiet: boolean;
};

/** `specula prove RUN_DIR`: (re)proves the rules of a run and rewrites its files atomically. */
export async function runProve(args: ProveArgs, io: CliIo): Promise<number> {
  const boxes = args['prove-boxes'];
  const seconds = args['prove-seconds'];
  positiveInt('prove-boxes', boxes);
  positiveInt('jobs', args.jobs);
  positiveNumber('prove-seconds', seconds);
  const runDir = resolve(io.cwd, String(args.run));
  const { doc } = readRulesJson(join(runDir, 'rules.json'));
  const table = fromRulesJson(doc, join(runDir, 'rules.json'));
  const { model, scenario } = await openRunModel(doc, {
    threads: args.threads,
    ...(args.model ? { modelPath: resolve(io.cwd, args.model) } : {}),
    ...(args.scenario ? { scenarioPath: resolve(io.cwd, args.scenario) } : {}),
  });
  const progress = createProgress(io, args.quiet || args.json);
  try {
    const settled = await settleTable(table, scenario, model, {
      proveBoxes: boxes,
      proveSeconds: seconds,
      jobs: args.jobs,
      repair: args.repair,
      seed: table.manifest.seed,
      checkSamples: numberSetting(table.manifest.settings['checkSamples'], MINE_DEFAULTS.checkSamples),
      confidence: numberSetting(table.manifest.settings['confidence'], 0.95),
    }, progress);
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
