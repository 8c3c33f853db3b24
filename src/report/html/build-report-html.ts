import type { Evaluator } from '../../types.js';
import type { RulesJsonDocument } from '../rules-json.js';
import { fromRulesJson } from '../export/from-rules-json.js';
import { buildSlices, type SliceOptions } from './build-slices.js';
import { reportHtml, type ReportHtmlOptions } from './report-html.js';

export interface BuildReportOptions extends SliceOptions, ReportHtmlOptions {}

/**
 * Builds report.html for a run: renders the slice plots by running the network (`evaluate`, the
 * model the run was mined from) and assembles the page.
 * @returns the page's text
 */
export async function buildReportHtml(doc: RulesJsonDocument, evaluate: Evaluator, options: BuildReportOptions = {}): Promise<string> {
  const slices = await buildSlices(fromRulesJson(doc), evaluate, options);
  return reportHtml(doc, slices, options);
}
