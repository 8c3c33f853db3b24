import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import type { Argv } from 'yargs';
import { UsageError } from '../../errors.js';
import { loadScenario } from '../../scenario/index.js';
import { loadModel } from '../../model/index.js';
import { checkTable, counterexampleText, readRuleSource, type RuleSource } from '../../diff/index.js';
import { compareReference, readReferenceTable, referenceFiles, referenceSummaryText } from '../../reference/index.js';
import { cautionsText, summaryText, toRulesJson, writeFilesAtomic, writeRunFolder } from '../../report/index.js';
import { buildReportHtml } from '../../report/html/index.js';
import type { Model, RuleTable, Scenario } from '../../types.js';
import { toolVersion } from '../../version.js';
import { positiveInt, timestamp } from '../option-checks.js';
import type { CliIo } from '../io.js';
import { commonOptions, samplingOptions } from '../options.js';
import { createProgress } from '../progress.js';
import { EXIT } from '../exit-codes.js';
import { MINE_DEFAULTS } from './mine.js';
import { SHARD_OPTION, shardDone } from './merge.js';
import { makePartial, partialRun, selectShard, shardIndices, shardSpec, writePartial, type ShardSpec } from '../../shard/index.js';
import { TIME_BUDGET_OPTION, timeBudgetOf, warnIfLong } from '../time-budget.js';

export function checkBuilder<T>(y: Argv<T>) {
  return commonOptions(samplingOptions(y))
    .positional('scenario', { type: 'string', describe: 'scenario.json', demandOption: true })
    .positional('rules', { type: 'string', describe: 'rules to check: a rule file (.rules), a run\'s rules.json or rules.csv' })
    .option('model', { type: 'string', describe: 'model file instead of the one the scenario names' })
    .option('out', { type: 'string', describe: 'output folder (default runs/<scenario>-check-<timestamp>)' })
    .option('check-samples', { type: 'number', default: MINE_DEFAULTS.checkSamples, describe: 'dense samples per rule' })
    .option('prove', { type: 'boolean', default: true, describe: 'prove the rules by bound propagation (--no-prove to skip)' })
    .option('prove-boxes', { type: 'number', default: MINE_DEFAULTS.proveBoxes, describe: 'proof budget per rule: pieces of the box bounded' })
    .option('prove-seconds', { type: 'number', default: MINE_DEFAULTS.proveSeconds, describe: 'proof budget per rule: seconds (safety net)' })
    .option('repair', { type: 'boolean', default: false, describe: 'follow refuted rules by proven readable sub-rules (as mine does)' })
    .option('report', { type: 'boolean', default: true, describe: 'write report.html with slice plots (--no-report to skip)' })
    .option('reference', { type: 'string', describe: 'reference lookup table (CSV: one column per input, one advisory column) to compare at its grid points' })
    .option('min-agreement', { type: 'number', default: 1, describe: 'with --reference: exit 1 when the share of agreeing grid points is below this (0..1)' })
    .option('shard', SHARD_OPTION)
    .option('time-budget', TIME_BUDGET_OPTION)
    .example('$0 check scenarios/survey-boat/scenario.json scenarios/survey-boat/expectations.rules', 'check expert expectations on the scenario\'s model')
    .example('$0 check scenario.json runs/accepted/rules.json --model retrained.onnx', 'check an accepted table on a retrained model')
    .example('$0 check scenario.json --reference table.csv --min-agreement 0.99', 'compare the network with a lookup table at its grid points')
    .example('$0 check scenario.json expect.rules --shard 2/4 --out parts', 'part 2 of 4 of the rules; then: $0 merge parts --out runs/checked');
}

type CheckArgs = Awaited<ReturnType<ReturnType<typeof checkBuilder>['parseAsync']>>;

function sha256Of(path: string): string {
  return createHash('sha256').update(readFileSync(path)).digest('hex');
}

