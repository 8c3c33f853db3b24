import { join, relative, resolve } from 'node:path';
import type { Argv } from 'yargs';
import { loadScenario } from '../../scenario/index.js';
import { loadModel } from '../../model/index.js';
import { mine } from '../../pipeline/mine.js';
import { summaryText, toRulesJson, writeRunFolder } from '../../report/index.js';
import { buildReportHtml } from '../../report/html/index.js';
import { UsageError } from '../../errors.js';
import { positiveInt, positiveNumber, shareBelowOne, timestamp } from '../option-checks.js';
import type { CliIo } from '../io.js';
import { commonOptions, samplingOptions } from '../options.js';
import { TIME_BUDGET_OPTION, timeBudgetOf, warnIfLong } from '../time-budget.js';
import { createProgress } from '../progress.js';
import { EXIT } from '../exit-codes.js';

export const MINE_DEFAULTS = {
  samples: 200_000,
  /** Measured on both demo scenarios (docs/performance.md): 0.3 keeps survey-boat's fidelity and costs the oblique cruise-spacing boundaries least. */
  boundaryShare: 0.3,
  maxRules: 60,
  minLeaf: 5,
  /** 0.1 percentage point of agreement with the samples may be traded for readable thresholds. */
  roundTolerance: 0.001,
  checkSamples: 20_000,
  fidelitySamples: 100_000,
  proveBoxes: 20_000,
  proveSeconds: 20,
} as const;

export function mineBuilder<T>(y: Argv<T>) {
  return commonOptions(samplingOptions(y))
    .option('time-budget', TIME_BUDGET_OPTION)
    .positional('scenario', { type: 'string', describe: 'scenario.json', demandOption: true })
    .option('out', { type: 'string', describe: 'run folder (default runs/<scenario>-<timestamp>)' })
    .option('model', { type: 'string', describe: 'model file instead of the one the scenario names' })
    .option('samples', { type: 'number', default: MINE_DEFAULTS.samples, describe: 'network samples for learning the tree' })
    .option('boundary-share', { type: 'number', default: MINE_DEFAULTS.boundaryShare, describe: 'share of the samples spent near decision boundaries (0..1)' })
    .option('max-rules', { type: 'number', default: MINE_DEFAULTS.maxRules, describe: 'largest number of rules in the table' })
    .option('min-leaf', { type: 'number', default: MINE_DEFAULTS.minLeaf, describe: 'smallest leaf of the full tree, in samples' })
    .option('round-tolerance', { type: 'number', default: MINE_DEFAULTS.roundTolerance, describe: 'agreement that readable thresholds may cost (0..1)' })
    .option('check-samples', { type: 'number', default: MINE_DEFAULTS.checkSamples, describe: 'dense samples per rule for checking' })
    .option('fidelity-samples', { type: 'number', default: MINE_DEFAULTS.fidelitySamples, describe: 'fresh uniform samples for the fidelity figures' })
    .option('report', { type: 'boolean', default: true, describe: 'write report.html with slice plots (--no-report to skip)' })
    .option('prove', { type: 'boolean', default: true, describe: 'prove the rules by bound propagation (--no-prove to skip)' })
    .option('repair', { type: 'boolean', default: false, describe: 'split refuted rules into proven readable sub-rules (slow: minutes on the demo)' })
    .option('prove-boxes', { type: 'number', default: MINE_DEFAULTS.proveBoxes, describe: 'proof budget per rule: pieces of the box bounded' })
    .option('prove-seconds', { type: 'number', default: MINE_DEFAULTS.proveSeconds, describe: 'proof budget per rule: seconds (safety net)' })
    .example('$0 mine scenarios/survey-boat/scenario.json', 'mine the demo scenario into runs/survey-boat-<timestamp>')
    .example('$0 mine scenario.json --model retrained.onnx --out runs/v2 --max-rules 40', 'mine another model file with a smaller table');
}

type MineArgs = Awaited<ReturnType<ReturnType<typeof mineBuilder>['parseAsync']>>;

export async function runMine(args: MineArgs, io: CliIo): Promise<number> {
  const confidence = args.confidence;
  if (!(confidence > 0 && confidence < 1)) throw new UsageError(`--confidence: expected a number between 0 and 1, found ${confidence}`);
  if (!(args['round-tolerance'] >= 0 && args['round-tolerance'] < 1)) {
    throw new UsageError(`--round-tolerance: expected a number in [0, 1), found ${args['round-tolerance']}`);
  }
  const settings = {
    seed: positiveIntOrZero('seed', args.seed),
    budget: positiveInt('samples', args.samples),
    boundaryShare: shareBelowOne('boundary-share', args['boundary-share']),
    maxRules: positiveInt('max-rules', args['max-rules']),
    minLeaf: positiveInt('min-leaf', args['min-leaf']),
    roundTolerance: args['round-tolerance'],
    checkSamples: positiveInt('check-samples', args['check-samples']),
    fidelitySamples: positiveInt('fidelity-samples', args['fidelity-samples']),
    confidence,
    prove: args.prove,
    proveBoxes: positiveInt('prove-boxes', args['prove-boxes']),
    proveSeconds: positiveNumber('prove-seconds', args['prove-seconds']),
    jobs: positiveInt('jobs', args.jobs),
    repair: args.repair,
  };
  const timeBudget = timeBudgetOf(args['time-budget']);
  const scenario = loadScenario(resolve(io.cwd, String(args.scenario)));
  const modelOptions = { threads: positiveInt('threads', args.threads), ...(args.model ? { modelPath: resolve(io.cwd, args.model) } : {}) };
  const model = await loadModel(scenario, modelOptions);
  const progress = createProgress(io, args.quiet || args.json);
  try {
    warnIfLong(io, { kind: 'mine', scenario, model, samples: settings.budget, rules: settings.maxRules, ...settings }, timeBudget);
    const table = await mine(scenario, model, settings, progress);
    progress.stop();
    const out = resolve(io.cwd, args.out ?? join('runs', `${scenario.name}-${timestamp(new Date())}`));
    const extra = [];
    if (args.report) {
      progress.onStage('report');
      extra.push({ name: 'report.html', data: await buildReportHtml(toRulesJson(table), model.evaluate, { title: scenario.title }) });
    }
    const files = writeRunFolder(out, table, extra);
    const shown = files.map((f) => relative(io.cwd, f) || f);
    if (args.json) io.stdout(JSON.stringify({ runFolder: out, files, ...toRulesJson(table) }) + '\n');
    else if (!args.quiet) io.stdout(summaryText(table, { files: shown }));
    return EXIT.OK;
  } finally {
    progress.stop();
    await model.close();
  }
}

function positiveIntOrZero(name: string, v: number): number {
  if (!Number.isInteger(v) || v < 0 || v > 0xffffffff) throw new UsageError(`--${name}: expected an integer in [0, 4294967295], found ${v}`);
  return v;
}
