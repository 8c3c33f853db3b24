/**
 * The repair stage: turns a refuted rule into few readable sub-rules, each proven by proveBox,
 * and measures proven coverage (docs/repair.md).
 */
export { repairRule, REPAIR_DEFAULTS } from './repair-rule.js';
export type { RepairOptions, RepairResult, RepairSamples, RepairScenario } from './repair-rule.js';
export type { RepairEvent } from './repair-context.js';
export { readableCut, readableMiddle, type ReadableCutLimits, type Side } from './readable-cut.js';
export { readableAbove, readableBelow } from './readable-near.js';
export { FILL_SHARE_DIVISOR, MAP_PIECES_PER_CELL } from './fill-from-pieces.js';
export { unionVolume } from './union-volume.js';
export { uncoveredBoxes } from './uncovered-boxes.js';
export { coverCells, type CellVisitor } from '../prove/index.js';
export { NEIGHBOURHOOD_POINTS, NEIGHBOURHOOD_SHARE } from './peel-and-prove.js';
export { CUT_LOSS_PRIOR, CUTS_PER_FACE } from './plan-main-box.js';
export { provenCoverage, type ProvenCoverage } from './proven-coverage.js';
export { atlasOf, type Atlas, type AtlasBox, type AtlasProof } from './atlas-of.js';
export { boxShare } from './box-share.js';
