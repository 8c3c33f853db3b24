// Placeholder until bench/scaling.ts writes the fitted coefficients.
import type { CostModel } from './cost-model.js';

export const COST_MODEL: CostModel = {
  source: 'placeholder',
  start: 1, perSample: 1e-6, perSampleWeight: 1e-9, perSampleInput: 1e-7,
  proveStart: 1, perRule: 0.01, perRuleWeight: 1e-7, perPiece: 0.001, perPieceWeightLayer: 1e-7,
  hardLog: 0, hardGrowth: 2, easyPieces: 3, hardShare: 0.1,
};
