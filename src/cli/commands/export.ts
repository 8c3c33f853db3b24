import { join, relative, resolve } from 'node:path';
import type { Argv } from 'yargs';
import { UsageError } from '../../errors.js';
import { EXPORT_FORMATS, exportFiles, readRulesJson, writeExport, type ExportFormat } from '../../report/export/index.js';
import type { CliIo } from '../io.js';
import { commonOptions } from '../options.js';
import { EXIT } from '../exit-codes.js';
import { reportForRun, sliceOptions } from './report.js';

export function exportBuilder<T>(y: Argv<T>) {
  return commonOptions(sliceOptions(y))
    .positional('run', { type: 'string', describe: 'run folder (holding rules.json)', demandOption: true })
    .option('format', { type: 'string', choices: EXPORT_FORMATS, demandOption: true, describe: 'what to export' })
    .option('out', { type: 'string', describe: 'export folder (default RUN_DIR/export-<format>)' })
    .example('$0 export runs/demo --format smtlib', 'one SMT-LIB 2.6 query per rule in runs/demo/export-smtlib/')
    .example('$0 export runs/demo --format bundle --out evidence/', 'everything, with report.html and SHA256SUMS');
}

type ExportArgs = Parameters<typeof reportForRun>[1] & { run?: string; format?: string; out?: string | undefined; json: boolean; quiet: boolean };

export async function runExport(args: ExportArgs, io: CliIo): Promise<number> {
  const format = String(args.format) as ExportFormat;
  if (!EXPORT_FORMATS.includes(format)) throw new UsageError(`--format: expected one of ${EXPORT_FORMATS.join(', ')}, found ${format}`);
  const runDir = resolve(io.cwd, String(args.run));
  const { doc, text } = readRulesJson(join(runDir, 'rules.json'));
  const reportHtml = format === 'bundle' ? await reportForRun(doc, args, io) : undefined;
  const files = exportFiles(format, { doc, rulesJsonText: text, ...(reportHtml !== undefined ? { reportHtml } : {}) });
  const out = resolve(io.cwd, args.out ?? join(runDir, `export-${format}`));
  const written = writeExport(out, files);
  if (args.json) io.stdout(JSON.stringify({ format, folder: out, files: written }) + '\n');
  else if (!args.quiet) io.stdout(`wrote ${written.length} files to ${relative(io.cwd, out) || out}\n`);
  return EXIT.OK;
}
