/**
 * Sampling stage: seeded generator, jittered grid, Sobol points and adaptive refinement near
 * decision boundaries -> SampleSet; also the box samplers the checker uses.
 */
export { sampleDomain, BOUNDARY_SHARE_DEFAULT, BATCH_SIZE_DEFAULT, REFINE_ROUNDS, type SampleDomainOptions } from './sample-domain.js';
export { evaluatorLabeller, type RowLabeller, type SampleArrays } from './row-labeller.js';
export { uniformInBox } from './uniform-in-box.js';
export { boxSurfacePoints } from './box-surface-points.js';
export { createRng, createRng32, uniform32Rng, type BulkRng, type Rng } from './rng.js';
export { sobol, sobolInPlace, SOBOL_MAX_DIMENSION } from './sobol.js';
export { grid, gridInPlace, gridCellsPerAxis } from './grid.js';
export { refine, refineInPlace, refineRoundInPlace, type LabelledSamples, type RefineRound, type RefineRoundOptions } from './refine.js';
export type { ActiveSamples } from './refine-passes.js';
export type { Box } from './check-box.js';
