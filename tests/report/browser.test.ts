/// <reference lib="dom" />
/**
 * The report in a real browser (Debian's chromium driven by playwright-core), from a file:// URL:
 * a Content-Security-Policy with no 'unsafe-eval' under which every chart still becomes a live Vega
 * view (Chromium reports any blocked eval as a console error, and the test wants none), no network
 * request but the file itself, the verdict table on the first screen, tooltips on hover, a click on
 * a legend entry fading the other configs, charts still drawn without JavaScript; and a report
 * built from hostile names fires no dialog, prints nothing, and shows the names as text.
 *
 * Without chromium the suite is skipped on a developer machine and fails under CI (env CI set).
 * Install it with `apt-get install -y chromium`; CHROMIUM_PATH overrides /usr/bin/chromium.
 */
import { existsSync, mkdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderReport } from '../../src/report/renderReport.js';
import { CONFIG_COLOURS } from '../../src/report/palette.js';
import { DEFAULT_NOTEBOOK } from '../../src/report/templatePaths.js';
import { HOSTILE_NAMES, LONG_NAME } from './hostileNames.js';
import { SAMPLE_NAMES, sampleResults } from './sampleResults.js';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
const ARTIFACTS = fileURLToPath(new URL('../.artifacts/', import.meta.url));
const VIEWPORT = { width: 1280, height: 800 };
const NOTEBOOK = readFileSync(DEFAULT_NOTEBOOK, 'utf8');
const available = existsSync(CHROMIUM);

/** What a page did while open: console messages, page errors, requests, dialogs. */
interface Watch {
  readonly console: string[];
  readonly requests: string[];
  readonly dialogs: string[];
  readonly openMs: number;
}

async function open(browser: Browser, file: string, javaScriptEnabled = true): Promise<{ page: Page; watch: Watch }> {
  const context = await browser.newContext({ viewport: VIEWPORT, javaScriptEnabled });
  const page = await context.newPage();
  const watch = { console: [] as string[], requests: [] as string[], dialogs: [] as string[], openMs: 0 };
  page.on('console', (m) => watch.console.push(`${m.type()}: ${m.text().slice(0, 300)}`));
  page.on('pageerror', (e) => watch.console.push(`pageerror: ${e.message.slice(0, 300)}`));
  page.on('dialog', (d) => {
    watch.dialogs.push(d.message());
    void d.dismiss();
  });
  // Every request is recorded; anything but the report file itself is refused.
  const url = pathToFileURL(file).href;
  await context.route('**/*', (route) => {
    watch.requests.push(route.request().url());
    return route.request().url() === url ? route.continue() : route.abort();
  });
  const start = performance.now();
  await page.goto(url, { waitUntil: 'load' });
  watch.openMs = performance.now() - start;
  return { page, watch };
}

/** Scroll every chart into view and wait until each has become interactive (or failed). */
async function hydrateAll(page: Page): Promise<string[]> {
  const charts = page.locator('.chart-view');
  const n = await charts.count();
  for (let i = 0; i < n; i++) await charts.nth(i).scrollIntoViewIfNeeded();
  await page.waitForFunction(
    () =>
      [...document.querySelectorAll('.chart-view')].every((v) =>
        ['true', 'failed'].includes(v.getAttribute('data-live') ?? ''),
      ),
    null,
    { timeout: 60_000 },
  );
  return page.evaluate(() =>
    [...document.querySelectorAll('.chart-view')].map((v) => v.getAttribute('data-live') ?? ''),
  );
}

/** Per chart: the number of drawn marks (paths with a shape, rects, lines, text) in its SVG. */
async function marksPerChart(page: Page): Promise<number[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('.chart-view')].map((v) => {
      const svg = v.querySelector('svg');
      if (svg === null) return 0;
      return [...svg.querySelectorAll('.role-mark path, .role-mark rect, .role-mark line, .role-mark text')].filter(
        (e) => e.tagName !== 'path' || (e.getAttribute('d') ?? '').length > 2,
      ).length;
    }),
  );
}

const suite = available ? describe : describe.skip;
// Outside CI a missing chromium skips the suite; say so, as scipyLive.test.ts does for scipy.
if (!available && process.env.CI === undefined)
  console.warn(
    `NOTICE: browser.test.ts skipped: chromium not found at ${CHROMIUM} (apt-get install -y chromium, or ` +
      `set CHROMIUM_PATH); under CI this fails`,
  );

if (!available && process.env.CI !== undefined) {
  describe('browser', () => {
    it('needs chromium under CI', () => {
      throw new Error(
        `chromium not found at ${CHROMIUM}: install it (apt-get install -y chromium) or set CHROMIUM_PATH`,
      );
    });
  });
}

