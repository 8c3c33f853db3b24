/** report.html: the self-contained review page with slice plots of the network. */
export { buildReportHtml, type BuildReportOptions } from './build-report-html.js';
export { reportHtml, type ReportHtmlOptions } from './report-html.js';
export { buildSlices, type SliceFigure, type SliceOptions, type SliceSet } from './build-slices.js';
export { slicePairs, MAX_SLICE_PAIRS, constrains } from './slice-pairs.js';
export { sliceHelds, distinctHelds, HELD_RULES, type HeldPoint } from './slice-helds.js';
export { sliceGrid, SLICE_GRID } from './slice-grid.js';
export { sliceData, NEAR_SLICE_FRACTION, type SliceData } from './slice-data.js';
export { sliceSpec, SLICE_PLOT_SIZE, MAX_LABELLED_OUTLINES } from './slice-spec.js';
export { renderVegaLiteSvg } from './render-svg.js';
export { advisoryPalette, oklchToHex, oklabToLinearSrgb } from './palette.js';
export { OUTLINE_STYLES } from './outline-styles.js';
export { escapeHtml, jsonForScript } from './escape-html.js';
export { openRunModel, type OpenRunModelOptions } from './open-run-model.js';
