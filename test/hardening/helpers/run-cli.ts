import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { main } from '../../../src/cli/main.js';
import { capture } from '../../cli/helpers/capture.js';

/** Budgets that keep one successful `mine` run short: the fuzz cases test input handling, not mining. */
export const FAST_MINE = ['--samples', '2000', '--check-samples', '200', '--fidelity-samples', '1000', '--no-prove', '--no-report'];

/** How a run ended. */
export type Ending = 'ran' | 'refused';

export interface CliOutcome {
  readonly code: number;
  readonly out: string;
  readonly err: string;
}

export async function runCli(argv: readonly string[], cwd: string): Promise<CliOutcome> {
  const io = capture(cwd);
  const code = await main(argv, io);
  return { code, out: io.out(), err: io.err() };
}

/**
 * What a calm ending looks like, or why this one is not: exit 2 with exactly one line on stderr,
 * `specula: …` (so no stack trace) that is not an "internal error"; or exit 0 with nothing on stderr and a
 * run folder whose rules.json parses and holds at least one rule. Anything else (exit 3, a stack
 * trace, several lines, a missing table) is described in the returned problem text.
 * @param runFolder the run folder a successful run must have written
 */
export function judge(outcome: CliOutcome, runFolder: string): { ending: Ending } | { problem: string } {
  const { code, err } = outcome;
  const shown = JSON.stringify(err.slice(0, 300));
  if (code === 2) {
    const lines = err.trimEnd().split('\n');
    if (lines.length !== 1 || !lines[0]!.startsWith('specula: ')) return { problem: `exit 2 but stderr is not one 'specula: ' line: ${shown}` };
    if (/internal error/.test(err)) return { problem: `exit 2 reported as an internal error: ${shown}` };
    return { ending: 'refused' };
  }
  if (code === 0) {
    if (err !== '') return { problem: `exit 0 with stderr ${shown}` };
    const file = join(runFolder, 'rules.json');
    if (!existsSync(file)) return { problem: 'exit 0 without rules.json' };
    const doc = JSON.parse(readFileSync(file, 'utf8')) as { rules?: unknown[] };
    if (!Array.isArray(doc.rules) || doc.rules.length === 0) return { problem: 'exit 0 with an empty table' };
    return { ending: 'ran' };
  }
  return { problem: `exit ${code}: ${shown}` };
}

/** How a batch of fuzz cases ended: counts, the cases that ran, and a line per problem. */
export interface FuzzTally<C> {
  readonly endings: Record<Ending, number>;
  readonly ran: C[];
  readonly problems: string[];
}

/** Runs every case (one `runOne` call each, in order) and judges how it ended. */
export async function fuzzCases<C extends { readonly kind: string; readonly label: string }>(
  cases: readonly C[],
  runOne: (c: C, index: number) => Promise<{ outcome: CliOutcome; runFolder: string }>,
): Promise<FuzzTally<C>> {
  const endings: Record<Ending, number> = { ran: 0, refused: 0 };
  const ran: C[] = [];
  const problems: string[] = [];
  for (const [i, c] of cases.entries()) {
    const { outcome, runFolder } = await runOne(c, i);
    const verdict = judge(outcome, runFolder);
    if (!('ending' in verdict)) problems.push(`${c.kind}, ${c.label}: ${verdict.problem}`);
    else {
      endings[verdict.ending]++;
      if (verdict.ending === 'ran') ran.push(c);
    }
  }
  return { endings, ran, problems };
}
