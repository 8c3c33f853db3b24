import type { RuleTable } from '../../types.js';
import { CAUTIONS } from '../cautions.js';
import { escapeHtml as e } from './escape-html.js';
import { advisoryPalette } from './palette.js';

/** The cautions box, first thing on the page. */
export function cautionsHtml(): string {
  return `<section class="cautions" id="cautions" role="note"><h2>Caution</h2><ul>${CAUTIONS.map((c) => `<li>${e(c)}</li>`).join('')}</ul></section>`;
}

/**
 * The job and the scenario: what was analysed, the inputs with units and ranges, and the
 * advisories with their colours in the slice plots.
 * @param title the scenario's title when known (rules.json holds only its name)
 */
export function scenarioHtml(table: RuleTable, title?: string): string {
  const m = table.manifest;
  const palette = advisoryPalette(table.advisories.length);
  const inputs = table.inputs
    .map((i) => `<tr><td><code>${e(i.name)}</code></td><td>${e(i.unit)}</td><td class="num">${i.min}</td><td class="num">${i.max}</td><td>${e(i.description)}</td></tr>`)
    .join('');
  const advisories = table.advisories
    .map((a, j) => `<tr><td class="num">${j}</td><td><span class="swatch" style="background:${palette[j]}"></span><code>${e(a)}</code></td></tr>`)
    .join('');
  return [
    '<section id="job"><h2>Job and scenario</h2>',
    '<dl class="kv">',
    title ? `<dt>scenario</dt><dd>${e(title)} (<code>${e(m.scenario.name)}</code>)</dd>` : `<dt>scenario</dt><dd><code>${e(m.scenario.name)}</code></dd>`,
    `<dt>question</dt><dd>which advisory does the network give where, as rules over its ${table.inputs.length} inputs; each rule is checked against the network itself</dd>`,
    `<dt>decision</dt><dd>${table.decision === 'argmax' ? 'the largest' : 'the smallest'} of the ${table.advisories.length} scores wins (${e(table.decision)})</dd>`,
    '</dl>',
    '<h3>Inputs</h3><table id="inputs"><thead><tr><th>input</th><th>unit</th><th class="num">min</th><th class="num">max</th><th>description</th></tr></thead>',
    `<tbody>${inputs}</tbody></table>`,
    '<h3>Advisories</h3><table id="advisories"><thead><tr><th class="num">output</th><th>advisory (colour in the slice plots)</th></tr></thead>',
    `<tbody>${advisories}</tbody></table>`,
    '</section>',
  ].join('\n');
}

/** The manifest: tool, version, command, date, seed, model and scenario files with SHA-256, settings and counts. */
export function manifestHtml(table: RuleTable): string {
  const m = table.manifest;
  const kv = (o: Readonly<Record<string, unknown>>): string =>
    Object.entries(o)
      .map(([k, v]) => `<dt>${e(k)}</dt><dd class="mono">${e(String(v))}</dd>`)
      .join('');
  return [
    '<section id="manifest"><h2>Manifest</h2><dl class="kv">',
    `<dt>tool</dt><dd>${e(m.tool)} ${e(m.toolVersion)}, command <code>${e(m.command)}</code></dd>`,
    `<dt>date</dt><dd>${e(m.date)}</dd>`,
    `<dt>seed</dt><dd class="mono">${m.seed}</dd>`,
    `<dt>model</dt><dd><code>${e(m.model.path)}</code><br>SHA-256 <code id="model-sha256">${e(m.model.sha256)}</code></dd>`,
    `<dt>scenario file</dt><dd><code>${e(m.scenario.path)}</code><br>SHA-256 <code id="scenario-sha256">${e(m.scenario.sha256)}</code></dd>`,
    '</dl><h3>Settings</h3><dl class="kv">',
    kv(m.settings),
    '</dl><h3>Counts</h3><dl class="kv">',
    kv(m.counts),
    '</dl></section>',
  ].join('\n');
}
