import { join, relative, resolve } from 'node:path';
import type { Argv } from 'yargs';
import { ModelError, UsageError } from '../../errors.js';
import { loadScenario } from '../../scenario/index.js';
import { loadModel } from '../../model/index.js';
import { CHANGE_MIN_SHARE_DEFAULT, diffJson, diffModels, diffPart, type DiffSettings, type RuleSource, diffSummaryText, evaluateGates, parseFailOn, readRuleSource, writeDiffFolder } from '../../diff/index.js';
import type { Model, Scenario } from '../../types.js';
import { positiveInt, timestamp } from '../option-checks.js';
import type { CliIo } from '../io.js';
import { commonOptions, samplingOptions } from '../options.js';
import { createProgress } from '../progress.js';
import { EXIT } from '../exit-codes.js';
import { MINE_DEFAULTS } from './mine.js';
import { SHARD_OPTION, shardDone } from './merge.js';
import { CHANGE_ITEM, fileSha256, makeDiffPartial, partialRun, shardIndices, shardSpec, writePartial, type ShardSpec } from '../../shard/index.js';

export const DIFF_DEFAULTS = {
  changeSamples: 100_000,
  changeBudget: 100_000,
  maxChangeRules: 20,
  changeCheckSamples: 5_000,
} as const;

export function diffBuilder<T>(y: Argv<T>) {
  return commonOptions(samplingOptions(y))
    .positional('scenario', { type: 'string', describe: 'scenario.json', demandOption: true })
    .option('before', { type: 'string', demandOption: true, describe: 'the accepted (old) model file' })
    .option('after', { type: 'string', demandOption: true, describe: 'the new model file' })
    .option('rules', { type: 'string', describe: 'the accepted table: a rule file, rules.json or rules.csv (default: mined from --before)' })
    .option('out', { type: 'string', describe: 'diff folder (default runs/<scenario>-diff-<timestamp>)' })
    .option('fail-on', { type: 'string', array: true, nargs: 1, default: ['broken,degraded'], describe: 'gates that make the exit code 1: broken, degraded, no-longer-proven, refuted, changed>P%, none (repeatable or comma-separated)' })
    .option('check-samples', { type: 'number', default: MINE_DEFAULTS.checkSamples, describe: 'dense samples per rule' })
    .option('prove', { type: 'boolean', default: true, describe: 'prove the rules on both models (--no-prove to skip)' })
    .option('prove-boxes', { type: 'number', default: MINE_DEFAULTS.proveBoxes, describe: 'proof budget per rule: pieces of the box bounded' })
    .option('prove-seconds', { type: 'number', default: MINE_DEFAULTS.proveSeconds, describe: 'proof budget per rule: seconds (safety net)' })
    .option('samples', { type: 'number', default: MINE_DEFAULTS.samples, describe: 'without --rules: network samples for mining the table from --before' })
    .option('max-rules', { type: 'number', default: MINE_DEFAULTS.maxRules, describe: 'without --rules: largest number of rules mined' })
    .option('min-leaf', { type: 'number', default: MINE_DEFAULTS.minLeaf, describe: 'smallest leaf of the full trees, in samples' })
    .option('round-tolerance', { type: 'number', default: MINE_DEFAULTS.roundTolerance, describe: 'agreement that readable thresholds may cost (0..1)' })
    .option('change-samples', { type: 'number', default: DIFF_DEFAULTS.changeSamples, describe: 'fresh uniform samples for the changed share and the confusion matrix' })
    .option('change-budget', { type: 'number', default: DIFF_DEFAULTS.changeBudget, describe: 'samples of both models for learning the change rules' })
    .option('max-change-rules', { type: 'number', default: DIFF_DEFAULTS.maxChangeRules, describe: 'largest number of change rules' })
    .option('change-min-share', { type: 'number', default: CHANGE_MIN_SHARE_DEFAULT, describe: 'smallest share of the domain a split of the change rules must explain (0..1)' })
    .option('change-check-samples', { type: 'number', default: DIFF_DEFAULTS.changeCheckSamples, describe: 'dense samples per change rule' })
    .option('shard', { ...SHARD_OPTION, describe: 'do only part K of N of the work (needs --rules): accepted rule i goes to part (i mod N) + 1, the changed share and change rules are one more item; writes shard-K-of-N.json to --out; join with specula merge' })
    .example('$0 diff scenario.json --before model.onnx --after model-v2.onnx --rules runs/accepted/rules.json', 'the accepted table on the new model, and where the advisory changed')
    .example('$0 diff scenario.json --before a.onnx --after b.onnx --fail-on broken --fail-on "changed>0.5%"', 'a CI gate: exit 1 when a rule broke or more than 0.5 % of the domain changed')
    .example('$0 diff scenario.json --before a.onnx --after b.onnx --rules accepted.rules --shard 1/4 --out parts', 'part 1 of 4; then: $0 merge parts --out runs/diff');
}

