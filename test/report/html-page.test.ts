import { describe, expect, it } from 'vitest';
import { CAUTIONS, rulesJsonText, toRulesJson } from '../../src/report/index.js';
import { reportHtml, type SliceSet } from '../../src/report/html/index.js';
import { fixtureTable } from '../browser/report-fixture.js';

const NO_SLICES: SliceSet = { pairs: [], helds: [], figures: [] };

function embedded(html: string): unknown {
  const m = /<script type="application\/json" id="rules-data">([^<]*)<\/script>/.exec(html);
  expect(m, 'embedded rules-data element').not.toBeNull();
  return JSON.parse(m![1]!);
}

describe('reportHtml', () => {
  it('embeds the rules.json document so that it reads back equal to rules.json', () => {
    const table = fixtureTable();
    const html = reportHtml(toRulesJson(table), NO_SLICES);
    expect(embedded(html)).toEqual(JSON.parse(rulesJsonText(table)));
  });

  it('keeps text that would close the script element inside the embedded data', () => {
    const base = fixtureTable();
    const table = { ...base, inputs: base.inputs.map((i, k) => (k === 0 ? { ...i, description: '</script><b>x</b> & <!--' } : i)) };
    const html = reportHtml(toRulesJson(table), NO_SLICES);
    expect(html.match(/<\/script>/g)).toHaveLength(2); // the data element and the page script
    expect((embedded(html) as { inputs: Array<{ description: string }> }).inputs[0]!.description).toBe('</script><b>x</b> & <!--');
    expect(html).toContain('&lt;/script&gt;&lt;b&gt;x&lt;/b&gt; &amp; &lt;!--');
  });

  it('puts every caution above everything else on the page', () => {
    const html = reportHtml(toRulesJson(fixtureTable()), NO_SLICES);
    const first = html.indexOf('id="cautions"');
    for (const id of ['id="job"', 'id="summary"', 'id="slices"', 'id="rule-table"', 'id="evidence"', 'id="manifest"']) {
      expect(html.indexOf(id), id).toBeGreaterThan(first);
    }
    const escapedCautions = CAUTIONS.map((c) => c.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/'/g, '&#39;'));
    for (const c of escapedCautions) expect(html.slice(first, html.indexOf('id="job"'))).toContain(c);
  });

  it('fetches nothing: no external scripts, styles, images or links, and a policy forbidding them', () => {
    const html = reportHtml(toRulesJson(fixtureTable()), NO_SLICES);
    expect(html).not.toMatch(/<(script|img|iframe)[^>]+src=/i);
    expect(html).not.toMatch(/<link/i);
    expect(html).not.toMatch(/(href|src)="(https?:)?\/\//i);
    expect(html).toContain(`Content-Security-Policy" content="default-src 'none'`);
  });

  it('lists every rule once in the table, with its advisories, status and a link to its evidence', () => {
    const table = fixtureTable();
    const html = reportHtml(toRulesJson(table), NO_SLICES);
    const rows = [...html.matchAll(/<tr id="rule-([^"]+)" data-advisory="([^"]*)" data-status="([^"]*)">/g)];
    expect(rows.map((r) => r[1])).toEqual(table.rules.map((r) => r.rule.id));
    rows.forEach((r, i) => {
      const { rule, evidence } = table.rules[i]!;
      expect(r[2]).toBe(rule.allowed.map((a) => table.advisories[a]).join(' '));
      expect(r[3]).toBe(evidence.status);
      expect(html).toContain(`<a href="#ev-${rule.id}">`);
      expect(html).toContain(`<article class="evidence" id="ev-${rule.id}">`);
    });
  });

  it('shows the counterexample in units, the proof details and the manifest hashes', () => {
    const table = fixtureTable();
    const html = reportHtml(toRulesJson(table), NO_SLICES);
    const r4 = html.slice(html.indexOf('id="ev-R4"'), html.indexOf('id="ev-R5"'));
    expect(r4).toContain('<td><code>lateral_m</code></td><td class="num">5.2</td><td>m</td>');
    expect(r4).toContain('the network gives <code>climb</code>');
    const r3 = html.slice(html.indexOf('id="ev-R3"'), html.indexOf('id="ev-R4"'));
    expect(r3).toContain("40.00 % of the box's volume proven in 40 pieces");
    expect(html).toContain(`<code id="model-sha256">${table.manifest.model.sha256}</code>`);
    expect(html).toContain(`<code id="scenario-sha256">${table.manifest.scenario.sha256}</code>`);
  });

  it('states the fidelity with its interval, the balanced fidelity and the counts by status', () => {
    const html = reportHtml(toRulesJson(fixtureTable()), NO_SLICES);
    expect(html).toContain('99.10 %');
    expect(html).toContain('95 % interval 98.94 % – 99.24 %');
    expect(html).toContain('98.20 %');
    expect(html).toContain('<span class="status status-sampled" data-status="sampled">3 sampled</span>');
    // proven share = R1 (1/8 × 100 %) + R3 (1/8 × 40 %) = 17.5 %
    expect(html).toContain('17.50 %');
  });
});