suite('the report in chromium', () => {
  let browser: Browser;
  const reportFile = `${ARTIFACTS}report.html`;

  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    writeFileSync(reportFile, await renderReport(sampleResults(), NOTEBOOK, 'templates/notebook.md'));
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ARGS });
  });

  afterAll(async () => {
    await browser?.close();
  });

  it(
    'opens under a policy without eval: no console output, no request but the file, every chart live, ' +
      'verdicts on the first screen, tooltips, legend toggling',
    async () => {
      const { page, watch } = await open(browser, reportFile);
      // Figures measured on this machine are printed for the report (no timing assertion).
      console.info(`report.html: ${statSync(reportFile).size} bytes, load event after ${watch.openMs.toFixed(0)} ms`);

      // The policy the page runs under: scripts only by hash, no eval of any kind.
      const csp = await page.evaluate(
        () => document.querySelector('meta[http-equiv="Content-Security-Policy"]')?.getAttribute('content') ?? '',
      );
      const scriptSrc =
        csp
          .split('; ')
          .find((d) => d.startsWith('script-src '))
          ?.split(' ')
          .slice(1) ?? [];
      expect(scriptSrc).toHaveLength(3);
      expect(scriptSrc.every((source) => /^'sha256-[A-Za-z0-9+/]+=*'$/.test(source))).toBe(true);
      expect(csp).not.toContain('unsafe-eval');
      expect(csp).toMatch(/default-src 'none'/);

      // The overview (verdict counts and the matrix of differences) lies inside the first 1280 x 800 screen.
      const box = await page.locator('.overview-cell').boundingBox();
      expect(box).not.toBeNull();
      expect((box?.y ?? Infinity) + (box?.height ?? 0)).toBeLessThanOrEqual(VIEWPORT.height);
      expect((box?.x ?? Infinity) + (box?.width ?? 0)).toBeLessThanOrEqual(VIEWPORT.width);
      await page.screenshot({ path: `${ARTIFACTS}report.png` });

      // Every chart has an SVG with drawn marks, first as written, then as a live Vega view.
      const before = await marksPerChart(page);
      expect(before).toHaveLength(16); // the sweep of val_acc against memory first, then the cells' 15
      expect(before.every((n) => n > 0)).toBe(true);
      const live = await hydrateAll(page);
      expect(live.every((s) => s === 'true')).toBe(true);
      const after = await marksPerChart(page);
      expect(after.every((n) => n > 0)).toBe(true);

      // A tooltip appears on hover over a mark (the per-run values chart: one dot per seed).
      const figure = page.locator('figure.chart').nth(2);
      await figure.scrollIntoViewIfNeeded();
      const dots = figure.locator('.role-mark.mark-symbol path');
      expect(await dots.count()).toBeGreaterThan(0);
      const tip = page.locator('.chart-tip');
      let shown = false;
      for (let i = 0; i < Math.min(await dots.count(), 8) && !shown; i++) {
        const dot = await dots.nth(i).boundingBox();
        if (dot === null) continue;
        await page.mouse.move(dot.x + dot.width / 2, dot.y + dot.height / 2);
        shown = await tip.isVisible();
      }
      expect(shown).toBe(true);
      expect(await tip.textContent()).toMatch(/seed/);

      // Clicking a config in the legend of the learning curves keeps its lines and fades the others.
      const curves = page.locator('figure.chart').nth(1);
      await curves.scrollIntoViewIfNeeded();
      const meanOpacity = (): Promise<Record<string, string>> =>
        curves.evaluate((f) =>
          Object.fromEntries(
            [...f.querySelectorAll('.mean_marks path')].map((p) => [
              p.getAttribute('stroke') ?? '',
              p.getAttribute('opacity') ?? '1',
            ]),
          ),
        );
      const [c0, c1, c2] = [CONFIG_COLOURS[0] ?? '', CONFIG_COLOURS[1] ?? '', CONFIG_COLOURS[2] ?? ''];
      expect(await meanOpacity()).toEqual({ [c0]: '1', [c1]: '1', [c2]: '1' });
      const label = curves.locator('.role-legend-label text', { hasText: new RegExp(`^${SAMPLE_NAMES.configs[1]}$`) });
      expect(await label.count()).toBe(1);
      await expect(curves.locator('.chart-hint').isVisible()).resolves.toBe(true);
      await label.click();
      await expect.poll(meanOpacity).toEqual({ [c0]: '0.15', [c1]: '1', [c2]: '0.15' });
      // A double-click on the plot shows every config again.
      const plot = await curves.locator('.mean_marks').first().boundingBox();
      expect(plot).not.toBeNull();
      await page.mouse.dblclick((plot?.x ?? 0) + 4, (plot?.y ?? 0) + 4);
      await expect.poll(meanOpacity).toEqual({ [c0]: '1', [c1]: '1', [c2]: '1' });

      await page.screenshot({ path: `${ARTIFACTS}report-full.png`, fullPage: true });
      expect(watch.console).toEqual([]);
      expect(watch.dialogs).toEqual([]);
      expect(watch.requests).toEqual([pathToFileURL(reportFile).href]);
      await page.context().close();
    },
  );

  it('makes legends usable by keyboard: a label takes focus, Enter shows that config alone', async () => {
    const { page, watch } = await open(browser, reportFile);
    const curves = page.locator('figure.chart').nth(1);
    await curves.scrollIntoViewIfNeeded();
    await expect.poll(() => curves.locator('.chart-view').getAttribute('data-live'), { timeout: 60_000 }).toBe('true');
    const opacities = (): Promise<string[]> =>
      curves.evaluate((f) => [...f.querySelectorAll('.mean_marks path')].map((p) => p.getAttribute('opacity') ?? '1'));
    expect(new Set(await opacities())).toEqual(new Set(['1']));
    const label = curves.locator('.role-legend-label text', { hasText: new RegExp(`^${SAMPLE_NAMES.configs[1]}$`) });
    await expect(label.getAttribute('tabindex')).resolves.toBe('0');
    await label.focus();
    await page.keyboard.press('Enter');
    // One config stays at full strength, the others fade (as a mouse click on the label does).
    await expect.poll(async () => (await opacities()).filter((o) => o === '1').length).toBe(1);
    expect(watch.console).toEqual([]);
    await page.context().close();
  });

  it('keeps the drawn charts when JavaScript does not run', async () => {
    const { page, watch } = await open(browser, reportFile, false);
    const marks = await marksPerChart(page);
    expect(marks).toHaveLength(16);
    expect(marks.every((n) => n > 0)).toBe(true);
    expect(await page.locator('.chart-view[data-live]').count()).toBe(0);
    // The toggling hint is for live charts only.
    expect(await page.locator('.chart-hint').count()).toBe(5);
    expect(await page.locator('.chart-hint:visible').count()).toBe(0);
    expect(watch.console).toEqual([]);
    await page.context().close();
  });

  it('shows hostile names as text: no dialog, no console output, no injected element', async () => {
    const file = `${ARTIFACTS}hostile.html`;
    writeFileSync(file, await renderReport(sampleResults(HOSTILE_NAMES), NOTEBOOK, 'templates/notebook.md'));
    const { page, watch } = await open(browser, file);
    await hydrateAll(page);
    // Hover over marks of every chart, so tooltips with hostile text are drawn too.
    const symbols = page.locator('.chart-view .role-mark path');
    for (let i = 0; i < Math.min(await symbols.count(), 30); i += 3) {
      const b = await symbols.nth(i).boundingBox();
      if (b !== null) await page.mouse.move(b.x + b.width / 2, b.y + b.height / 2);
    }
    const dom = await page.evaluate(() => ({
      // The checks below are about the rendered text a reader sees; textContent would also hold script bodies.
      // biome-ignore lint/performance/useDomNodeTextContent: innerText is the rendered text, which is what is checked
      text: document.body.innerText,
      // The page's own text, charts left out (chart labels are drawn by Vega from the specs).
      pageText: (() => {
        const copy = document.body.cloneNode(true) as HTMLElement;
        for (const e of copy.querySelectorAll('.chart-view, script')) e.remove();
        return copy.textContent ?? '';
      })(),
      images: document.querySelectorAll('img').length,
      handlers: document.querySelectorAll('[onerror], [onload], [onclick]').length,
      jsLinks: [...document.querySelectorAll('a[href]')].filter((a) =>
        /^\s*javascript:/i.test(a.getAttribute('href') ?? ''),
      ).length,
      scripts: [...document.querySelectorAll('script')].map((s) => s.getAttribute('type') ?? 'classic'),
      title: document.title,
      width: document.documentElement.scrollWidth,
    }));
    expect(watch.dialogs).toEqual([]);
    expect(watch.console).toEqual([]);
    expect(dom.images).toBe(0);
    expect(dom.handlers).toBe(0);
    expect(dom.jsLinks).toBe(0);
    expect(dom.scripts.filter((t) => t === 'classic')).toHaveLength(3);
    expect(dom.scripts.filter((t) => t !== 'classic' && t !== 'application/json')).toEqual([]);
    for (const text of [
      'memory=<script>alert(1)</script>',
      `memory="'><img src=x onerror=alert(2)>`,
      '</script><script>alert(3)</script>',
      '{{verdicts}} [click](javascript:alert(4)) _x_ ‹U+202E›gnp.exe',
      '<a href="javascript:alert(7)">x</a> {{problems}} ‹U+202E›evil',
    ]) {
      expect(dom.text).toContain(text);
    }
    expect(dom.pageText).not.toContain('\u202E');
    expect(dom.text).toContain(`${LONG_NAME.slice(0, 120)}… (10000 characters)`);
    expect(dom.width).toBeLessThanOrEqual(VIEWPORT.width);
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.screenshot({ path: `${ARTIFACTS}hostile.png` });
    expect(watch.requests).toEqual([pathToFileURL(file).href]);
    await page.context().close();
  });
});
