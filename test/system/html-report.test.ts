// The HTML report in a real browser (Debian's chromium, headless): the demo report's rows, filters and
// diagrams, the page without JavaScript, and a 10,000-finding report from a generated graph.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { check, type CheckResult } from '../../src/check.js';
import { toHtml } from '../../src/report/html/html.js';
import { lintDemo } from '../report/html-demo-run.js';
import { openChromium } from './chromium.js';
import { ASSET, PLANTED_PER_GROUP, writePlantedGraph } from './planted-graph.js';

// The browser globals that the functions run in the page use: this project compiles without the DOM
// library, so they are declared here, in this module only, with just the members used.
interface PageElement {
  dataset: Record<string, string | undefined>;
  offsetParent: unknown;
  tagName: string;
  value: string;
  click(): void;
  dispatchEvent(event: unknown): boolean;
}
declare const document: { querySelector(selector: string): PageElement | null };
declare const requestAnimationFrame: (callback: () => void) => number;
declare const Event: new (type: string) => unknown;
/** The page's navigation timing entry (W3C Navigation Timing Level 2), with the fields read here. */
interface PagePerformance {
  getEntriesByType(type: 'navigation'): { domContentLoadedEventEnd: number; loadEventEnd: number }[];
}

/** Screenshots and measurements for review go here (ignored by git). */
const OUTPUT = path.resolve('test-output');

/** Writes a report page to a temporary folder and returns its file: URL. */
function writePage(html: string, name: string): string {
  const folder = mkdtempSync(path.join(tmpdir(), 'isapart-html-page-'));
  const file = path.join(folder, name);
  writeFileSync(file, html);
  return pathToFileURL(file).href;
}

