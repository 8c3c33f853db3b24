/**
 * Writes reference-table.csv: the expert policy (policy.ts, default settings) as a grid lookup
 * table, the kind of table a network is often trained to replace. Used by the reference-table
 * demo: `specula check scenarios/survey-boat/scenario.json --reference scenarios/survey-boat/reference-table.csv`.
 *
 *   npx tsx scenarios/survey-boat/make-reference-table.ts
 *
 * The grid is regular on each input and its points lie between the policy's thresholds, not on
 * them (a point exactly on a threshold would test only the policy's < versus <= convention):
 *   cpa_nm          0.125 … 1.375 step 0.25   (6)   thresholds 0.5, 1.0
 *   tcpa_min        -1 … 19 step 4            (6)   thresholds 0, 10, 18
 *   bearing_deg     -162 … 162 step 36        (10)  thresholds ±22.5, ±112.5, 0
 *   rel_course_deg  -162 … 162 step 36        (10)  thresholds ±45, ±157.5, 0
 *   own_speed_kn    1, 5, 9                   (3)   threshold 2
 * 10,800 rows, one per grid point, last input fastest. Deterministic (no randomness).
 */
import { writeFileSync, renameSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ADVISORIES, surveyBoatPolicy } from './policy.js';

const step = (from: number, by: number, count: number): number[] => Array.from({ length: count }, (_, i) => from + by * i);
const AXES: ReadonlyArray<readonly [string, number[]]> = [
  ['cpa_nm', step(0.125, 0.25, 6)],
  ['tcpa_min', step(-1, 4, 6)],
  ['bearing_deg', step(-162, 36, 10)],
  ['rel_course_deg', step(-162, 36, 10)],
  ['own_speed_kn', step(1, 4, 3)],
];

const lines = [[...AXES.map(([name]) => name), 'advisory'].join(',')];
const x = new Float64Array(AXES.length);
const visit = (f: number): void => {
  if (f === AXES.length) {
    lines.push([...Array.from(x, String), ADVISORIES[surveyBoatPolicy(x)]].join(','));
    return;
  }
  for (const v of AXES[f]![1]) {
    x[f] = v;
    visit(f + 1);
  }
};
visit(0);

const target = join(dirname(fileURLToPath(import.meta.url)), 'reference-table.csv');
writeFileSync(target + '.tmp', lines.join('\n') + '\n');
renameSync(target + '.tmp', target);
process.stdout.write(`wrote ${lines.length - 1} grid points to ${target}\n`);
