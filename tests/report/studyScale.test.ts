/// <reference lib="dom" />
/**
 * The report at study scale (issue 15's acceptance), in Debian's chromium driven by playwright-core:
 * on generated studies of 100 tasks x 5 methods x 3 seeds and of 168 configs x 10 seeds
 * (tests/support/studyGenerator.ts), report.html is at most 5 MB and, with every <details>
 * collapsed, at most 30,000 px tall; summary.md is at most 60,000 characters; results.json at most
 * 20 MB; at 1280 x 900 the first screen shows the overview (its verdict counts and its matrix begin
 * there); and no element makes the page wider than the window, with details collapsed or all open.
 * Screenshots of the first screen go to tests/.artifacts/ for review.
 *
 * The studies are analysed with 400 bootstrap resamples (200 for bands) instead of 10,000 to keep the
 * test short: the number of resamples changes no size or layout measured here.
 * Without chromium the suite is skipped on a developer machine and fails under CI (env CI set).
 */
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { renderReport } from '../../src/report/renderReport.js';
import { resultsJson } from '../../src/report/resultsJson.js';
import { summaryMarkdown } from '../../src/report/summaryMarkdown.js';
import { DEFAULT_NOTEBOOK } from '../../src/report/templatePaths.js';
import { readFileSync } from 'node:fs';
import { SWEEP_STUDY, TASKS_STUDY } from '../support/studyGenerator.js';
import { studyResults } from '../support/studyResults.js';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const ARTIFACTS = fileURLToPath(new URL('../.artifacts/', import.meta.url));
const VIEWPORT = { width: 1280, height: 900 };
const available = existsSync(CHROMIUM);

interface Written {
  readonly html: string;
  readonly htmlBytes: number;
  readonly markdown: string;
  readonly jsonBytes: number;
}

async function write(name: string, results: Results): Promise<Written> {
  const html = await renderReport(results, readFileSync(DEFAULT_NOTEBOOK, 'utf8'), 'templates/notebook.md');
  const markdown = summaryMarkdown(results);
  const json = resultsJson(results);
  const file = `${ARTIFACTS}${name}.html`;
  writeFileSync(file, html);
  writeFileSync(`${ARTIFACTS}${name}.md`, markdown);
  return { html: file, htmlBytes: Buffer.byteLength(html), markdown, jsonBytes: Buffer.byteLength(json) };
}

const suite = available ? describe : describe.skip;
if (!available && process.env.CI !== undefined) {
  describe('study scale in chromium', () => {
    it('needs chromium under CI', () => {
      throw new Error(
        `chromium not found at ${CHROMIUM}: install it (apt-get install -y chromium) or set CHROMIUM_PATH`,
      );
    });
  });
}

suite('the report at study scale', () => {
  let browser: Browser;
  const written: Record<string, Written> = {};

  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    written.tasks = await write(
      'study-tasks',
      await studyResults(TASKS_STUDY, { baseline: 'method=base', taskKey: 'task' }),
    );
    written.sweep = await write(
      'study-sweep',
      await studyResults(SWEEP_STUDY, { baseline: 'ticks=8,memory=4,width=128' }),
    );
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--headless', '--no-sandbox', '--disable-gpu'],
    });
  }, 600_000);

  afterAll(async () => {
    await browser?.close();
  });

  for (const [name, label] of [
    ['tasks', '100 tasks x 5 methods x 3 seeds'],
    ['sweep', '168 configs x 10 seeds'],
  ] as const) {
    it(`${label}: sizes within bounds`, () => {
      const w = written[name] as Written;
      console.info(
        `${label}: report.html ${w.htmlBytes} bytes, summary.md ${w.markdown.length} characters, ` +
          `results.json ${w.jsonBytes} bytes`,
      );
      expect(w.htmlBytes).toBeLessThanOrEqual(5_000_000);
      expect(w.markdown.length).toBeLessThanOrEqual(60_000);
      expect(w.jsonBytes).toBeLessThanOrEqual(20_000_000);
    });

    it(`${label}: the overview on the first screen, the page short when folded and never wider than the ` +
      `window`, async () => {
      const w = written[name] as Written;
      const context = await browser.newContext({ viewport: VIEWPORT });
      const page = await context.newPage();
      await page.goto(pathToFileURL(w.html).href, { waitUntil: 'load' });
      await page.screenshot({ path: `${ARTIFACTS}study-${name}.png` });
      const overview = await page.locator('.overview-cell').boundingBox();
      const tally = await page.locator('.overview-cell .tally').boundingBox();
      const matrix = await page.locator('.overview-cell table').first().boundingBox();
      expect(overview).not.toBeNull();
      expect((tally?.y ?? Infinity) + (tally?.height ?? 0)).toBeLessThanOrEqual(VIEWPORT.height);
      expect(matrix?.y ?? Infinity).toBeLessThan(VIEWPORT.height - 60);
      const measure = (open: boolean) =>
        page.evaluate((o) => {
          for (const d of document.querySelectorAll('details')) d.open = o;
          return { height: document.documentElement.scrollHeight, width: document.documentElement.scrollWidth };
        }, open);
      const folded = await measure(false);
      console.info(`${label}: ${folded.height} px tall with details collapsed`);
      expect(folded.height).toBeLessThanOrEqual(30_000);
      expect(folded.width).toBeLessThanOrEqual(VIEWPORT.width);
      const unfolded = await measure(true);
      expect(unfolded.width).toBeLessThanOrEqual(VIEWPORT.width);
      await context.close();
    }, 120_000);
  }
});
