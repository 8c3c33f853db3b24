import yargs from 'yargs';
import { ToolError } from '../errors.js';
import { toolVersion } from '../version.js';
import { EXIT, exitCodeFor } from './exit-codes.js';
import { processIo, type CliIo } from './io.js';
import { mineBuilder, runMine } from './commands/mine.js';
import { reportBuilder, runReport } from './commands/report.js';
import { proveBuilder, runProve } from './commands/prove.js';
import { exportBuilder, runExport } from './commands/export.js';
import { checkBuilder, runCheck } from './commands/check.js';
import { diffBuilder, runDiff } from './commands/diff.js';
import { mergeBuilder, runMerge } from './commands/merge.js';

class ParseFailure extends ToolError {
  constructor(message: string) {
    super('USAGE', message);
  }
}

/**
 * Runs the command line `argv` (without node and script) and returns the exit code; output goes
 * through `io`, so tests call this directly.
 */
export async function main(argv: readonly string[], io: CliIo = processIo()): Promise<number> {
  let code: number = EXIT.OK;
  let helpText = '';
  const verbose = argv.includes('--verbose');
  const parser = yargs([...argv])
    .scriptName('specula')
    .usage('$0 <command> [options]\n\nTurns a small neural-network controller (ONNX) into readable, checked input-range rules.')
    .command('mine <scenario>', 'sample the network, learn a tree, write checked rules to a run folder', mineBuilder, async (a) => {
      code = await runMine(a as never, io);
    })
    .command('prove <run>', 're-prove the rules of a run folder by bound propagation and rewrite its files', proveBuilder, async (a) => {
      code = await runProve(a as never, io);
    })
    .command('report <run>', 'write report.html of a run folder: rules, evidence and slice plots of the network', reportBuilder, async (a) => { code = await runReport(a as never, io); })
    .command('export <run>', 'export a run as csv, md, json, smtlib or a verifiable bundle', exportBuilder, async (a) => { code = await runExport(a as never, io); })
    .command('check <scenario> [rules]', 'check given rules (rule file, rules.json, rules.csv) or a reference table against a model', checkBuilder, async (a) => { code = await runCheck(a as never, io); })
    .command('diff <scenario>', 'regression between two models: accepted rules re-checked, changed share, where it changed', diffBuilder, async (a) => { code = await runDiff(a as never, io); })
    .command('merge <parts..>', 'join the partial results of a sharded check, prove or diff (--shard K/N) into one run folder', mergeBuilder, async (a) => { code = await runMerge(a as never, io); })
    .example('$0 mine scenarios/survey-boat/scenario.json --out runs/demo', 'mine the demo scenario')
    .demandCommand(1, 'name a command: mine, check, diff, prove, report or export')
    .strict()
    .recommendCommands()
    .version(toolVersion().version)
    .help()
    .wrap(Math.min(100, process.stdout.columns || 100))
    .exitProcess(false)
    .fail((msg, err) => {
      if (err) throw err;
      throw new ParseFailure(msg);
    });
  try {
    await parser.parseAsync([...argv], {}, (_err, _argv, output) => {
      if (output) helpText = output;
    });
    if (helpText) io.stdout(helpText + '\n');
    return code;
  } catch (e) {
    const c = exitCodeFor(e);
    if (e instanceof ToolError) {
      io.stderr(`specula: ${e.message}\n`);
      if (e instanceof ParseFailure) io.stderr(`run 'specula --help' for usage\n`);
    } else {
      io.stderr(`specula: internal error: ${(e as Error)?.message ?? String(e)}\n`);
      io.stderr(verbose ? `${(e as Error)?.stack ?? ''}\n` : `run again with --verbose for details, and please report it\n`);
    }
    return c;
  }
}
