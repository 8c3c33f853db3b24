import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The tool's name and version, read from the package.json above this module (src/ or dist/src/). */
export function toolVersion(): { tool: string; version: string } {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 4; i++) {
    const p = join(dir, 'package.json');
    if (existsSync(p)) {
      const pkg = JSON.parse(readFileSync(p, 'utf8')) as { name?: string; version?: string };
      if (pkg.name === 'specula') return { tool: 'specula', version: pkg.version ?? '0.0.0' };
    }
    dir = dirname(dir);
  }
  return { tool: 'specula', version: '0.0.0' };
}
