/// <reference lib="dom" />
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderReportHtml } from '../../src/report/html/render-report.js';
import { writeFitReport } from '../../src/workflows/fit/fit-report.js';
import { readRunConfig } from '../../src/workflows/fit/run-config.js';
import { runJointFit } from '../../src/workflows/fit/run-fit.js';
import { QUIET, writeSmallFitProblem } from '../workflows/fit/support/small-fit-problem.js';
import { syntheticReportInput } from './synthetic-report.js';

const CHROMIUM = '/usr/bin/chromium';
// Without the background-networking flags the closed network refuses Chromium's own connections.
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

const MISSING = `Chromium not found at ${CHROMIUM}: install it with "apt-get update && apt-get install -y --no-install-recommends chromium" (CI does this in .ci/run)`;

let folder = '';
let context: BrowserContext | undefined;
const input = syntheticReportInput();

function browser(): BrowserContext {
  if (context === undefined) throw new Error(MISSING);
  return context;
}

describe('the HTML report in headless Chromium', () => {
  beforeAll(async () => {
    if (!existsSync(CHROMIUM)) return; // every test below then fails with the install hint
    folder = mkdtempSync(join(tmpdir(), 'treble-report-'));
    context = await chromium.launchPersistentContext(join(folder, 'profile'), {
      executablePath: CHROMIUM,
      headless: true,
      args: CHROMIUM_ARGS,
      viewport: { width: 1100, height: 900 },
    });
  });

  afterAll(async () => {
    await context?.close();
    if (folder !== '') rmSync(folder, { recursive: true, force: true });
  });

  it('has Chromium installed', () => {
    expect(existsSync(CHROMIUM), MISSING).toBe(true);
  });

  async function checkReportFile(file: string, figures: number): Promise<void> {
    const page = await browser().newPage();
    const problems: string[] = [];
    const requests: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(`${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
    page.on('request', (r) => requests.push(r.url()));
    await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });

    const svgs = page.locator('figure > svg');
    expect(await svgs.count()).toBe(figures);
    expect(await page.locator('svg').count()).toBe(figures);
    for (let i = 0; i < figures; i++) {
      const svg = svgs.nth(i);
      await svg.scrollIntoViewIfNeeded();
      expect(await svg.isVisible(), `figure ${i + 1} visible`).toBe(true);
      const box = await svg.boundingBox();
      expect(box?.width ?? 0, `figure ${i + 1} width`).toBeGreaterThan(100);
      expect(box?.height ?? 0, `figure ${i + 1} height`).toBeGreaterThan(100);
      // Drawn content: shapes beyond the background rectangle, and a drawing whose bounding box is not empty.
      const drawn = await svg.evaluate((el) => {
        const shapes = el.querySelectorAll('path, line, circle, polygon, polyline, rect, text').length - 1;
        const paths = Array.from(el.querySelectorAll('path')).filter((p) => (p as SVGPathElement).getTotalLength() > 0).length;
        const bbox = (el as SVGSVGElement).getBBox();
        return { shapes, paths, width: bbox.width, height: bbox.height };
      });
      expect(drawn.shapes, `figure ${i + 1} shapes`).toBeGreaterThan(20);
      expect(drawn.paths, `figure ${i + 1} non-empty paths`).toBeGreaterThan(0);
      expect(drawn.width).toBeGreaterThan(0);
      expect(drawn.height).toBeGreaterThan(0);
    }
    expect(problems).toEqual([]);
    expect(requests.filter((u) => !u.startsWith('file:') && !u.startsWith('data:'))).toEqual([]);
    await page.close();
  }

  it('opens with no console errors or outside requests, every plot visible and drawn', async () => {
    browser(); // fail with the install hint before writing anything
    const file = join(folder, 'report.html');
    writeFileSync(file, renderReportHtml(input));
    await checkReportFile(file, input.figures.length);
  });

  it('shows the report of a real (small) joint fit the same way', async () => {
    browser();
    const config = readRunConfig(writeSmallFitProblem(folder));
    const summary = await runJointFit(config, QUIET);
    await checkReportFile(writeFitReport(config, summary), 5);
  }, 120_000);

  it('parses every plot as a standalone SVG file without XML errors', async () => {
    const page = await browser().newPage();
    for (let i = 0; i < input.figures.length; i++) {
      const file = join(folder, `figure-${i + 1}.svg`);
      writeFileSync(file, input.figures[i].svg);
      await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
      const state = await page.evaluate(() => ({
        root: document.documentElement.tagName,
        parserErrors: document.getElementsByTagName('parsererror').length,
      }));
      expect(state, `figure ${i + 1}`).toEqual({ root: 'svg', parserErrors: 0 });
    }
    await page.close();
  });
});
