import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { writeMlpOnnx, type DenseLayer } from '../../src/model/onnx-write.js';
import { forward, intervalBounds, intervalTrace, linearBounds, readOnnxNetwork, type Network } from '../../src/prove/index.js';
import { forwardFloat32, mulberry32, negateOutputs, randomMlp, runOrt, samplePoints } from './helpers.js';

interface Case {
  readonly layers: DenseLayer[];
  readonly net: Network;
  readonly lo: number[];
  readonly hi: number[];
}

/** A random ReLU network (1–3 inputs, 0–3 hidden layers of 1–6, 1–4 outputs) and a float32 box. */
function randomCase(seed: number): Case {
  const rng = mulberry32(seed);
  const d = 1 + Math.floor(rng() * 3);
  const hidden = Array.from({ length: Math.floor(rng() * 4) }, () => 1 + Math.floor(rng() * 6));
  const k = 1 + Math.floor(rng() * 4);
  const layers = randomMlp(rng, [d, ...hidden, k], 0.5 + 2.5 * rng());
  const r = readOnnxNetwork(writeMlpOnnx(layers));
  if (!r.supported) throw new Error(r.reason);
  const lo = Array.from({ length: d }, () => Math.fround(-2 + 3 * rng()));
  // widths from 0 (a point) to 2
  const hi = lo.map((v) => Math.fround(v + (rng() < 0.1 ? 0 : 2 * rng() ** 2)));
  return { layers, net: r.network, lo, hi };
}

type Modes = 'interval' | 'forward' | 'backward';

/** Lower and upper bounds of every output by each method. */
function allBounds(c: Case, modes: readonly Modes[]): { name: string; lower: ArrayLike<number>; upper: ArrayLike<number> }[] {
  const k = c.net.outputSize;
  const lower = new Float64Array(k);
  const upper = new Float64Array(k);
  intervalBounds(c.net, Float64Array.from(c.lo), Float64Array.from(c.hi), 1, lower, upper);
  const out = [{ name: 'interval', lower: lower as ArrayLike<number>, upper: upper as ArrayLike<number> }];
  const neg = negateOutputs(c.net);
  for (const intermediate of modes) {
    const l = linearBounds(c.net, c.lo, c.hi, { intermediate }).lower;
    const u = linearBounds(neg, c.lo, c.hi, { intermediate }).lower.map((v) => -v);
    out.push({ name: `linear/${intermediate}`, lower: l, upper: u });
  }
  return out;
}

/** Corners, the centre and random points of the box, each as a row. */
function probePoints(c: Case, rng: () => number, n: number): Float64Array {
  const d = c.lo.length;
  const corners = Math.min(1 << d, 8);
  const pts = new Float64Array((corners + 1 + n) * d);
  for (let m = 0; m < corners; m++) for (let i = 0; i < d; i++) pts[m * d + i] = (m >> i) & 1 ? c.hi[i]! : c.lo[i]!;
  for (let i = 0; i < d; i++) pts[corners * d + i] = Math.fround((c.lo[i]! + c.hi[i]!) / 2);
  pts.set(samplePoints(rng, c.lo, c.hi, n), (corners + 1) * d);
  return pts;
}

/** Every output at every probe, in float64 and in two float32 summation orders, lies inside every bound. */
function expectContained(c: Case, rng: () => number, probes: number, modes: readonly Modes[]): void {
  const d = c.lo.length;
  const k = c.net.outputSize;
  const pts = probePoints(c, rng, probes);
  const n = pts.length / d;
  const f64 = forward(c.net, pts, n);
  const bounds = allBounds(c, modes);
  for (let r = 0; r < n; r++) {
    const x = pts.subarray(r * d, r * d + d);
    const f32a = forwardFloat32(c.layers, x, 'forward');
    const f32b = forwardFloat32(c.layers, x, 'reverse');
    for (const b of bounds) {
      for (let j = 0; j < k; j++) {
        for (const y of [f64[r * k + j]!, f32a[j]!, f32b[j]!]) {
          if (!(b.lower[j]! <= y && y <= b.upper[j]!)) {
            throw new Error(`${b.name} bound [${b.lower[j]}, ${b.upper[j]}] misses output ${j} = ${y} at [${Array.from(x)}]`);
          }
        }
      }
    }
  }
}

