/**
 * Runs every benchmark in bench/ and writes docs/performance.md from their sections.
 * Each benchmark module exports `run(): Promise<string>` returning one Markdown section whose
 * figures are measured side by side in the same process (ratios, not absolute times, are the
 * comparable numbers on a shared, noisy machine).
 *
 * Usage: npm run bench [-- name ...]   (names: file names in bench/ without .ts)
 */
import { readdirSync, writeFileSync, readFileSync, existsSync } from 'node:fs';
import { cpus } from 'node:os';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dirname, join } from 'node:path';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(here)
  .filter((f) => f.endsWith('.ts') && f !== 'run-all.ts' && !f.startsWith('_'))
  .filter((f) => only.length === 0 || only.includes(f.replace(/\.ts$/, '')))
  .sort();
const docPath = join(here, '..', 'docs', 'performance.md');
const previous = existsSync(docPath) ? readFileSync(docPath, 'utf8') : '';
const sections = new Map<string, string>();
for (const m of previous.matchAll(/<!-- bench:(\S+) -->\n([\s\S]*?)<!-- \/bench:\1 -->/g)) sections.set(m[1]!, m[2]!);
for (const f of files) {
  const name = f.replace(/\.ts$/, '');
  process.stderr.write(`bench ${name} ...\n`);
  const mod = (await import(pathToFileURL(join(here, f)).href)) as { run: () => Promise<string> };
  const text = await mod.run();
  process.stdout.write(text + '\n');
  sections.set(name, text.trimEnd() + '\n');
}
const head = `# Performance

Measured with \`npm run bench\` (bench/*.ts) on a ${cpus().length}-core machine, no GPU.
Targets are from the design. The machines are shared and noisy: each benchmark measures the
figures it compares side by side in one process, so the ratios are the numbers to trust.
Each section below is rewritten when its benchmark runs (\`npm run bench -- <name>\`).
`;
const body = [...sections.keys()].sort().map((k) => `<!-- bench:${k} -->\n${sections.get(k)}<!-- /bench:${k} -->`).join('\n\n');
writeFileSync(docPath, head + '\n' + body + '\n');
