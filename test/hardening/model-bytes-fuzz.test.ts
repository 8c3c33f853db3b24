/**
 * A seeded fuzz of model files: every broken file ends in a clear one-line error with exit 2, or
 * in a correct run with exit 0 (a bit flip inside a weight leaves a valid, different network);
 * never an internal error (exit 3), a stack trace or a crash of the process.
 *
 * The base model is the PyTorch export in test/fixtures/torch (its structure is richer than our
 * writer's: Sub and Div nodes, raw_data at unaligned offsets, long node names).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { FAST_MINE, fuzzCases, runCli, type FuzzTally } from './helpers/run-cli.js';
import { modelCases, type ModelCase } from './helpers/model-cases.js';

const FIXTURE = fileURLToPath(new URL('../fixtures/torch/', import.meta.url));
const base = new Uint8Array(readFileSync(join(FIXTURE, 'spacing-mlp.onnx')));
/** 4,014 bytes cut every 64: 62 cuts plus the first and last three bytes; 120 bit flips; 30 random files. */
const CASES = modelCases(base, { seed: 20240601, truncateStep: 64, bitFlips: 120, random: 30 });
/** Bit-flipped files also run with proving on: our own ONNX reader for proofs sees them too. */
const PROVED_BIT_FLIPS = 10;

let dir = '';

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'specula-model-fuzz-'));
  const reference = JSON.parse(readFileSync(join(FIXTURE, 'spacing-mlp.json'), 'utf8')) as { inputs: string[]; advisories: string[]; domain: [number[], number[]] };
  const scenario = {
    name: 'model-fuzz',
    model: 'model.onnx',
    decision: 'argmax',
    inputs: reference.inputs.map((name, j) => ({ name, unit: '', min: reference.domain[0][j], max: reference.domain[1][j] })),
    advisories: reference.advisories,
  };
  writeFileSync(join(dir, 'scenario.json'), JSON.stringify(scenario));
  copyFileSync(join(FIXTURE, 'spacing-mlp.onnx'), join(dir, 'model.onnx'));
});

/** Runs `mine --model` on each case. */
function fuzz(cases: readonly ModelCase[], extra: readonly string[] = FAST_MINE): Promise<FuzzTally<ModelCase>> {
  return fuzzCases(cases, async (c, i) => {
    const name = `${c.kind.replace(/ /g, '-')}-${i}`;
    writeFileSync(join(dir, `${name}.onnx`), c.bytes);
    const outcome = await runCli(['mine', 'scenario.json', '--model', `${name}.onnx`, '--out', name, ...extra], dir);
    return { outcome, runFolder: join(dir, name) };
  });
}

describe('mine on fuzzed model files', () => {
  it('the base model runs', async () => {
    expect((await fuzz([{ kind: 'truncated', label: 'not truncated', bytes: base }])).endings).toEqual({ ran: 1, refused: 0 });
  });

  it('truncated files are refused (exit 2, one line)', async () => {
    const cases = CASES.filter((c) => c.kind === 'truncated');
    const { endings, problems } = await fuzz(cases);
    expect(problems).toEqual([]);
    // A protobuf cut at a field boundary still decodes; what it lacks then (the graph, an
    // initializer, the opset) is refused later. Measured: all 69 refused.
    expect(endings.refused).toBe(cases.length);
  });

  it('bit-flipped files end in a refusal or a correct run', async () => {
    const cases = CASES.filter((c) => c.kind === 'bit-flipped');
    const { endings, problems } = await fuzz(cases);
    expect(problems).toEqual([]);
    expect(endings.ran + endings.refused).toBe(cases.length);
    // Most of the file is weights: many flips leave a valid network (measured 67 of 120 ran).
    expect(endings.ran).toBeGreaterThan(0);
    expect(endings.refused).toBeGreaterThan(0);
  });

  it('bit-flipped files that run also pass through the prover calmly', async () => {
    const cases = CASES.filter((c) => c.kind === 'bit-flipped').slice(0, PROVED_BIT_FLIPS);
    const withProofs = FAST_MINE.filter((a) => a !== '--no-prove').concat('--prove-boxes', '100');
    const { problems } = await fuzz(cases, withProofs);
    expect(problems).toEqual([]);
  });

  it('random bytes and valid protobuf of the wrong message are refused', async () => {
    const cases = CASES.filter((c) => c.kind === 'random bytes' || c.kind === 'wrong message');
    const { endings, problems } = await fuzz(cases);
    expect(problems).toEqual([]);
    expect(endings.refused).toBe(cases.length);
  });
});
