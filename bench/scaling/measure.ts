/**
 * One measured point of the study: runs a CLI job in a child process (run-job.ts) and reads
 * the rules, statuses and proof pieces from its --json output.
 */
import type { CostJob, MeasuredPoint } from '../../src/scale/index.js';
import { runJob } from './run-job.js';

interface JsonRule {
  readonly evidence: { readonly status: string; readonly proof?: { readonly pieces: number } };
}

/**
 * Runs `specula <args> --json` and returns the point.
 * @param cwd project folder holding dist/
 */
export async function measure(sweep: string, label: string, job: CostJob, args: readonly string[], cwd: string): Promise<MeasuredPoint> {
  const f = await runJob([...args, '--json', '--quiet'], cwd);
  const out = JSON.parse(f.stdout) as { rules: readonly JsonRule[] };
  const statuses: Record<string, number> = {};
  let pieces = 0;
  let maxPieces = 0;
  let proved = false;
  for (const r of out.rules) {
    statuses[r.evidence.status] = (statuses[r.evidence.status] ?? 0) + 1;
    const p = r.evidence.proof?.pieces;
    if (p === undefined) continue;
    proved = true;
    pieces += p;
    // the hard-rule curve counts only rules not cut short by a counterexample
    if (r.evidence.status !== 'refuted') maxPieces = Math.max(maxPieces, p);
  }
  const point: MeasuredPoint = {
    sweep,
    label,
    job,
    wallSeconds: round(f.wallSeconds),
    cpuSeconds: round(f.cpuSeconds),
    peakRssMiB: round(f.peakRssMiB),
    rulesOut: out.rules.length,
    statuses,
    ...(proved ? { pieces, maxPieces } : {}),
  };
  process.stderr.write(`  ${sweep} ${label} ${job.kind}: ${point.wallSeconds} s wall, ${point.cpuSeconds} s CPU, ${point.peakRssMiB} MiB, ` +
    `${point.rulesOut} rules ${JSON.stringify(statuses)}${proved ? `, ${pieces} pieces (max ${maxPieces})` : ''}\n`);
  return point;
}

/** Four significant figures keep the data file readable; timing noise is far larger. */
function round(v: number): number {
  return Number(v.toPrecision(4));
}
