import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { writeMlpOnnx, type DenseLayer } from '../../src/model/onnx-write.js';
import { linearBounds, marginNetwork, marginSpec, proveBox, readOnnxNetwork, type Box, type Network } from '../../src/prove/index.js';
import { graphModel, mulberry32, ortAdvisor, randomMlp, samplePoints, steppingClock } from './helpers.js';

function read(bytes: Uint8Array): Network {
  const r = readOnnxNetwork(bytes);
  if (!r.supported) throw new Error(r.reason);
  return r.network;
}

// s0 = relu(x) + relu(−x) − 0.5 = |x| − 0.5, s1 = 0: argmax is 0 exactly where |x| > 0.5
const tentLayers: DenseLayer[] = [
  { inSize: 1, outSize: 2, weights: [1, -1], bias: [0, 0], activation: 'relu' },
  { inSize: 2, outSize: 2, weights: [1, 1, 0, 0], bias: [-0.5, 0], activation: 'none' },
];
const tentBytes = writeMlpOnnx(tentLayers);
const tent = read(tentBytes);

const clock = (): (() => number) => steppingClock(1);

function volume(box: Box): number {
  return box.reduce((v, [a, b]) => (b > a ? v * (b - a) : v), 1);
}

describe('proveBox', () => {
  it('proves a rule that holds, with proven pieces tiling the box', async () => {
    const ort = await ortAdvisor(tentBytes, 1, 'argmax');
    const box: Box = [[0.625, 2]];
    const res = await proveBox(tent, box, [0], 'argmax', { maxBoxes: 1000, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect(res.status).toBe('proven');
    expect(res.provenVolumeFraction).toBe(1);
    const covered = res.provenBoxes.reduce((s, b) => s + volume(b), 0);
    expect(covered).toBeCloseTo(volume(box), 12);
    for (const b of res.provenBoxes) expect(b[0]![0] >= 0.625 && b[0]![1] <= 2).toBe(true);
    await ort.release();
  });

  it('refutes a rule that fails with a point the runtime confirms', async () => {
    const ort = await ortAdvisor(tentBytes, 1, 'argmax');
    const res = await proveBox(tent, [[0.375, 2]], [0], 'argmax', { maxBoxes: 1000, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect(res.status).toBe('refuted');
    const x = res.counterexample!.x[0]!;
    expect(x).toBeGreaterThanOrEqual(0.375);
    expect(x).toBeLessThan(0.5);
    expect(res.counterexample!.advisory).toBe(1);
    expect(Array.from(await ort.confirm(Float64Array.of(x), 1))).toEqual([1]);
    await ort.release();
  });

  it('handles argmin and sets of allowed advisories', async () => {
    const ort = await ortAdvisor(tentBytes, 1, 'argmin');
    const res = await proveBox(tent, [[-0.4, 0.4]], [0], 'argmin', { maxBoxes: 1000, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect(res.status).toBe('proven');
    await ort.release();
    // s0 = x, s1 = −x, s2 = −1: on [−0.9, 0.9] the winner is 0 or 1, never 2
    const bytes = writeMlpOnnx([{ inSize: 1, outSize: 3, weights: [1, -1, 0], bias: [0, 0, -1], activation: 'none' }]);
    const three = await ortAdvisor(bytes, 1, 'argmax');
    const net = read(bytes);
    const both = await proveBox(net, [[-0.9, 0.9]], [0, 1], 'argmax', { maxBoxes: 100, maxSeconds: 60, now: clock(), confirm: three.confirm });
    expect(both.status).toBe('proven');
    const one = await proveBox(net, [[-0.9, 0.9]], [0], 'argmax', { maxBoxes: 100, maxSeconds: 60, now: clock(), confirm: three.confirm });
    expect(one.status).toBe('refuted');
    await three.release();
  });

  it('stops at the budget, or at float32 resolution, with the proven volume fraction when the margin vanishes at the edge', async () => {
    // at x = 0.5 the scores tie (advisory 0, the first index), so no piece touching 0.5 can be
    // proven; the search halves towards 0.5 until pieces are two float32 ulps wide, and pieces
    // whose margin is within the float32 allowance (about 1e-7 here) of zero stay unresolved
    const ort = await ortAdvisor(tentBytes, 1, 'argmax');
    const res = await proveBox(tent, [[0.5, 2]], [0], 'argmax', { maxBoxes: 300, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect(res.status).toBe('unknown');
    expect(res.unresolved).toBeGreaterThanOrEqual(1);
    expect(res.pieces).toBeLessThan(300);
    // what is left lies within about the allowance of 0.5: [0.5, 0.5 + 1e-6] is 7e-7 of the box
    expect(1 - res.provenVolumeFraction).toBeGreaterThan(0);
    expect(1 - res.provenVolumeFraction).toBeLessThan(1e-6);
    const budget = await proveBox(tent, [[0.5, 2]], [0], 'argmax', { maxBoxes: 10, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect([budget.status, budget.pieces, budget.unresolved]).toEqual(['unknown', 10, 0]);
    expect(budget.provenVolumeFraction).toBeGreaterThan(0.5);
    expect(budget.provenVolumeFraction).toBeLessThan(1);
    // the injected clock ends the search: it reads 1 s later at each round against 2.5 s
    // allowed, so two rounds run: the root, then its two halves
    const timed = await proveBox(tent, [[0.5, 2]], [0], 'argmax', { maxBoxes: 1e6, maxSeconds: 2.5, now: steppingClock(1000), confirm: ort.confirm, batchSize: 4 });
    expect(timed.status).toBe('unknown');
    expect(timed.pieces).toBe(3);
    await ort.release();
  });

  it('proves and refutes through a final Sigmoid (margins taken after the activation)', async () => {
    // s0 = σ(x), s1 = σ(−x): advisory 0 exactly where x > 0
    const bytes = graphModel(
      [
        { name: 'g', opType: 'Gemm', input: ['x', 'W'], output: ['z'] },
        { name: 'sig', opType: 'Sigmoid', input: ['z'], output: ['y'] },
      ],
      [{ name: 'W', dims: [1, 2], values: [1, -1] }],
      1,
      2,
    );
    const net = read(bytes);
    expect(net.layers[net.layers.length - 1]!.kind).toBe('sigmoid');
    const ort = await ortAdvisor(bytes, 1, 'argmax');
    const ok = await proveBox(net, [[0.125, 1]], [0], 'argmax', { maxBoxes: 1000, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect(ok.status).toBe('proven');
    const bad = await proveBox(net, [[-0.125, 1]], [0], 'argmax', { maxBoxes: 1000, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect(bad.status).toBe('refuted');
    expect(bad.counterexample!.x[0]).toBeLessThanOrEqual(0);
    await ort.release();
  });

  it('works in scenario units through the normalisation', async () => {
    const normalize = { offset: [10], scale: [2] };
    const ort = await ortAdvisor(tentBytes, 1, 'argmax', normalize);
    const ok = await proveBox(tent, [[11.25, 14]], [0], 'argmax', { maxBoxes: 1000, maxSeconds: 60, now: clock(), confirm: ort.confirm, normalize });
    expect(ok.status).toBe('proven');
    expect(ok.provenBoxes.every((b) => b[0]![0] >= 11.25 && b[0]![1] <= 14)).toBe(true);
    const bad = await proveBox(tent, [[10.75, 14]], [0], 'argmax', { maxBoxes: 1000, maxSeconds: 60, now: clock(), confirm: ort.confirm, normalize });
    expect(bad.status).toBe('refuted');
    expect(bad.counterexample!.x[0]).toBeGreaterThanOrEqual(10.75);
    expect(bad.counterexample!.x[0]).toBeLessThan(11);
    await ort.release();
  });

  it('measures volume over inputs of non-zero width and rejects malformed boxes', async () => {
    const bytes = writeMlpOnnx([{ inSize: 2, outSize: 2, weights: [1, 0, 0, 0], bias: [0, 0], activation: 'none' }]);
    const ort = await ortAdvisor(bytes, 2, 'argmax');
    const net = read(bytes);
    const res = await proveBox(net, [[0.25, 2], [3, 3]], [0], 'argmax', { maxBoxes: 10, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect([res.status, res.provenVolumeFraction]).toEqual(['proven', 1]);
    await expect(proveBox(net, [[1, 0], [0, 1]], [0], 'argmax', { maxBoxes: 10, maxSeconds: 60, now: clock(), confirm: ort.confirm })).rejects.toThrow('proveBox input 0');
    await expect(proveBox(net, [[0, 1]], [0], 'argmax', { maxBoxes: 10, maxSeconds: 60, now: clock(), confirm: ort.confirm })).rejects.toThrow('expects 2 input ranges');
    await ort.release();
  });

  it('does not prove a point whose exact margin is below the float32 allowance, and the runtime refutes it', async () => {
    // s0 = x0 + x1 − x2, s1 = 2^-26. At x = (1, 2^-25, 1) the exact margin is
    // 1 + 2^-25 − 1 − 2^-26 = 2^-26 > 0, but float32 rounds 1 + 2^-25 to 1 (ties to even),
    // so a float32 evaluation gets s0 = 0 < s1: a float64-only bound would "prove" a wrong rule.
    const bytes = writeMlpOnnx([{ inSize: 3, outSize: 2, weights: [1, 1, -1, 0, 0, 0], bias: [0, 2 ** -26], activation: 'none' }]);
    const net = read(bytes);
    const x = [1, 2 ** -25, 1];
    expect(x[0]! + x[1]! - x[2]! - 2 ** -26).toBe(2 ** -26);
    const point: Box = x.map((v) => [v, v] as const);
    const margin = linearBounds(marginNetwork(net, marginSpec(2, [0], 'argmax')), x, x);
    expect(margin.slack[0]!).toBeGreaterThan(2 ** -26);
    expect(margin.lower[0]!).toBeLessThan(0);
    const ort = await ortAdvisor(bytes, 3, 'argmax');
    const res = await proveBox(net, point, [0], 'argmax', { maxBoxes: 10, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect(res.status).not.toBe('proven');
    expect(res.status).toBe('refuted');
    expect(res.counterexample!.advisory).toBe(1);
    // with a margin far above the allowance (2^-10 instead of 2^-26) the same network is proven
    const wide = await proveBox(net, [[1, 1], [2 ** -10, 2 ** -9], [1, 1]], [0], 'argmax', { maxBoxes: 10, maxSeconds: 60, now: clock(), confirm: ort.confirm });
    expect(wide.status).toBe('proven');
    await ort.release();
  });

  it('never proves a piece that dense runtime sampling refutes (random networks, seeded)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.integer({ min: 1, max: 3 }), fc.integer({ min: 2, max: 4 }), async (seed, d, k) => {
        const rng = mulberry32(seed);
        const layers = randomMlp(rng, [d, 8, 8, k], 1.5);
        const bytes = writeMlpOnnx(layers);
        const net = read(bytes);
        const lo = Array.from({ length: d }, () => Math.fround(-1 + rng()));
        const hi = lo.map((v) => Math.fround(v + 0.05 + 2 * rng()));
        const ort = await ortAdvisor(bytes, d, 'argmax');
        const centre = await ort.confirm(Float64Array.from(lo, (v, i) => (v + hi[i]!) / 2), 1);
        const res = await proveBox(net, lo.map((v, i) => [v, hi[i]!] as const), [centre[0]!], 'argmax', { maxBoxes: 200, maxSeconds: 600, now: clock(), confirm: ort.confirm });
        if (res.status === 'refuted') {
          const c = res.counterexample!;
          c.x.forEach((v, i) => expect(v >= lo[i]! && v <= hi[i]!).toBe(true));
          expect(c.advisory).not.toBe(centre[0]);
        }
        for (const b of res.provenBoxes) {
          const pts = samplePoints(rng, b.map((r) => r[0]), b.map((r) => r[1]), 200);
          const adv = await ort.confirm(pts, 200);
          expect(adv.every((a) => a === centre[0])).toBe(true);
        }
        await ort.release();
      }),
      { seed: 20240611, numRuns: 40 },
    );
  });

  it('reuses pieces an earlier proof proved: the part of a box inside them costs nothing', async () => {
    const ort = await ortAdvisor(tentBytes, 1, 'argmax');
    const opts = { maxSeconds: 60, now: clock(), confirm: ort.confirm };
    // a budget-limited proof of [0.5, 2] proves most of the box but not the edge at the tie
    const first = await proveBox(tent, [[0.5, 2]], [0], 'argmax', { ...opts, maxBoxes: 40 });
    expect(first.status).toBe('unknown');
    expect(first.reused).toBe(0);
    // [0.75, 2] lies in the part proven already: proven without bounding a piece
    const inside = await proveBox(tent, [[0.75, 2]], [0], 'argmax', { ...opts, maxBoxes: 1000, known: first.provenBoxes });
    expect([inside.status, inside.pieces, inside.provenVolumeFraction]).toEqual(['proven', 0, 1]);
    expect(inside.reused).toBe(inside.provenBoxes.length);
    // [0.51, 2]: only the part below the first proof's pieces is searched, in fewer pieces than alone
    const alone = await proveBox(tent, [[0.51, 2]], [0], 'argmax', { ...opts, maxBoxes: 1000 });
    const reusing = await proveBox(tent, [[0.51, 2]], [0], 'argmax', { ...opts, maxBoxes: 1000, known: first.provenBoxes });
    expect([alone.status, reusing.status]).toEqual(['proven', 'proven']);
    expect(reusing.pieces).toBeLessThan(alone.pieces);
    // the proven pieces tile the box: summed lengths equal its length (float64 sums of a few
    // dozen lengths; 1e-12 is far below any piece and far above their rounding)
    const covered = reusing.provenBoxes.reduce((t, b) => t + volume(b), 0);
    expect(Math.abs(covered - volume([[0.51, 2]]))).toBeLessThan(1e-12);
    for (const b of reusing.provenBoxes) expect(b[0]![0] >= 0.51 && b[0]![1] <= 2).toBe(true);
    // a box reaching past the known pieces into the violation is still refuted
    const past = await proveBox(tent, [[0.4, 2]], [0], 'argmax', { ...opts, maxBoxes: 1000, known: first.provenBoxes });
    expect(past.status).toBe('refuted');
    expect(Array.from(await ort.confirm(Float64Array.from(past.counterexample!.x), 1))).toEqual([1]);
    await ort.release();
  });

  it('with known pieces of earlier proofs, never proves a piece that dense runtime sampling refutes (random networks, seeded)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.integer({ min: 1, max: 3 }), async (seed, d) => {
        const c = await randomCase(seed, d);
        const first = await proveBox(c.net, c.box, [c.centre], 'argmax', { ...c.opts, maxBoxes: 100 });
        // a second box overlapping the first one, shifted by up to a third of its width
        const box = c.box.map(([lo, hi]) => {
          const s = (c.rng() - 0.5) * (2 / 3) * (hi - lo);
          return [lo + s, hi + s] as const;
        });
        await expectSound(c, box, await proveBox(c.net, box, [c.centre], 'argmax', { ...c.opts, maxBoxes: 100, known: first.provenBoxes }));
      }),
      { seed: 20261202, numRuns: 30 },
    );
  });

  it('with keepGoing maps past counterexamples: proves the parts of the box where the rule holds', async () => {
    const ort = await ortAdvisor(tentBytes, 1, 'argmax');
    const opts = { maxSeconds: 60, now: clock(), confirm: ort.confirm, maxBoxes: 400 };
    // advisory 0 holds exactly where |x| > 0.5 (closed form of the tent network): on [−2, 2]
    // the rule holds on 3/4 of the box
    const stop = await proveBox(tent, [[-2, 2]], [0], 'argmax', opts);
    const map = await proveBox(tent, [[-2, 2]], [0], 'argmax', { ...opts, keepGoing: true });
    expect([stop.status, map.status]).toEqual(['refuted', 'refuted']);
    expect(Array.from(await ort.confirm(Float64Array.from(map.counterexample!.x), 1))).toEqual([1]);
    // sound: no proven piece reaches into the open interval (−0.5, 0.5) where 1 wins
    for (const b of map.provenBoxes) expect(b[0]![1] <= -0.5 || b[0]![0] >= 0.5).toBe(true);
    // and it maps nearly all of the 3/4: within 2 % of the box (the pieces next to the ties at
    // ±0.5 cannot be proven; 400 pieces halve down to 4/2^8 ≈ 0.016 wide there)
    expect(map.provenVolumeFraction).toBeGreaterThan(0.73);
    expect(map.provenVolumeFraction).toBeLessThanOrEqual(0.75);
    expect(stop.provenVolumeFraction).toBeLessThan(map.provenVolumeFraction);
    await ort.release();
  });

  it('with keepGoing never proves a piece that dense runtime sampling refutes (random networks, seeded)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.integer({ min: 1, max: 3 }), async (seed, d) => {
        const c = await randomCase(seed, d);
        await expectSound(c, c.box, await proveBox(c.net, c.box, [c.centre], 'argmax', { ...c.opts, maxBoxes: 200, keepGoing: true }));
      }),
      { seed: 20261203, numRuns: 30 },
    );
  });
});

/** A seeded random 3-output network on d inputs, a box, and the runtime's advisory at its centre. */
async function randomCase(seed: number, d: number) {
  const rng = mulberry32(seed);
  const bytes = writeMlpOnnx(randomMlp(rng, [d, 8, 8, 3], 1.5));
  const lo = Array.from({ length: d }, () => Math.fround(-1 + rng()));
  const hi = lo.map((v) => Math.fround(v + 0.05 + 2 * rng()));
  const ort = await ortAdvisor(bytes, d, 'argmax');
  const centre = (await ort.confirm(Float64Array.from(lo, (v, i) => (v + hi[i]!) / 2), 1))[0]!;
  const box: Box = lo.map((v, i) => [v, hi[i]!] as const);
  return { rng, net: read(bytes), ort, centre, box, opts: { maxSeconds: 600, now: clock(), confirm: ort.confirm } };
}

/**
 * Every proven piece lies in the box and 200 runtime samples in it all give the centre's
 * advisory; a refutation is confirmed by the runtime. Releases the case's session.
 */
async function expectSound(c: Awaited<ReturnType<typeof randomCase>>, box: Box, res: Awaited<ReturnType<typeof proveBox>>): Promise<void> {
  for (const b of res.provenBoxes) {
    b.forEach(([a, z], i) => expect(a >= box[i]![0] && z <= box[i]![1]).toBe(true));
    const pts = samplePoints(c.rng, b.map((r) => r[0]), b.map((r) => r[1]), 200);
    const adv = await c.ort.confirm(pts, 200);
    expect(adv.every((a) => a === c.centre)).toBe(true);
  }
  if (res.status === 'refuted') expect(Array.from(await c.ort.confirm(Float64Array.from(res.counterexample!.x), 1))[0]).not.toBe(c.centre);
  await c.ort.release();
}
