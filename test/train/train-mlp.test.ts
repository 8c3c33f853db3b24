import { describe, expect, it } from 'vitest';
import { ToolError } from '../../src/errors.js';
import { createRng, mlpPredict, trainMlp, type TrainData } from '../../src/train/index.js';

/** Quadrant XOR: class 1 where x0·x1 > 0. No straight line separates it (Minsky & Papert, Perceptrons, 1969). */
function xorData(n: number, seed: number): TrainData {
  const rng = createRng(seed);
  const x = new Float64Array(2 * n);
  const labels = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    x[2 * i] = 2 * rng() - 1;
    x[2 * i + 1] = 2 * rng() - 1;
    labels[i] = x[2 * i]! * x[2 * i + 1]! > 0 ? 1 : 0;
  }
  return { x, n, d: 2, labels, classes: 2 };
}

function accuracy(predicted: Int32Array, labels: Int32Array): number {
  let ok = 0;
  for (let i = 0; i < labels.length; i++) if (predicted[i] === labels[i]) ok++;
  return ok / labels.length;
}

const XOR_OPTIONS = { hidden: [16, 16], epochs: 60, batchSize: 32, learningRate: 0.01, seed: 3 };

describe('trainMlp', () => {
  it('learns quadrant XOR, which a network without hidden layers cannot', () => {
    const train = xorData(1000, 1);
    const test = xorData(4000, 2);
    const losses: number[] = [];
    const layers = trainMlp(train, { ...XOR_OPTIONS, onEpoch: (_e, loss) => losses.push(loss) });
    // Held-out accuracy: the boundary is two straight axes; 1000 points and 16×16 ReLUs fit it
    // to within a thin band: measured 0.973–0.992 for seeds 3–5 (0.992 for seed 3). 0.95 allows for
    // that band, not for failure; the linear model below scores 0.51.
    const MIN_XOR_ACCURACY = 0.95;
    expect(accuracy(mlpPredict(layers, test.x, test.n), test.labels)).toBeGreaterThan(MIN_XOR_ACCURACY);
    expect(losses).toHaveLength(XOR_OPTIONS.epochs);
    expect(losses[losses.length - 1]!).toBeLessThan(losses[0]! / 3);

    // The best half-plane on quadrant XOR is right 2/3 of the time (worked by hand: the line
    // x0 + x1 = 2/3); a linear softmax classifier must stay near or below that.
    const LINEAR_CEILING = 0.72;
    const linear = trainMlp(train, { ...XOR_OPTIONS, hidden: [] });
    expect(accuracy(mlpPredict(linear, test.x, test.n), test.labels)).toBeLessThan(LINEAR_CEILING);
  });

  it('returns bit-identical weights for the same seed and different ones for another seed', () => {
    const data = xorData(200, 5);
    const options = { ...XOR_OPTIONS, epochs: 3 };
    const a = trainMlp(data, options);
    const b = trainMlp(data, options);
    const c = trainMlp(data, { ...options, seed: 4 });
    a.forEach((layer, l) => {
      expect(Array.from(b[l]!.weights)).toEqual(Array.from(layer.weights));
      expect(Array.from(b[l]!.bias)).toEqual(Array.from(layer.bias));
    });
    expect(Array.from(c[0]!.weights)).not.toEqual(Array.from(a[0]!.weights));
  });

  it('does not change its input data', () => {
    const data = xorData(100, 6);
    const x = Float64Array.from(data.x);
    const labels = Int32Array.from(data.labels);
    trainMlp(data, { ...XOR_OPTIONS, epochs: 2 });
    expect(data.x).toEqual(x);
    expect(data.labels).toEqual(labels);
  });

  it('builds the requested architecture with ReLU on hidden layers only', () => {
    const layers = trainMlp(xorData(50, 7), { ...XOR_OPTIONS, hidden: [8, 4], epochs: 1 });
    expect(layers.map((l) => [l.inSize, l.outSize, l.activation])).toEqual([
      [2, 8, 'relu'],
      [8, 4, 'relu'],
      [4, 2, 'none'],
    ]);
  });

  it('refuses labels outside the class range, naming the row', () => {
    const data = { ...xorData(10, 8), labels: new Int32Array(10).fill(2) };
    expect(() => trainMlp(data, XOR_OPTIONS)).toThrow(ToolError);
    expect(() => trainMlp(data, XOR_OPTIONS)).toThrowErrorMatchingInlineSnapshot(
      `[ToolError: trainMlp: labels[0] is 2, expected 0..1]`,
    );
  });

  it('refuses a data matrix whose size does not match n × d', () => {
    const data = { ...xorData(10, 9), n: 11 };
    expect(() => trainMlp(data, XOR_OPTIONS)).toThrowErrorMatchingInlineSnapshot(
      `[ToolError: trainMlp: x has 20 values, expected n × d = 22]`,
    );
  });
});
