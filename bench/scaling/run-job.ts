/**
 * Runs one CLI job of the scaling study in its own Node process, so the peak resident memory
 * is that job's alone, and reads the child's own resource usage (process.resourceUsage(),
 * written on exit by a one-line preloaded module) beside the wall time measured here.
 */
import { spawn } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';

/** One measured job. */
export interface JobFigures {
  readonly exitCode: number;
  readonly wallSeconds: number;
  /** User + system CPU time of the child, all threads. */
  readonly cpuSeconds: number;
  /** Peak resident set size of the child (maxRSS), in MiB. */
  readonly peakRssMiB: number;
  readonly stdout: string;
}

/** Preloaded into the child: writes its resource usage as JSON to the file in SPECULA_RUSAGE on exit. */
const USAGE_HOOK =
  'data:text/javascript,import{writeFileSync as w}from"node:fs";process.on("exit",()=>{const u=process.resourceUsage();' +
  'w(process.env.SPECULA_RUSAGE,JSON.stringify({maxRSS:u.maxRSS,user:u.userCPUTime,system:u.systemCPUTime}))})';

let counter = 0;

/**
 * Runs `node dist/src/cli/bin.js ...args` and measures it.
 * @param args CLI arguments (command first)
 * @param cwd the project folder holding dist/
 */
export function runJob(args: readonly string[], cwd: string): Promise<JobFigures> {
  const usageFile = join(tmpdir(), `specula-scaling-${process.pid}-${counter++}.json`);
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    const child = spawn(process.execPath, ['--import', USAGE_HOOK, join(cwd, 'dist/src/cli/bin.js'), ...args], {
      cwd,
      env: { ...process.env, SPECULA_RUSAGE: usageFile },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (b: Buffer) => (stdout += b.toString()));
    child.stderr.on('data', (b: Buffer) => (stderr += b.toString()));
    child.on('error', reject);
    child.on('close', (code) => {
      const wallSeconds = (performance.now() - t0) / 1000;
      try {
        const u = JSON.parse(readFileSync(usageFile, 'utf8')) as { maxRSS: number; user: number; system: number };
        rmSync(usageFile, { force: true });
        if (code !== 0 && code !== 1) reject(new Error(`specula ${args.join(' ')}: exit ${code}\n${stderr}`));
        // maxRSS is in KiB, CPU times in microseconds (Node's process.resourceUsage documentation)
        else resolve({ exitCode: code, wallSeconds, cpuSeconds: (u.user + u.system) / 1e6, peakRssMiB: u.maxRSS / 1024, stdout });
      } catch (e) {
        reject(new Error(`specula ${args.join(' ')}: no resource usage (exit ${code})\n${stderr}\n${String(e)}`));
      }
    });
  });
}