/** Per refuted rule: where the network breaks it (the summary shows the notes). */
function findingsText(table: RuleTable): string[] {
  const lines: string[] = [];
  for (const { rule, evidence } of table.rules) {
    if (evidence.status === 'refuted' && evidence.counterexample) {
      lines.push(`${rule.id} refuted: ${counterexampleText(evidence.counterexample, table.inputs, table.advisories)}`);
    }
  }
  return lines;
}

type CheckSettings = Parameters<typeof checkTable>[3];

/**
 * One shard of `check`: the rules at the shard's indices of the whole rule list, checked (and
 * proved) exactly as the single run checks them (each rule's samples depend on the seed and its
 * id only), packed with the whole run's identity into shard-K-of-N.json in `where.out`.
 */
async function checkShard(
  scenario: Scenario,
  model: Model,
  source: RuleSource,
  settings: CheckSettings,
  shard: ShardSpec,
  where: { out: string; report: boolean },
  progress: ReturnType<typeof createProgress>,
) {
  const repair = settings.repair ?? false;
  // with repair, sub-rules of an earlier repair are dropped and re-derived (as checkTable does)
  const items = selectShard(source.rules, shard, (r) => !(repair && r.origin.kind === 'repaired'));
  const table = await checkTable(scenario, model, items.map((i) => i.rule), settings, { command: 'check', source: source.path, notes: source.warnings }, progress);
  const run = partialRun('check', {
    scenarioSha256: scenario.scenarioSha256,
    models: { model: model.sha256 },
    inputSha256: sha256Of(source.path),
    settings,
    shards: shard.n,
    ids: source.rules.map((r) => r.id),
    report: where.report,
  });
  const part = makePartial(table, run, shard.k, items);
  return { path: writePartial(where.out, part), part };
}

/**
 * `specula check SCENARIO [RULES] [--reference TABLE]`: checks given rules on dense samples and
 * proves them where the graph is supported; compares the network with a reference table at its
 * grid points. Exit 0 when every rule holds and the agreement gate passes, 1 otherwise.
 */