type DiffArgs = Awaited<ReturnType<ReturnType<typeof diffBuilder>['parseAsync']>>;

/** Loads one side of the diff; a width that does not match the scenario is named as a before/after mismatch. */
async function loadSide(scenario: Scenario, side: 'before' | 'after', path: string, threads: number): Promise<Model> {
  try {
    return await loadModel(scenario, { modelPath: path, threads });
  } catch (e) {
    if (e instanceof ModelError && e.code === 'MODEL_WIDTH_MISMATCH') {
      throw new ModelError(
        'DIFF_WIDTH_MISMATCH',
        `--${side} ${e.message}; before and after must both take ${scenario.inputs.length} inputs and give ${scenario.advisories.length} scores (the scenario's widths)`,
      );
    }
    throw e;
  }
}

/**
 * One shard of `diff`: the accepted rules at the shard's indices, on both models, and the change
 * figures when the shard holds item R (R = number of rules), packed with the whole run's identity
 * into shard-K-of-N.json in `where.out`.
 */
async function diffShard(
  scenario: Scenario,
  before: Model,
  after: Model,
  source: RuleSource,
  settings: DiffSettings,
  shard: ShardSpec,
  where: { out: string; failOn: string },
  progress: ReturnType<typeof createProgress>,
) {
  const count = source.rules.length;
  const ids = [...source.rules.map((r) => r.id), CHANGE_ITEM];
  const indices = shardIndices(count + 1, shard);
  const rules = indices.filter((i) => i < count).map((i) => source.rules[i]!);
  const share = await diffPart(scenario, before, after, source, settings, { rules, change: indices.includes(count) }, progress);
  const run = partialRun('diff', {
    scenarioSha256: scenario.scenarioSha256,
    models: { before: before.sha256, after: after.sha256 },
    inputSha256: fileSha256(source.path),
    settings: { ...share.manifest.settings, seed: settings.seed, failOn: where.failOn },
    shards: shard.n,
    ids,
    report: false,
  });
  const part = makeDiffPartial(share, run, shard.k, indices, ids);
  return { path: writePartial(where.out, part), part };
}

/**
 * `specula diff SCENARIO --before A.onnx --after B.onnx`: the accepted table re-checked on the new
 * model, the changed share with its interval, change rules; writes diff.json and diff.md.
 * Exit 1 when a gate trips (default: a rule broke, or a refuted rule got clearly worse).
 */
