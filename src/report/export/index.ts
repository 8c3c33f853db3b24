/** Exports of a run: rule tables as CSV, Markdown, JSON and SMT-LIB, and the verifiable bundle. */
export { exportFiles, EXPORT_FORMATS, type ExportFormat, type ExportInput } from './export-files.js';
export { writeExport } from './write-export.js';
export { sha256Sums, type ExportFile } from './sha256-sums.js';
export { smtlibRule, scoreSymbol } from './smtlib-rule.js';
export { smtDecimal } from './smt-decimal.js';
export { smtSymbol } from './smt-symbol.js';
export { cautionsTxt } from './cautions-txt.js';
export { fromRulesJson } from './from-rules-json.js';
export { readRulesJson, type RunRules } from './read-rules-json.js';