export async function runCheck(args: CheckArgs, io: CliIo): Promise<number> {
  if (args.rules === undefined && args.reference === undefined) {
    throw new UsageError('name the rules to check (a rule file, rules.json or rules.csv) or a reference table with --reference');
  }
  const confidence = args.confidence;
  if (!(confidence > 0 && confidence < 1)) throw new UsageError(`--confidence: expected a number between 0 and 1, found ${confidence}`);
  const minAgreement = args['min-agreement'];
  if (!(minAgreement >= 0 && minAgreement <= 1)) throw new UsageError(`--min-agreement: expected a number in [0, 1], found ${minAgreement}`);
  if (!Number.isInteger(args.seed) || args.seed < 0 || args.seed > 0xffffffff) throw new UsageError(`--seed: expected an integer in [0, 4294967295], found ${args.seed}`);
  const settings = {
    seed: args.seed,
    checkSamples: positiveInt('check-samples', args['check-samples']),
    confidence,
    prove: args.prove,
    proveBoxes: positiveInt('prove-boxes', args['prove-boxes']),
    proveSeconds: args['prove-seconds'],
    jobs: positiveInt('jobs', args.jobs),
    repair: args.repair,
  };
  if (!(Number.isFinite(settings.proveSeconds) && settings.proveSeconds > 0)) throw new UsageError(`--prove-seconds: expected a positive number, found ${settings.proveSeconds}`);
  const shard = args.shard === undefined ? undefined : shardSpec(String(args.shard));
  if (shard && args.out === undefined) throw new UsageError('--shard: name the folder for the partial result with --out');
  if (shard && args.reference !== undefined) throw new UsageError('--shard: cannot be used with --reference (the reference comparison is not split); run it without --shard');
  const scenario = loadScenario(resolve(io.cwd, String(args.scenario)));
  // Read every input file before the model is loaded, so bad input fails fast.
  const source = args.rules === undefined ? undefined : readRuleSource(resolve(io.cwd, String(args.rules)), scenario);
  for (const w of source?.warnings ?? []) io.stderr(`specula: warning: ${w}\n`);
  const tablePath = args.reference === undefined ? undefined : resolve(io.cwd, args.reference);
  const grid = tablePath === undefined ? undefined : readReferenceTable(tablePath, scenario);
  const model = await loadModel(scenario, { threads: positiveInt('threads', args.threads), ...(args.model ? { modelPath: resolve(io.cwd, args.model) } : {}) });
  const progress = createProgress(io, args.quiet || args.json);
  try {
    if (source) {
      const rules = shard ? shardIndices(source.rules.length, shard).length : source.rules.length;
      warnIfLong(io, { kind: 'check', scenario, model, samples: 0, fidelitySamples: 0, rules, ...settings }, timeBudgetOf(args['time-budget']));
    }
    if (shard && source) {
      const written = await checkShard(scenario, model, source, settings, shard, { out: resolve(io.cwd, String(args.out)), report: args.report }, progress);
      progress.stop();
      return shardDone(io, args, written.path, written.part);
    }
    const table = source === undefined
      ? undefined
      : await checkTable(scenario, model, source.rules, settings, { command: 'check', source: source.path, notes: source.warnings }, progress);
    if (grid) progress.onStage('comparing with the reference table');
    const comparison = grid === undefined ? undefined : await compareReference(grid, model.evaluate, scenario.advisories.length);
    const { tool, version } = toolVersion();
    const refFiles = comparison === undefined || tablePath === undefined
      ? []
      : referenceFiles(comparison, {
          scenario: { path: scenario.scenarioPath, sha256: scenario.scenarioSha256, name: scenario.name },
          model: { path: model.path, sha256: model.sha256 },
          table: { path: tablePath, sha256: sha256Of(tablePath) },
          tool,
          toolVersion: version,
          date: new Date().toISOString(),
        }, scenario.inputs, scenario.advisories);
    const out = resolve(io.cwd, args.out ?? join('runs', `${scenario.name}-check-${timestamp(new Date())}`));
    let files: string[];
    if (table) {
      const extra: Array<{ name: string; data: string }> = [...refFiles];
      if (args.report) {
        progress.onStage('report');
        extra.push({ name: 'report.html', data: await buildReportHtml(toRulesJson(table), model.evaluate, { title: scenario.title }) });
      }
      progress.stop();
      files = writeRunFolder(out, table, extra);
    } else {
      progress.stop();
      files = refFiles.map((f) => join(out, f.name));
      writeFilesAtomic(refFiles.map((f) => ({ path: join(out, f.name), data: f.data })));
    }
    const refuted = table?.rules.filter((r) => r.evidence.status === 'refuted').length ?? 0;
    const agreement = comparison === undefined ? 1 : comparison.agree / comparison.points;
    const code = refuted > 0 || agreement < minAgreement ? EXIT.FINDINGS : EXIT.OK;
    if (args.json) {
      const reference = refFiles.length > 0 ? JSON.parse(refFiles[0]!.data) : undefined;
      io.stdout(JSON.stringify({ outFolder: out, files, exitCode: code, ...(table ? { ...toRulesJson(table), notes: table.notes ?? [] } : {}), ...(reference ? { reference } : {}) }) + '\n');
    } else if (!args.quiet) {
      const shown = files.map((f) => relative(io.cwd, f) || f);
      const ref = comparison ? referenceSummaryText(comparison, scenario.inputs, scenario.advisories) : '';
      const gate = comparison && agreement < minAgreement ? `reference gate: agreement ${(100 * agreement).toFixed(2)} % is below --min-agreement ${(100 * minAgreement).toFixed(2)} %\n` : '';
      if (table) {
        const text = summaryText(table, { files: shown });
        const at = text.indexOf('\nfiles:\n');
        const extra = findingsText(table).map((l) => l + '\n').join('') + ref + gate;
        io.stdout(at < 0 ? text + extra : text.slice(0, at + 1) + extra + text.slice(at));
      } else {
        io.stdout(ref + gate + '\nfiles:\n' + shown.map((f) => `  ${f}\n`).join('') + '\n' + cautionsText() + '\n');
      }
    }
    return code;
  } finally {
    progress.stop();
    await model.close();
  }
}
