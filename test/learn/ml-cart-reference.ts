/**
 * ml-cart 2.1.1 (npm, MIT; a CART implementation in JavaScript) as a reference learner for
 * tests and benchmarks. Its package has no type declarations, so it is loaded through
 * createRequire and given the narrow type used here.
 */
import { createRequire } from 'node:module';

/** A node of ml-cart's tree: internal nodes have both children; it sends a row left when x[col] < value. */
export interface MlCartNode {
  readonly splitColumn?: number;
  readonly splitValue?: number;
  readonly left?: MlCartNode;
  readonly right?: MlCartNode;
}

interface MlCartClassifier {
  train(x: number[][], y: number[]): void;
  predict(x: number[][]): number[];
  readonly root: MlCartNode;
}

interface MlCartModule {
  DecisionTreeClassifier: new (options: Record<string, unknown>) => MlCartClassifier;
}

const mlCart = createRequire(import.meta.url)('ml-cart') as MlCartModule;

/** Plain rows of a row-major matrix. */
export function rowsOf(x: Float64Array, n: number, d: number): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from(x.subarray(i * d, i * d + d)));
}

/**
 * Trains ml-cart's DecisionTreeClassifier with the Gini gain and no early stopping: nodes of
 * one row are leaves (minNumSamples 1), any positive gain splits (gainThreshold 0), no depth limit.
 */
export function trainMlCart(x: Float64Array, n: number, d: number, labels: Int32Array): MlCartClassifier {
  const model = new mlCart.DecisionTreeClassifier({ gainFunction: 'gini', minNumSamples: 1, gainThreshold: 0, maxDepth: Infinity });
  model.train(rowsOf(x, n, d), Array.from(labels));
  return model;
}
