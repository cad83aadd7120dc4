/**
 * The HTML reports in a real browser: Chromium from Debian's packages (/usr/bin/chromium), started
 * headless by playwright-core (never a downloaded browser). Each page written by the built command
 * (`--html FILE`) loads from a file:// URL with no console error, no failed or outgoing request,
 * every plot has its series drawn with a non-empty length on screen, the numbers it embeds equal
 * the command's `--format json`, and dark mode and print restyle it. Skipped, with a message,
 * where /usr/bin/chromium is missing (install it with `apt-get install -y chromium`).
 */
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runBuilt } from '../cli/runBuilt.js';

const CHROMIUM = '/usr/bin/chromium';
const haveChromium = existsSync(CHROMIUM);
if (!haveChromium) {
  console.warn(`test/browser/htmlReport.test.ts skipped: ${CHROMIUM} is missing (apt-get install -y chromium)`);
}

type Browser = import('playwright-core').Browser;

interface PlotInfo {
  id: string;
  series: Array<{ name: string; points: number; length: number; width: number }>;
  bars: number;
  marks: string[];
}

describe.skipIf(!haveChromium)('HTML reports in headless Chromium', () => {
  let browser: Browser;
  let dir: string;

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'dacsmith-html-'));
    const { chromium } = await import('playwright-core');
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      headless: true,
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        // no --user-data-dir: launch() gives the browser a fresh temporary profile of its own
      ],
    });
  });

  afterAll(async () => {
    await browser?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  /** Write the page with the built command, check that it matches the command's JSON, and open it. */
  async function open(name: string, args: string[]) {
    const file = join(dir, `${name}.html`);
    const written = runBuilt([...args, '--html', file]);
    expect(written.stderr).toContain(`HTML report written to ${file}`);
    const json = runBuilt([...args, '--format', 'json']);
    const page = await browser.newPage();
    const problems: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(`console ${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
    page.on('request', (r) => {
      if (!r.url().startsWith('file:')) problems.push(`request: ${r.url()}`);
    });
    page.on('requestfailed', (r) => problems.push(`failed: ${r.url()}`));
    await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
    const plots: PlotInfo[] = await page.evaluate(() =>
      [...document.querySelectorAll('figure.plot')].map((f) => ({
        id: f.getAttribute('data-plot') ?? '',
        series: [...f.querySelectorAll('path.series')].map((p) => ({
          name: p.getAttribute('data-series') ?? '',
          points: Number(p.getAttribute('data-points')),
          length: (p as SVGPathElement).getTotalLength(),
          width: p.getBoundingClientRect().width,
        })),
        bars: [...f.querySelectorAll('rect.bar')].filter((b) => b.getBoundingClientRect().height > 0).length,
        marks: [...f.querySelectorAll('[data-mark]')].map((m) => m.getAttribute('data-mark') ?? ''),
      })),
    );
    const embedded = await page.evaluate(() => JSON.parse(document.getElementById('report-data')?.textContent ?? 'null'));
    expect(embedded).toEqual(JSON.parse(json.stdout));
    return { page, plots, problems };
  }

  const drawn = (p: PlotInfo | undefined) => {
    expect(p).toBeDefined();
    for (const s of p!.series) {
      expect(s.points).toBeGreaterThan(1);
      expect(s.length).toBeGreaterThan(0);
      expect(s.width).toBeGreaterThan(0);
    }
  };

  it('analyze: the greenhouse sample with its five plots, in light, dark and print', async () => {
    const { page, plots, problems } = await open('analyze', ['analyze', 'sample-configs/greenhouse-heater.yaml']);
    expect(problems).toEqual([]);
    expect(plots.map((p) => p.id)).toEqual(['steady', 'step', 'step-zoom', 'magnitude', 'dc-error']);
    for (const p of plots) {
      expect(p.series).toHaveLength(1);
      drawn(p);
    }
    const magnitude = plots.find((p) => p.id === 'magnitude')!;
    expect(magnitude.marks.map((m) => m.split(' ')[0])).toEqual(['cutoff', 'PWM']);
    expect(plots.find((p) => p.id === 'step')!.marks[0]).toMatch(/^settled /);
    const background = () => page.evaluate(() => getComputedStyle(document.body).backgroundColor);
    await page.emulateMedia({ colorScheme: 'light' });
    expect(await background()).toBe('rgb(255, 255, 255)');
    await page.emulateMedia({ colorScheme: 'dark' });
    expect(await background()).toBe('rgb(22, 25, 29)');
    const stroke = () => page.evaluate(() => getComputedStyle(document.querySelector('path.series')!).stroke);
    const darkStroke = await stroke();
    await page.emulateMedia({ media: 'print', colorScheme: 'dark' });
    expect(await background()).toBe('rgb(255, 255, 255)');
    // print draws the light palette whatever the reader's preference
    await page.emulateMedia({ media: 'screen', colorScheme: 'light' });
    const lightStroke = await stroke();
    expect(lightStroke).not.toBe(darkStroke);
    await page.emulateMedia({ media: 'print', colorScheme: 'dark' });
    expect(await stroke()).toBe(lightStroke);
    await page.close();
  });

  it('design: the trade-off with one line per stage count', async () => {
    const { page, plots, problems } = await open('design', ['design', 'sample-configs/design-tight-ripple.yaml', '--top', '3']);
    expect(problems).toEqual([]);
    expect(plots.map((p) => p.id)).toEqual(['tradeoff']);
    expect(plots[0].series.map((s) => s.name)).toEqual(['1 stage', '2 stages']);
    drawn(plots[0]);
    await page.close();
  });

  it('tolerance: three histograms with their bars', async () => {
    const { page, plots, problems } = await open('tolerance', ['tolerance', 'sample-configs/tolerance-fan-reference.yaml', '--samples', '500', '--seed', '3', '--workers', '1']);
    expect(problems).toEqual([]);
    expect(plots.map((p) => p.id)).toEqual(['mc-ripple', 'mc-droop', 'mc-settling']);
    for (const p of plots) expect(p.bars).toBeGreaterThan(0);
    expect(plots[0].marks[0]).toMatch(/^limit /);
    await page.close();
  });

  it('compare: both overlays with base and head', async () => {
    const { page, plots, problems } = await open('compare', ['compare', 'sample-configs/greenhouse-heater.yaml', 'sample-configs/motor-current-ref.yaml']);
    expect(problems).toEqual([]);
    expect(plots.map((p) => p.id)).toEqual(['compare-steady', 'compare-step']);
    for (const p of plots) {
      expect(p.series).toHaveLength(2);
      drawn(p);
    }
    await page.close();
  });
});
