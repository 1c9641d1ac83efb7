/**
 * `verify --report FILE.html` draws the error: the page is opened in headless
 * Chromium (playwright-core, TOOLCHAIN.md), a screenshot is taken and must
 * not be blank (its pixels vary), and the SVG must hold the data path, the
 * certified-bound and target lines, and the axis labels. One input gives one
 * plot; three inputs give one plot per input. A segmented plan draws its
 * segment edges as vertical lines, equally spaced (the segments are equal,
 * DESIGN.md 1.5); a plan without segments draws none. The page must load
 * nothing from the network.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';
import { reportHtml } from '../../src/verify/report/html.js';
import { REPO, ensureBuilt, removeTempDirs, runBuilt, tempDir } from './support/cli.js';

const ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

let context: BrowserContext;

/** Mean and variance of the grey level of a PNG, computed in the page with a canvas. */
async function pixelStats(png: Buffer): Promise<{ mean: number; variance: number }> {
  const page = await context.newPage();
  try {
    return await page.evaluate(async (b64: string) => {
      const img = new Image();
      img.src = `data:image/png;base64,${b64}`;
      await img.decode();
      const canvas = document.createElement('canvas');
      canvas.width = img.width;
      canvas.height = img.height;
      const g = canvas.getContext('2d')!;
      g.drawImage(img, 0, 0);
      const d = g.getImageData(0, 0, img.width, img.height).data;
      let sum = 0;
      let sq = 0;
      const n = d.length / 4;
      for (let i = 0; i < d.length; i += 4) {
        const y = (d[i]! + d[i + 1]! + d[i + 2]!) / 3;
        sum += y;
        sq += y * y;
      }
      const mean = sum / n;
      return { mean, variance: sq / n - mean * mean };
    }, png.toString('base64'));
  } finally {
    await page.close();
  }
}