/** Collects console errors, page errors and failed requests of a page. */
function watchProblems(page: Page): string[] {
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(`console: ${message.text()}`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('requestfailed', (request) => problems.push(`request failed: ${request.url()}`));
  return problems;
}

/** The rule ids of the rows the reader can see. */
function visibleRules(page: Page): Promise<string[]> {
  return page.$$eval('tbody.finding', (rows) =>
    rows.map((row) => row as unknown as PageElement).filter((row) => row.offsetParent !== null).map((row) => row.dataset.rule ?? ''),
  );
}

/** Opens a page of the report at `url` in Chromium, watching its console and page errors, runs `work` on it, and closes the browser. */
async function onPage(url: string, work: (page: Page, problems: string[]) => Promise<void>): Promise<void> {
  const browser = await openChromium();
  try {
    const page = await browser.context.newPage();
    const problems = watchProblems(page);
    await page.goto(url);
    await work(page, problems);
  } finally {
    await browser.close();
  }
}

/** Sets a control's value as a reader would and waits for the next frame to be drawn. */
async function choose(page: Page, selector: string, value: string): Promise<number> {
  return page.evaluate(
    async ([target, chosen]) => {
      const started = performance.now();
      const control = document.querySelector(target)!;
      control.value = chosen;
      control.dispatchEvent(new Event(control.tagName === 'INPUT' ? 'input' : 'change'));
      // A search waits for the reader to stop typing (150 ms); then one frame is drawn.
      if (control.tagName === 'INPUT') await new Promise((resolve) => setTimeout(resolve, 200));
      await new Promise((resolve) => requestAnimationFrame(() => setTimeout(resolve, 0)));
      return performance.now() - started;
    },
    [selector, value] as const,
  );
}

/** Clicks the first element the selector matches, in the page, and waits for the next frame; returns the time taken. */
async function clickInPage(page: Page, selector: string): Promise<number> {
  return page.evaluate(async (target) => {
    const started = performance.now();
    document.querySelector(target)!.click();
    await new Promise((resolve) => requestAnimationFrame(() => setTimeout(resolve, 0)));
    return performance.now() - started;
  }, selector);
}

describe('the demo report in Chromium', () => {
  let demo: CheckResult;
  let url: string;

  beforeAll(async () => {
    demo = await lintDemo();
    url = writePage(toHtml(demo.findings, demo.context), 'demo-report.html');
  });

  it('opens with no console error, one row per finding, and the reported ones shown', async () => {
    await onPage(url, async (page, problems) => {
      const reported = demo.findings.filter((finding) => !finding.suppression);
      expect(await page.locator('tbody.finding').count()).toBe(demo.findings.length);
      expect((await visibleRules(page)).length).toBe(reported.length);
      expect(await page.textContent('#status')).toBe(`Showing 1–${reported.length} of ${reported.length} matching findings (${demo.findings.length} in the report).`);
      await choose(page, '#filter-allowed', '');
      expect((await visibleRules(page)).length).toBe(demo.findings.length);
      expect(problems).toEqual([]);
    });
  });

  it('filters by rule, level, file and search text', async () => {
    await onPage(url, async (page, problems) => {
      const reported = demo.findings.filter((finding) => !finding.suppression);
      for (const ruleId of ['orphan-class', 'disjoint-overlap', 'subclass-cycle']) {
        await choose(page, '#filter-rule', ruleId);
        const shown = await visibleRules(page);
        expect(shown.length).toBe(reported.filter((finding) => finding.ruleId === ruleId).length);
        expect(new Set(shown)).toEqual(new Set([ruleId]));
      }
      await choose(page, '#filter-rule', '');
      await choose(page, '#filter-level', 'error');
      expect((await visibleRules(page)).length).toBe(reported.filter((finding) => finding.level === 'error').length);
      await choose(page, '#filter-level', '');
      await choose(page, '#filter-file', 'depots.nt');
      expect(await visibleRules(page)).toEqual(['orphan-class']);
      await choose(page, '#filter-file', '');
      await choose(page, '#filter-text', 'sideing');
      expect(await visibleRules(page)).toEqual(['orphan-class']);
      await choose(page, '#filter-text', 'no such thing anywhere');
      expect(await visibleRules(page)).toEqual([]);
      expect(await page.textContent('#status')).toContain('No finding matches');
      expect(problems).toEqual([]);
    });
  });

  it('expands a cycle finding to an SVG with one node per member and one edge per evidence statement; screenshot for review', async () => {
    await onPage(url, async (page, problems) => {
      const cycle = demo.findings.find((finding) => finding.ruleId === 'subclass-cycle')!;
      const row = page.locator('tbody.finding[data-rule="subclass-cycle"]');
      const diagram = row.locator('svg.diagram');
      expect(await diagram.isVisible()).toBe(false);
      await row.locator('tr.summary-row td.message').click();
      await diagram.waitFor({ state: 'visible' });
      expect(await diagram.locator('g.node').count()).toBe(cycle.nodes.length);
      expect(await diagram.locator('g.edge').count()).toBe(cycle.evidence.length);
      const terms = await diagram.locator('g.node').evaluateAll((nodes) => nodes.map((node) => (node as unknown as PageElement).dataset.term));
      expect(terms.sort()).toEqual([...cycle.nodes].sort());
      const box = await diagram.boundingBox();
      expect(box!.width).toBeGreaterThan(100);
      expect(box!.height).toBeGreaterThan(100);
      await row.locator('tr.summary-row td.message').click();
      expect(await diagram.isVisible()).toBe(false);
      for (const ruleId of ['subclass-cycle', 'part-cycle', 'disjoint-overlap']) {
        await page.locator(`tbody.finding[data-rule="${ruleId}"] tr.summary-row td.rule`).first().click();
      }
      mkdirSync(OUTPUT, { recursive: true });
      await page.screenshot({ path: path.join(OUTPUT, 'html-demo-report.png'), fullPage: true });
      expect(problems).toEqual([]);
    });
  });

  it('prints without its controls, with the rows of the page opened and their diagrams drawn', async () => {
    await onPage(url, async (page, problems) => {
      await page.emulateMedia({ media: 'print' });
      expect(await page.locator('#controls').isVisible()).toBe(false);
      expect(await page.locator('#pager').isVisible()).toBe(false);
      // Chromium fires beforeprint when it prints; here it is fired by hand, as printing cannot be watched headless.
      await page.evaluate(() => (globalThis as unknown as { dispatchEvent(event: unknown): boolean }).dispatchEvent(new Event('beforeprint')));
      const withEvidence = demo.findings.filter((finding) => !finding.suppression && finding.evidence.length > 0).length;
      await page.locator('tbody.finding.on svg.diagram').nth(withEvidence - 1).waitFor({ state: 'visible' });
      expect(await page.locator('tbody.finding.on svg.diagram').count()).toBe(withEvidence);
      await page.evaluate(() => (globalThis as unknown as { dispatchEvent(event: unknown): boolean }).dispatchEvent(new Event('afterprint')));
      expect(await page.locator('tbody.finding.on details[open]').count()).toBe(0);
      expect(problems).toEqual([]);
    });
  });

  it('shows every row and opens the diagrams with JavaScript off', async () => {
    const browser = await openChromium({ javaScriptEnabled: false });
    try {
      const page = await browser.context.newPage();
      await page.goto(url);
      expect((await visibleRules(page)).length).toBe(demo.findings.length);
      expect(await page.locator('#controls').isVisible()).toBe(false);
      const row = page.locator('tbody.finding[data-rule="part-cycle"]');
      await row.locator('summary').click();
      const diagram = row.locator('svg.diagram');
      await diagram.waitFor({ state: 'visible' });
      expect(await diagram.locator('g.edge').count()).toBe(2);
    } finally {
      await browser.close();
    }
  });
});

describe('a 10,000-finding report in Chromium', () => {
  const groups = 2500;
  let result: CheckResult;
  let url: string;
  const timings: Record<string, number> = {};

  beforeAll(async () => {
    const { folder } = writePlantedGraph(groups, 10);
    let started = performance.now();
    result = await check({ paths: ['.'], cwd: folder, roots: [ASSET] });
    timings.checkMs = performance.now() - started;
    started = performance.now();
    const html = toHtml(result.findings, result.context);
    timings.buildHtmlMs = performance.now() - started;
    timings.pageBytes = Buffer.byteLength(html);
    url = writePage(html, 'large-report.html');
  });

  afterAll(() => {
    // Measurements for the reader, not assertions: tests never assert on timing.
    mkdirSync(OUTPUT, { recursive: true });
    const rounded = Object.fromEntries(Object.entries(timings).map(([name, value]) => [name, Math.round(value)]));
    // The machine's load while measuring, as os.loadavg() gives it (1, 5 and 15 minutes): shared runners vary.
    const load = loadavg().map((value) => Math.round(value * 10) / 10);
    writeFileSync(path.join(OUTPUT, 'html-large-report-timings.json'), `${JSON.stringify({ findings: result.findings.length, ...rounded, load }, null, 2)}\n`);
    console.log('10,000-finding HTML report:', rounded);
  });

  it('comes from a real run: every planted problem found once', () => {
    const perRule: Record<string, number> = {};
    for (const finding of result.findings) perRule[finding.ruleId] = (perRule[finding.ruleId] ?? 0) + 1;
    expect(perRule).toEqual(Object.fromEntries(Object.entries(PLANTED_PER_GROUP).map(([rule, count]) => [rule, count * groups])));
    expect(result.findings.length).toBe(10_000);
    expect(result.context.inputErrors).toEqual([]);
  });

  it('opens, pages, filters, searches, sorts and expands with no page error', async () => {
    const browser = await openChromium();
    try {
      const page = await browser.context.newPage();
      const problems = watchProblems(page);
      const started = Date.now();
      await page.goto(url, { timeout: 240_000 });
      timings.openMs = Date.now() - started;
      const navigation = await page.evaluate(() => {
        // In the page this is the browser's own performance object.
        const entry = (performance as unknown as PagePerformance).getEntriesByType('navigation')[0];
        return { domContentLoaded: entry.domContentLoadedEventEnd, load: entry.loadEventEnd };
      });
      timings.domContentLoadedMs = navigation.domContentLoaded;
      timings.loadEventMs = navigation.load;
      expect(await page.locator('tbody.finding').count()).toBe(10_000);
      expect((await visibleRules(page)).length).toBe(100);
      expect(await page.textContent('#status')).toBe('Showing 1–100 of 10000 matching findings (10000 in the report).');

      timings.filterByRuleMs = await choose(page, '#filter-rule', 'kind-and-part');
      const shown = await visibleRules(page);
      expect(shown.length).toBe(100);
      expect(new Set(shown)).toEqual(new Set(['kind-and-part']));
      expect(await page.textContent('#status')).toBe('Showing 1–100 of 2500 matching findings (10000 in the report).');

      timings.searchMs = await choose(page, '#filter-text', 'cab1234 ');
      expect(await visibleRules(page)).toEqual(['kind-and-part']);
      await choose(page, '#filter-text', '');

      timings.sortByFocusMs = await choose(page, '#sort', 'focus');
      const focusOrder = await page.$$eval('tbody.finding.on', (rows) => rows.map((row) => (row as unknown as PageElement).dataset.focus!.toLowerCase()));
      expect(focusOrder).toEqual([...focusOrder].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));

      // Above 1,000 findings the page offers no "all rows" choice; 500 is the largest page.
      expect(await page.locator('#page-size option[value="all"]').count()).toBe(0);
      timings.pageOf500Ms = await choose(page, '#page-size', '500');
      expect((await visibleRules(page)).length).toBe(500);
      await choose(page, '#page-size', '100');

      timings.nextPageMs = await clickInPage(page, '#page-next');
      expect(await page.textContent('#status')).toBe('Showing 101–200 of 2500 matching findings (10000 in the report).');

      const row = page.locator('tbody.finding.on').first();
      timings.expandMs = await clickInPage(page, 'tbody.finding.on td.message');
      await row.locator('svg.diagram').waitFor({ state: 'visible' });
      // A kind-and-part finding: the part-of and the subclass-of statement between the cab and its car.
      expect(await row.locator('svg.diagram g.node').count()).toBe(2);
      expect(await row.locator('svg.diagram g.edge').count()).toBe(2);
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  });
});
