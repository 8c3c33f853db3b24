export { checkRules, SURFACE_SHARE_DEFAULT } from './check-rules.js';
export type { CheckOptions } from './check-rules.js';
export { measureFidelity, fidelityFromCounts } from './fidelity.js';
export { fidelityChunk, fidelityChunkSizes, FIDELITY_CHUNK, type FidelityCounts } from './fidelity-chunk.js';
export type { FidelityOptions } from './fidelity.js';
export { clopperPearsonUpper, clopperPearsonInterval } from './clopper-pearson.js';
export { boxVolumeFraction } from './box-volume.js';
export { deriveSeed } from './derive-seed.js';
export { violationMargin } from './violation.js';