describe('verify --report draws the measured error', () => {
  beforeAll(async () => {
    ensureBuilt();
    context = await chromium.launchPersistentContext(tempDir('chromium-profile'), { executablePath: '/usr/bin/chromium', headless: true, args: ARGS });
  }, 120_000);
  afterAll(async () => {
    await context?.close();
    removeTempDirs();
  });

  async function openReport(spec: string, samples: number): Promise<{ html: string; file: string; shot: string; requests: string[]; page: Awaited<ReturnType<BrowserContext['newPage']>> }> {
    const dir = tempDir('report');
    const file = join(dir, 'error.html');
    const r = await runBuilt(['verify', spec, '--target', 'ts', '--samples', String(samples), '--report', file]);
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: '' });
    const html = readFileSync(file, 'utf8');
    const page = await context.newPage();
    const requests: string[] = [];
    page.on('request', (q) => {
      if (!q.url().startsWith('file:')) requests.push(q.url());
    });
    await page.goto(`file://${file}`);
    const shot = join(dir, 'error.png');
    writeFileSync(shot, await page.screenshot({ fullPage: true }));
    return { html, file, shot, requests, page };
  }

  test('one input: error against R with the bound and target lines and labelled axes', async () => {
    const { html, shot, requests, page } = await openReport('examples/kiln-probe.yaml', 2000);
    // Self-contained: no scripts, no external references of any kind.
    expect(html).not.toMatch(/<script|<link|<img|src=|href=|@import|url\(/);
    expect(requests).toEqual([]);
    expect(await page.locator('svg.error-plot').count()).toBe(1);
    const d = await page.locator('svg path.data').getAttribute('d');
    expect((d ?? '').split(/[ML]/).filter((s) => s.trim() !== '').length).toBeGreaterThan(100);
    expect(await page.locator('svg line.bound').count()).toBe(1);
    expect(await page.locator('svg line.target').count()).toBe(1);
    expect(await page.locator('svg text.x-label').textContent()).toBe('R');
    expect(await page.locator('svg text.y-label').textContent()).toBe('absolute error');
    // The bound (7.4e-4) lies below the target (1e-3): in SVG, a larger error is higher up, so a smaller y.
    const y = async (cls: string): Promise<number> => Number(await page.locator(`svg line.${cls}`).getAttribute('y1'));
    expect(await y('bound')).toBeGreaterThan(await y('target'));
    expect(await page.locator('svg circle.worst').count()).toBe(1);
    // kiln-probe is planned as one box: no segment edges.
    expect(await page.locator('svg line.segment-edge').count()).toBe(0);
    await page.close();
    const stats = await pixelStats(readFileSync(shot));
    expect(stats.variance).toBeGreaterThan(100);
    expect(existsSync(shot)).toBe(true);
  }, 120_000);

  test('a segmented plan (spring-scale): one vertical line per segment edge, equally spaced across the plot', async () => {
    const { html, shot, page } = await openReport('examples/spring-scale.yaml', 1000);
    expect(html).toContain('the segment edges');
    const frame = page.locator('svg rect.frame');
    const left = Number(await frame.getAttribute('x'));
    const width = Number(await frame.getAttribute('width'));
    const lines = page.locator('svg line.segment-edge');
    const n = await lines.count();
    expect(n).toBeGreaterThan(1);
    // K equal segments of F in [0, 200] have K - 1 edges at left + width * j / K; px() prints one decimal.
    const xs = await lines.evaluateAll((els) => els.map((e) => [Number(e.getAttribute('x1')), Number(e.getAttribute('x2'))]));
    const off = xs.flatMap(([x1, x2], j) => {
      const want = left + (width * (j + 1)) / (n + 1);
      return x1 === x2 && Math.abs(x1! - want) <= 0.06 ? [] : [`edge ${j}: x1 ${x1}, x2 ${x2}, expected ${want.toFixed(2)} (tolerance 0.06 px)`];
    });
    expect(off).toEqual([]);
    await page.close();
    const stats = await pixelStats(readFileSync(shot));
    expect(stats.variance).toBeGreaterThan(100);
  }, 120_000);

  test('three inputs: one plot of the worst error per input', async () => {
    const { shot, page } = await openReport('examples/lens-undistort.yaml', 1500);
    expect(await page.locator('svg.error-plot').count()).toBe(3);
    expect(await page.locator('svg text.x-label').allTextContents()).toEqual(['rd', 'k1', 'k2']);
    expect(await page.locator('svg path.data').count()).toBe(3);
    expect(await page.locator('svg line.bound').count()).toBe(3);
    expect(await page.locator('svg line.target').count()).toBe(3);
    expect(await page.locator('svg text.y-label').first().textContent()).toBe('worst absolute error');
    await page.close();
    const stats = await pixelStats(readFileSync(shot));
    expect(stats.variance).toBeGreaterThan(100);
  }, 120_000);

  test('1024 segments: the edges become ticks under the plot, and the plot area stays mostly white (no striped block)', async () => {
    // Invented data: an error curve over [0, 1] cut into 1024 equal segments, as a wide segmented plan would give.
    const edges = Array.from({ length: 1023 }, (_, j) => (j + 1) / 1024);
    const points = Array.from({ length: 4000 }, (_, i) => ({ at: [i / 3999], error: 2e-5 * (1 + Math.sin(i / 50) ** 2) }));
    const html = reportHtml({
      functionName: 'demo_wide',
      spec: 'demo-wide.yaml',
      arithmetic: 'float32',
      kind: 'absolute',
      bound: 8.5e-5,
      target: 1e-4,
      inputs: [{ name: 'u', lo: 0, hi: 1 }],
      edges: [edges],
      points,
      checks: [],
    });
    const dir = tempDir('report-1024');
    const file = join(dir, 'wide.html');
    writeFileSync(file, html);
    const page = await context.newPage();
    await page.goto(`file://${file}`);
    expect(await page.locator('svg line.segment-edge').count()).toBe(0);
    const ticks = (await page.locator('svg path.segment-edge-ticks').getAttribute('d')) ?? '';
    expect(ticks.split('M').length - 1).toBe(1023);
    const frame = page.locator('svg rect.frame');
    const box = (await frame.boundingBox())!;
    const shot = await page.screenshot({ clip: { x: box.x + 2, y: box.y + 2, width: box.width - 4, height: box.height - 4 } });
    writeFileSync(join(dir, 'wide-plot.png'), shot);
    if (process.env['ROOTCAST_KEEP_SHOT']) writeFileSync(process.env['ROOTCAST_KEEP_SHOT'], await page.screenshot({ fullPage: true }));
    await page.close();
    // Inside the frame: the data line, the bound and target lines and a few grid lines; with 1023 full-height
    // dashed edges (the old drawing) more than half the pixels were grey.
    const stats = await pixelStats(shot);
    expect(stats.mean).toBeGreaterThan(235);
    expect(stats.variance).toBeGreaterThan(10);
  }, 120_000);

  test('the report is the same bytes for the same run, and is not written when the spec is refused', async () => {
    const dir = tempDir('report-same');
    const [a, b] = [join(dir, 'a.html'), join(dir, 'b.html')];
    await runBuilt(['verify', 'examples/kiln-probe.yaml', '--target', 'ts', '--samples', '500', '--report', a]);
    await runBuilt(['verify', 'examples/kiln-probe.yaml', '--target', 'ts', '--samples', '500', '--report', b]);
    expect(readFileSync(a, 'utf8')).toBe(readFileSync(b, 'utf8'));
    const refused = join(dir, 'refused.html');
    const r = await runBuilt(['verify', join(REPO, 'test/fixtures/broken/degree-zero.yaml'), '--report', refused]);
    expect(r.code).toBe(2);
    expect(existsSync(refused)).toBe(false);
  }, 120_000);
});