describe('soundness of interval and linear bounds', () => {
  it('contains every sampled output, float64 and float32 (property, seeded)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), (seed) => {
        expectContained(randomCase(seed), mulberry32(seed + 1), 200, ['interval', 'forward', 'backward']);
      }),
      { seed: 424242, numRuns: 300 },
    );
  });

  it('keeps, per output, the better of the two lower-line rules, and the minimiser is a corner below the function', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), (seed) => {
        const c = randomCase(seed);
        // 'best' bounds the outputs with both rules over the same inner bounds: with interval
        // inner bounds those are the same for every rule, so 'best' is exactly the larger one
        const best = linearBounds(c.net, c.lo, c.hi, { intermediate: 'interval' });
        const adaptive = linearBounds(c.net, c.lo, c.hi, { intermediate: 'interval', slopes: 'adaptive' });
        const zero = linearBounds(c.net, c.lo, c.hi, { intermediate: 'interval', slopes: 'zero' });
        // with refined inner bounds (computed with the area rule) it is never below 'adaptive'
        const refined = linearBounds(c.net, c.lo, c.hi);
        const refinedAdaptive = linearBounds(c.net, c.lo, c.hi, { slopes: 'adaptive' });
        const d = c.lo.length;
        const k = c.net.outputSize;
        const at = forward(c.net, best.minimiser, k);
        for (let j = 0; j < k; j++) {
          expect(best.lower[j]).toBe(Math.max(adaptive.lower[j]!, zero.lower[j]!));
          expect(refined.lower[j]).toBeGreaterThanOrEqual(refinedAdaptive.lower[j]!);
          expect(at[j * k + j]!).toBeGreaterThanOrEqual(best.lower[j]!);
          for (let i = 0; i < d; i++) expect([c.lo[i], c.hi[i]]).toContain(best.minimiser[j * d + i]);
        }
      }),
      { seed: 777, numRuns: 200 },
    );
  });

  it('never loosens the interval bounds of an activation input (the linear method intersects them)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), (seed) => {
        const c = randomCase(seed);
        const trace = intervalTrace(c.net, c.lo, c.hi);
        for (const intermediate of ['interval', 'forward', 'backward'] as const) {
          const lin = linearBounds(c.net, c.lo, c.hi, { intermediate });
          c.net.layers.forEach((layer, p) => {
            if (layer.kind === 'affine' || p === 0) return;
            const [l, u] = lin.inner[p]!;
            for (let j = 0; j < l.length; j++) {
              expect(l[j]!).toBeGreaterThanOrEqual(trace.lower[p - 1]![j]!);
              expect(u[j]!).toBeLessThanOrEqual(trace.upper[p - 1]![j]!);
            }
          });
        }
      }),
      { seed: 31337, numRuns: 200 },
    );
  });

  it('fuzz: 3,000 seeded (network, box) pairs, bounds contain float64 and float32 outputs', () => {
    let checked = 0;
    for (let seed = 1; seed <= 3000; seed++) {
      // the costlier back-substituted variant on every tenth pair
      expectContained(randomCase(1_000_000 + seed), mulberry32(seed), 24, seed % 10 === 0 ? ['forward', 'backward'] : ['forward']);
      checked++;
    }
    expect(checked).toBe(3000);
  });

  it('contains what onnxruntime computes on a 5-input 6×50 network over random boxes', async () => {
    const rng = mulberry32(99);
    const layers = randomMlp(rng, [5, 50, 50, 50, 50, 50, 50, 5]);
    const bytes = writeMlpOnnx(layers);
    const r = readOnnxNetwork(bytes);
    if (!r.supported) throw new Error(r.reason);
    for (let t = 0; t < 6; t++) {
      const lo = Array.from({ length: 5 }, () => Math.fround(-1 + rng()));
      const hi = lo.map((v) => Math.fround(v + 0.2 * rng()));
      const n = 2000;
      const x = samplePoints(rng, lo, hi, n);
      const y = await runOrt(bytes, x, n, 5);
      const c: Case = { layers, net: r.network, lo, hi };
      for (const b of allBounds(c, ['forward', 'backward'])) {
        for (let i = 0; i < n * 5; i++) {
          expect(y[i]!).toBeGreaterThanOrEqual(b.lower[i % 5]!);
          expect(y[i]!).toBeLessThanOrEqual(b.upper[i % 5]!);
        }
      }
    }
  });
});
