/**
 * Reference lookup tables: read and validate a grid table (CSV), compare the network with it at
 * the grid points, group the disagreeing points into boxes, and say what is and is not checked.
 */
export { readReferenceTable, strides, MISSING_POINTS_SHOWN } from './read-reference-table.js';
export type { ReferenceGrid } from './reference-grid.js';
export { compareReference, type AdvisoryAgreement, type Disagreement, type ReferenceComparison } from './compare-reference.js';
export { gridBoxes, type GridBox } from './grid-boxes.js';
export { referenceScope } from './reference-scope.js';
export { referenceSummaryText, disagreementText, gridShapeText, SUMMARY_DISAGREEMENTS } from './reference-text.js';
export { referenceFiles, REFERENCE_JSON_FORMAT, REFERENCE_JSON_VERSION, type ReferenceProvenance } from './reference-files.js';
