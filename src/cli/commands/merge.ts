import { readdirSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import type { Argv } from 'yargs';
import { UsageError } from '../../errors.js';
import { checkParts, mergeDiffParts, mergeParts, readPartial, type PartAt, type PartialFile } from '../../shard/index.js';
import { diffJson, diffSummaryText, evaluateGates, parseFailOn, writeDiffFolder } from '../../diff/index.js';
import { openRunModel, buildReportHtml } from '../../report/html/index.js';
import { summaryText, toRulesJson, writeRunFolder } from '../../report/index.js';
import type { CliIo } from '../io.js';
import { commonOptions } from '../options.js';
import { positiveInt } from '../option-checks.js';
import { EXIT } from '../exit-codes.js';

/** The `--shard` option of check and prove. */
export const SHARD_OPTION = {
  type: 'string',
  describe: 'do only part K of N of the work (e.g. 2/4; rule i goes to part (i mod N) + 1) and write shard-K-of-N.json to --out; join the parts with specula merge',
} as const;

export function mergeBuilder<T>(y: Argv<T>) {
  return commonOptions(y)
    .positional('parts', { type: 'string', array: true, describe: 'partial result files (shard-K-of-N.json), or folders holding them', demandOption: true })
    .option('out', { type: 'string', demandOption: true, describe: 'run folder to write (rules.json, rules.csv, rules.md, atlas.json, report.html; for diff: diff.json, diff.md)' })
    .option('model', { type: 'string', describe: "for report.html: the run's model file, if it moved (its SHA-256 must match)" })
    .option('scenario', { type: 'string', describe: "for report.html: the run's scenario file, if it moved (its SHA-256 must match)" })
    .option('threads', { type: 'number', default: 1, describe: 'onnxruntime intra-op threads (report.html plots)' })
    .example('$0 merge parts/ --out runs/checked', 'join every shard-K-of-N.json in parts/ into one run folder')
    .example('$0 merge parts/shard-1-of-2.json parts/shard-2-of-2.json --out runs/demo', 'join two named parts');
}

type MergeArgs = {
  parts: string[];
  out: string;
  model?: string | undefined;
  scenario?: string | undefined;
  threads: number;
  json: boolean;
  quiet: boolean;
};

/** Files named on the command line, with each folder replaced by the shard-K-of-N.json files it holds. */
function partPaths(given: readonly string[], cwd: string): string[] {
  const out: string[] = [];
  for (const g of given) {
    const abs = resolve(cwd, g);
    let dir = false;
    try {
      dir = statSync(abs).isDirectory();
    } catch {
      dir = false; // readPartial names a missing file
    }
    if (!dir) {
      out.push(g);
      continue;
    }
    const found = readdirSync(abs).filter((f) => /^shard-\d+-of-\d+\.json$/.test(f)).sort((a, b) => a.localeCompare(b, 'en', { numeric: true }));
    if (found.length === 0) throw new UsageError(`${g}: no partial result files (shard-K-of-N.json) in this folder`);
    out.push(...found.map((f) => join(g, f)));
  }
  return out;
}

/**
 * `specula merge PARTS… --out RUN_DIR`: checks that the parts are the complete set of one run
 * (exit 2 naming the file and what differs otherwise) and writes the run folder the single run
 * would have written, atomically. Exit code as the single run: for check, 1 when a rule is refuted.
 */
export async function runMerge(args: MergeArgs, io: CliIo): Promise<number> {
  const threads = positiveInt('threads', args.threads);
  const parts: PartAt[] = partPaths(args.parts, io.cwd).map((path) => ({ path, part: readPartial(resolve(io.cwd, path)) }));
  checkParts(parts);
  const run = parts[0]!.part.run;
  if (run.command === 'diff') return mergeDiff(parts, args, io);
  const table = mergeParts(parts);
  const extra: Array<{ name: string; data: string }> = [];
  if (run.report) {
    const { model, scenario } = await openRunModel(toRulesJson(table), {
      threads,
      ...(args.model ? { modelPath: resolve(io.cwd, args.model) } : {}),
      ...(args.scenario ? { scenarioPath: resolve(io.cwd, args.scenario) } : {}),
    });
    try {
      extra.push({ name: 'report.html', data: await buildReportHtml(toRulesJson(table), model.evaluate, { title: scenario.title }) });
    } finally {
      await model.close();
    }
  }
  const out = resolve(io.cwd, args.out);
  const files = writeRunFolder(out, table, extra);
  const refuted = table.rules.some((r) => r.evidence.status === 'refuted');
  const code = run.command === 'check' && refuted ? EXIT.FINDINGS : EXIT.OK;
  if (args.json) io.stdout(JSON.stringify({ runFolder: out, files, exitCode: code, parts: parts.length, ...toRulesJson(table) }) + '\n');
  else if (!args.quiet) io.stdout(`merged ${parts.length} parts of ${run.command} (${run.items} rules)\n` + summaryText(table, { files: files.map((f) => relative(io.cwd, f) || f) }));
  return code;
}

/** merge for diff: diff.json and diff.md as the single diff writes them, with its gates and exit code. */
function mergeDiff(parts: readonly PartAt[], args: MergeArgs, io: CliIo): number {
  const result = mergeDiffParts(parts);
  const outcomes = evaluateGates(result, parseFailOn([String(parts[0]!.part.run.settings['failOn'])]));
  const out = resolve(io.cwd, args.out);
  const files = writeDiffFolder(out, result, outcomes);
  const code = outcomes.some((g) => g.tripped) ? EXIT.FINDINGS : EXIT.OK;
  if (args.json) io.stdout(JSON.stringify({ diffFolder: out, files, exitCode: code, parts: parts.length, ...diffJson(result, outcomes) }) + '\n');
  else if (!args.quiet) io.stdout(`merged ${parts.length} parts of diff\n` + diffSummaryText(result, outcomes, files.map((f) => relative(io.cwd, f) || f)));
  return code;
}

/**
 * What a shard prints when its partial file is written; a shard exits 0 whatever its rules
 * show (the verdict belongs to the merged run), so a batch scheduler does not retry it.
 */
export function shardDone(io: CliIo, opts: { json: boolean; quiet: boolean }, path: string, part: PartialFile): number {
  const shown = relative(io.cwd, path) || path;
  const results = (part.table ?? part.diff)?.rules.length ?? 0;
  if (opts.json) {
    io.stdout(JSON.stringify({ partFile: path, shard: `${part.shard}/${part.run.shards}`, items: part.items.map((i) => i.id), results }) + '\n');
  } else if (!opts.quiet) {
    io.stdout(
      `${part.run.command} shard ${part.shard}/${part.run.shards}: ${part.items.length} of ${part.run.items} rules, ${results} result rules\n` +
        `wrote ${shown}\njoin the parts with: specula merge <folder or files of all ${part.run.shards} parts> --out RUN_DIR\n`,
    );
  }
  return EXIT.OK;
}
