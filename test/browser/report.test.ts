import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { main } from '../../src/cli/main.js';
import type { CliIo } from '../../src/cli/io.js';
import { sliceHelds, slicePairs } from '../../src/report/html/index.js';
import type { RuleTable } from '../../src/types.js';
import { writeFixtureRun, type FixtureRun } from './report-fixture.js';
import { writeScaleRun } from './scale-fixture.js';

const CHROMIUM = '/usr/bin/chromium';
const hasChromium = existsSync(CHROMIUM);
const skipNote = hasChromium ? '' : ` (skipped: ${CHROMIUM} is missing; apt-get install -y chromium)`;
/** Screenshots and the scale figures go here, outside the repository. */
const ARTEFACTS = join(tmpdir(), 'specula-browser');

const quietIo = (cwd: string): CliIo => ({ stdout: () => {}, stderr: () => {}, isTTY: false, cwd });

/** Rule ids whose box holds `held` outside the pair: independent of the report's code. */
function cutting(table: RuleTable, pair: readonly [number, number], held: readonly number[]): string[] {
  return table.rules
    .filter(({ rule }) => rule.box.every(([lo, hi], k) => k === pair[0] || k === pair[1] || (lo <= held[k]! && held[k]! <= hi)))
    .map(({ rule }) => rule.id);
}

/** The visible slice figure's pair and held indices, and the rule outlines drawn in its SVG. */
async function visibleSlice(page: Page): Promise<{ count: number; pair: string; held: string; labels: string[] }> {
  return page.evaluate(() => {
    const figs = Array.from(document.querySelectorAll('figure.slice')).filter((f) => !(f as HTMLElement).hidden);
    if (figs.length !== 1) throw new Error(`expected one visible slice, found ${figs.length}`);
    const f = figs[0]!;
    const paths = Array.from(f.querySelectorAll('g.outline_proven_marks path, g.outline_sampled_marks path, g.outline_refuted_marks path, g.outline_unknown_marks path'));
    return { count: paths.length, pair: f.getAttribute('data-pair')!, held: f.getAttribute('data-held')!, labels: paths.map((p) => p.getAttribute('aria-label')!.split(' ')[0]!) };
  });
}

async function visibleRuleIds(page: Page): Promise<string[]> {
  return page.$$eval('#rules tbody tr', (rows) => rows.filter((r) => !(r as HTMLElement).hidden).map((r) => r.id.replace(/^rule-/, '')));
}

async function choose(page: Page, select: string, value: string): Promise<void> {
  await page.selectOption(select, value);
}

