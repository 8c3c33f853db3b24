import type { RulesJsonDocument } from '../rules-json.js';
import { fromRulesJson } from '../export/from-rules-json.js';
import type { SliceSet } from './build-slices.js';
import { escapeHtml, jsonForScript } from './escape-html.js';
import { evidenceHtml } from './evidence-html.js';
import { figuresHtml } from './figures-html.js';
import { PAGE_SCRIPT } from './page-script.js';
import { PAGE_STYLE } from './page-style.js';
import { ruleTableHtml } from './rule-table-html.js';
import { cautionsHtml, manifestHtml, scenarioHtml } from './scenario-html.js';
import { slicesHtml } from './slices-html.js';

export interface ReportHtmlOptions {
  /** The scenario's title (rules.json holds only its name). */
  readonly title?: string;
}

/**
 * report.html: one self-contained page (styles, script, data and plots inline; no network, no
 * server) with the cautions at the top, the job and scenario, the summary figures, the slice
 * plots, the sortable and filterable rule table, the evidence of every rule and the manifest.
 * The rules.json document is embedded unchanged in `<script type="application/json" id="rules-data">`.
 * @param doc the run's rules.json document
 * @param slices the rendered slice plots (`buildSlices`), or an empty set
 */
export function reportHtml(doc: RulesJsonDocument, slices: SliceSet, options: ReportHtmlOptions = {}): string {
  const table = fromRulesJson(doc);
  const texts = doc.rules.map((r) => r.text);
  const heading = options.title ?? doc.manifest.scenario.name;
  return [
    '<!DOCTYPE html>',
    '<html lang="en"><head><meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    // no network: nothing may be fetched, not even by mistake
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; script-src 'unsafe-inline'; img-src data:">`,
    `<title>${escapeHtml(`Rules of ${heading}`)}</title>`,
    `<style>${PAGE_STYLE}</style></head><body>`,
    `<h1>Rules of ${escapeHtml(heading)}</h1>`,
    `<p class="muted">${escapeHtml(`${doc.manifest.tool} ${doc.manifest.toolVersion}, ${doc.manifest.date}; model SHA-256 ${doc.manifest.model.sha256}`)}</p>`,
    cautionsHtml(),
    scenarioHtml(table, options.title),
    figuresHtml(table),
    slicesHtml(table, slices),
    ruleTableHtml(table, texts),
    evidenceHtml(table, texts),
    manifestHtml(table),
    `<script type="application/json" id="rules-data">${jsonForScript(doc)}</script>`,
    `<script>${PAGE_SCRIPT}</script>`,
    '</body></html>',
    '',
  ].join('\n');
}
