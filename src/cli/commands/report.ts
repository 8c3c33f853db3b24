import { join, relative, resolve } from 'node:path';
import type { Argv } from 'yargs';
import { UsageError } from '../../errors.js';
import { writeFileAtomic } from '../../report/index.js';
import { readRulesJson } from '../../report/export/index.js';
import { buildReportHtml, MAX_SLICE_PAIRS, openRunModel, SLICE_GRID, type BuildReportOptions } from '../../report/html/index.js';
import type { RulesJsonDocument } from '../../report/rules-json.js';
import type { CliIo } from '../io.js';
import { commonOptions } from '../options.js';
import { EXIT } from '../exit-codes.js';

/** Largest slice grid accepted: 400 × 400 = 160,000 evaluations and a large SVG per slice. */
const MAX_GRID = 400;

/** Options of commands that draw slice plots (report, export --format bundle). */
export function sliceOptions<T>(y: Argv<T>) {
  return y
    .option('model', { type: 'string', describe: "the run's model file, if it moved (its SHA-256 must match the run's)" })
    .option('scenario', { type: 'string', describe: "the run's scenario file, if it moved (its SHA-256 must match the run's)" })
    .option('pair', { type: 'string', array: true, describe: `input pair of a slice plot, as NAME,NAME (repeatable; default: the ${MAX_SLICE_PAIRS} pairs the rules constrain most)` })
    .option('grid', { type: 'number', default: SLICE_GRID, describe: 'grid cells per side of a slice plot' })
    .option('threads', { type: 'number', default: 1, describe: 'onnxruntime intra-op threads' });
}

export function reportBuilder<T>(y: Argv<T>) {
  return commonOptions(sliceOptions(y))
    .positional('run', { type: 'string', describe: 'run folder (holding rules.json)', demandOption: true })
    .option('out', { type: 'string', describe: 'report file (default RUN_DIR/report.html)' })
    .example('$0 report runs/demo', 'write runs/demo/report.html')
    .example('$0 report runs/demo --pair cpa_nm,bearing_deg --pair tcpa_min,own_speed_kn --out review.html', 'choose the slice plots');
}

type SliceArgs = { model?: string | undefined; scenario?: string | undefined; pair?: Array<string | number> | undefined; grid: number; threads: number };
type ReportArgs = SliceArgs & { run?: string; out?: string | undefined; json: boolean; quiet: boolean };

/** `--pair a,b` values as input index pairs, checked against the run's inputs. */
export function parsePairs(doc: RulesJsonDocument, values: ReadonlyArray<string | number> | undefined): Array<[number, number]> | undefined {
  if (!values || values.length === 0) return undefined;
  const names = doc.inputs.map((i) => i.name);
  return values.map((v) => {
    const parts = String(v).split(',').map((s) => s.trim());
    const idx = parts.map((p) => names.indexOf(p));
    if (parts.length !== 2 || idx.some((i) => i < 0) || idx[0] === idx[1]) {
      throw new UsageError(`--pair ${String(v)}: expected two different input names as NAME,NAME, from ${names.join(', ')}`);
    }
    return idx[0]! < idx[1]! ? [idx[0]!, idx[1]!] : [idx[1]!, idx[0]!];
  });
}

/**
 * report.html of a run folder, built by re-opening the run's model (hash-checked).
 * @returns the page's text
 */
export async function reportForRun(doc: RulesJsonDocument, args: SliceArgs, io: CliIo): Promise<string> {
  if (!Number.isInteger(args.grid) || args.grid < 2 || args.grid > MAX_GRID) {
    throw new UsageError(`--grid: expected a whole number in [2, ${MAX_GRID}], found ${args.grid}`);
  }
  if (!Number.isInteger(args.threads) || args.threads < 1) throw new UsageError(`--threads: expected a positive integer, found ${args.threads}`);
  const pairs = parsePairs(doc, args.pair);
  const { model, scenario } = await openRunModel(doc, {
    threads: args.threads,
    ...(args.model ? { modelPath: resolve(io.cwd, args.model) } : {}),
    ...(args.scenario ? { scenarioPath: resolve(io.cwd, args.scenario) } : {}),
  });
  try {
    const options: BuildReportOptions = { grid: args.grid, title: scenario.title, ...(pairs ? { pairs } : {}) };
    return await buildReportHtml(doc, model.evaluate, options);
  } finally {
    await model.close();
  }
}

export async function runReport(args: ReportArgs, io: CliIo): Promise<number> {
  const runDir = resolve(io.cwd, String(args.run));
  const { doc } = readRulesJson(join(runDir, 'rules.json'));
  const html = await reportForRun(doc, args, io);
  const out = resolve(io.cwd, args.out ?? join(runDir, 'report.html'));
  writeFileAtomic(out, html);
  if (args.json) io.stdout(JSON.stringify({ report: out, bytes: Buffer.byteLength(html, 'utf8') }) + '\n');
  else if (!args.quiet) io.stdout(`wrote ${relative(io.cwd, out) || out} (${Math.round(Buffer.byteLength(html, 'utf8') / 1024)} KiB)\n`);
  return EXIT.OK;
}