describe.skipIf(!hasChromium)('report.html in headless Chromium', () => {
  let browser: Browser;
  let run: FixtureRun;
  let page: Page;
  const requests: string[] = [];

  beforeAll(async () => {
    const { chromium } = await import('playwright-core');
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      headless: true,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    run = writeFixtureRun();
    expect(await main(['report', run.dir, '--grid', '40'], quietIo(run.dir))).toBe(0);
    page = await browser.newPage({ viewport: { width: 1200, height: 900 } });
    page.on('request', (r) => requests.push(r.url()));
    await page.goto(pathToFileURL(join(run.dir, 'report.html')).href);
  });
  afterAll(async () => browser?.close());

  it(`loads from disk without any other request${skipNote}`, () => {
    expect(requests).toEqual([pathToFileURL(join(run.dir, 'report.html')).href]);
  });

  it(`lists every rule in the table${skipNote}`, async () => {
    expect(await visibleRuleIds(page)).toEqual(run.table.rules.map((r) => r.rule.id));
    expect(await page.textContent('#rule-count')).toBe('6 of 6 rules shown');
  });

  it(`draws the selected slice with one outline per rule cutting it, and redraws when the pair changes${skipNote}`, async () => {
    const pairs = slicePairs(run.table);
    const helds = sliceHelds(run.table);
    // first pair (range_m, climb_mps) held at R4's centre: R1, R3, R4, R5, R6 cut it
    let shown = await visibleSlice(page);
    expect([shown.pair, shown.held]).toEqual(['0', '0']);
    expect(shown.labels.sort()).toEqual(cutting(run.table, pairs[0]!, helds[0]!.x).sort());
    expect(shown.count).toBe(5);
    await page.locator('#slices').screenshot({ path: join(ARTEFACTS, 'report-first-slice.png') });
    // third pair (range_m, lateral_m) at R4's centre, climb_mps = 0.375: only R4 cuts it
    await choose(page, '#slice-pair', '2');
    shown = await visibleSlice(page);
    expect([shown.pair, shown.held]).toEqual(['2', '0']);
    expect(shown.labels).toEqual(['R4']);
    await page.locator('#slices').screenshot({ path: join(ARTEFACTS, 'report-third-pair.png') });
    // held at R5's centre (climb_mps = -0.5): R1, R2, R5, R6
    await choose(page, '#slice-held', '1');
    shown = await visibleSlice(page);
    expect(shown.labels.sort()).toEqual(['R1', 'R2', 'R5', 'R6']);
    // R1's centre gives the same plane as R5's for this pair: it was not drawn twice and is disabled
    expect(await page.$eval('#slice-held option[value="2"]', (o) => (o as HTMLOptionElement).disabled)).toBe(true);
  });

  it(`filters the table by advisory and by status${skipNote}`, async () => {
    await choose(page, '#filter-advisory', 'climb');
    expect(await visibleRuleIds(page)).toEqual(['R3']);
    await choose(page, '#filter-advisory', 'go_left');
    expect(await visibleRuleIds(page)).toEqual(['R1', 'R4', 'R5', 'R6']);
    await choose(page, '#filter-status', 'sampled');
    expect(await visibleRuleIds(page)).toEqual(['R5', 'R6']);
    expect(await page.textContent('#rule-count')).toBe('2 of 6 rules shown');
    await choose(page, '#filter-advisory', '');
    await choose(page, '#filter-status', '');
    expect(await visibleRuleIds(page)).toHaveLength(6);
  });

  it(`sorts the table by share of the domain${skipNote}`, async () => {
    await page.click('#rules th:has-text("share of domain")');
    // shares: R2 0.075, R1 = R3 = R6 0.125 (kept in table order), R5 0.15625, R4 0.375
    expect(await visibleRuleIds(page)).toEqual(['R2', 'R1', 'R3', 'R6', 'R5', 'R4']);
    await page.click('#rules th:has-text("share of domain")');
    expect(await visibleRuleIds(page)).toEqual(['R4', 'R5', 'R1', 'R3', 'R6', 'R2']);
    await page.screenshot({ path: join(ARTEFACTS, 'report-full.png'), fullPage: true });
  });

  it(`opens and filters a table of 500 rules over 10 inputs (figures in ${join(ARTEFACTS, 'scale.json')})${skipNote}`, async () => {
    const big = writeScaleRun();
    const t0 = performance.now();
    expect(await main(['report', big.dir], quietIo(big.dir))).toBe(0);
    const buildMs = performance.now() - t0;
    const file = join(big.dir, 'report.html');
    const p = await browser.newPage({ viewport: { width: 1200, height: 900 } });
    await p.goto(pathToFileURL(file).href);
    const load = await p.evaluate(() => {
      const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
      return { domContentLoadedMs: nav.domContentLoadedEventEnd, loadMs: nav.loadEventEnd };
    });
    expect(await p.$$eval('#rules tbody tr', (r) => r.length)).toBe(500);
    const filter = await p.evaluate(() => {
      const s = document.getElementById('filter-advisory') as HTMLSelectElement;
      const t = performance.now();
      s.value = 'a1';
      s.dispatchEvent(new Event('change'));
      void document.body.offsetHeight; // include the layout the change causes
      const filterMs = performance.now() - t;
      const t2 = performance.now();
      (document.querySelector('#rules th[data-sort="num"]') as HTMLElement).click();
      void document.body.offsetHeight;
      return { filterMs, sortMs: performance.now() - t2, shown: document.getElementById('rule-count')!.textContent };
    });
    expect(filter.shown).toBe('125 of 500 rules shown');
    const { size } = await import('node:fs').then((fs) => fs.statSync(file));
    mkdirSync(ARTEFACTS, { recursive: true });
    writeFileSync(join(ARTEFACTS, 'scale.json'), JSON.stringify({ rules: 500, inputs: 10, bytes: size, buildMs, ...load, ...filter }, null, 2));
    await p.screenshot({ path: join(ARTEFACTS, 'report-scale.png') });
    await p.close();
  });
});