export async function runDiff(args: DiffArgs, io: CliIo): Promise<number> {
  const confidence = args.confidence;
  if (!(confidence > 0 && confidence < 1)) throw new UsageError(`--confidence: expected a number between 0 and 1, found ${confidence}`);
  if (!Number.isInteger(args.seed) || args.seed < 0 || args.seed > 0xffffffff) throw new UsageError(`--seed: expected an integer in [0, 4294967295], found ${args.seed}`);
  const roundTolerance = args['round-tolerance'];
  if (!(roundTolerance >= 0 && roundTolerance < 1)) throw new UsageError(`--round-tolerance: expected a number in [0, 1), found ${roundTolerance}`);
  const proveSeconds = args['prove-seconds'];
  if (!(Number.isFinite(proveSeconds) && proveSeconds > 0)) throw new UsageError(`--prove-seconds: expected a positive number, found ${proveSeconds}`);
  const gates = parseFailOn(args['fail-on'].map(String));
  const check = {
    seed: args.seed,
    checkSamples: positiveInt('check-samples', args['check-samples']),
    confidence,
    prove: args.prove,
    proveBoxes: positiveInt('prove-boxes', args['prove-boxes']),
    proveSeconds,
    jobs: positiveInt('jobs', args.jobs),
  };
  // the accepted table is mined without repair: sub-rules made on one model are not compared
  const mineSettings = {
    ...check,
    budget: positiveInt('samples', args.samples),
    maxRules: positiveInt('max-rules', args['max-rules']),
    minLeaf: positiveInt('min-leaf', args['min-leaf']),
    roundTolerance,
    boundaryShare: MINE_DEFAULTS.boundaryShare,
    fidelitySamples: MINE_DEFAULTS.fidelitySamples,
    repair: false,
  };
  const settings = {
    ...check,
    mine: mineSettings,
    changeSamples: positiveInt('change-samples', args['change-samples']),
    changeBudget: positiveInt('change-budget', args['change-budget']),
    maxChangeRules: positiveInt('max-change-rules', args['max-change-rules']),
    minLeaf: positiveInt('min-leaf', args['min-leaf']),
    roundTolerance,
    changeCheckSamples: positiveInt('change-check-samples', args['change-check-samples']),
    changeMinShare: args['change-min-share'],
  };
  if (!(settings.changeMinShare >= 0 && settings.changeMinShare < 1)) {
    throw new UsageError(`--change-min-share: expected a number in [0, 1), found ${settings.changeMinShare}`);
  }
  const threads = positiveInt('threads', args.threads);
  const shard = args.shard === undefined ? undefined : shardSpec(String(args.shard));
  if (shard && args.out === undefined) throw new UsageError('--shard: name the folder for the partial result with --out');
  if (shard && args.rules === undefined) throw new UsageError('--shard: diff needs the accepted table with --rules (mining it from --before is one step that is not split)');
  const scenario = loadScenario(resolve(io.cwd, String(args.scenario)));
  const source = args.rules === undefined ? undefined : readRuleSource(resolve(io.cwd, args.rules), scenario);
  for (const w of source?.warnings ?? []) io.stderr(`specula: warning: ${w}\n`);
  const before = await loadSide(scenario, 'before', resolve(io.cwd, args.before), threads);
  let after: Model | undefined;
  const progress = createProgress(io, args.quiet || args.json);
  try {
    after = await loadSide(scenario, 'after', resolve(io.cwd, args.after), threads);
    if (shard && source) {
      const written = await diffShard(scenario, before, after, source, settings, shard, { out: resolve(io.cwd, String(args.out)), failOn: args['fail-on'].map(String).join(',') }, progress);
      progress.stop();
      return shardDone(io, args, written.path, written.part);
    }
    const result = await diffModels(scenario, before, after, source, settings, progress);
    progress.stop();
    const outcomes = evaluateGates(result, gates);
    const out = resolve(io.cwd, args.out ?? join('runs', `${scenario.name}-diff-${timestamp(new Date())}`));
    const files = writeDiffFolder(out, result, outcomes);
    const code = outcomes.some((g) => g.tripped) ? EXIT.FINDINGS : EXIT.OK;
    if (args.json) io.stdout(JSON.stringify({ diffFolder: out, files, exitCode: code, ...diffJson(result, outcomes) }) + '\n');
    else if (!args.quiet) io.stdout(diffSummaryText(result, outcomes, files.map((f) => relative(io.cwd, f) || f)));
    return code;
  } finally {
    progress.stop();
    await before.close();
    await after?.close();
  }
}
