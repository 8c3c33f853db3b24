/**
 * The proof stage: reads the network from the ONNX file as a layer list and proves or refutes
 * box rules by sound bound propagation and branch and bound (docs/proofs.md).
 */
export type { AffineLayer, ActivationLayer, Layer, Network } from './network.js';
export { readOnnxNetwork } from './onnx-read.js';
export type { ReadNetworkResult, UnsupportedNetwork } from './onnx-read.js';
export { forward, decide } from './forward.js';
export { marginSpec, marginNetwork } from './margin-network.js';
export type { MarginSpec } from './margin-network.js';
export { intervalBounds, intervalTrace } from './interval.js';
export type { IntervalTrace } from './interval.js';
export { linearBounds } from './linear.js';
export type { LinearBounds, LinearOptions } from './linear.js';
export { networkBoxInPlace, toNetworkInput } from './input-box.js';
export { proveBox, PROOF_METHOD } from './branch-and-bound.js';
export type { Box, ProveOptions, ProveResult } from './branch-and-bound.js';
export { coverCells, type CellVisitor } from './cover-cells.js';
export type { ConfirmFn, ProofCounterexample } from './candidates.js';
export {
  ACTIVATION_ABS_ERROR,
  FLOAT32_UNIT_ROUNDOFF,
  ROUNDING_SAFETY_FACTOR,
  ROUNDING_UNIT,
} from './float-error.js';
