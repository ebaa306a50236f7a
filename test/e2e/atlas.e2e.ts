import * as fs from 'node:fs';
import * as zlib from 'node:zlib';
import type { Browser } from 'playwright-core';
import { launchBrowser, offLoopback, recordRequestHosts, saveScreenshot, stackUrls } from './support/browser';
import { demoBeforeSnapshot, signInThroughIdp } from './support/demo';

/** Pixel size and the number of distinct RGBA colours of an 8-bit, non-interlaced RGBA or RGB PNG. */
function pngColours(png: Buffer): { width: number; height: number; colours: number; inkShare: number } {
  expect(png.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
  let offset = 8;
  let width = 0;
  let height = 0;
  let channels = 4;
  const data: Buffer[] = [];
  while (offset < png.length) {
    const length = png.readUInt32BE(offset);
    const type = png.toString('ascii', offset + 4, offset + 8);
    const body = png.subarray(offset + 8, offset + 8 + length);
    if (type === 'IHDR') {
      width = body.readUInt32BE(0);
      height = body.readUInt32BE(4);
      expect(body[8]).toBe(8); // bit depth
      expect(body[12]).toBe(0); // not interlaced
      channels = body[9] === 6 ? 4 : 3;
    }
    if (type === 'IDAT') data.push(body);
    offset += 12 + length;
  }
  const raw = zlib.inflateSync(Buffer.concat(data));
  const stride = width * channels;
  const rows = Buffer.alloc(stride * height);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)];
    for (let x = 0; x < stride; x++) {
      const value = raw[y * (stride + 1) + 1 + x];
      const left = x >= channels ? rows[y * stride + x - channels] : 0;
      const up = y > 0 ? rows[(y - 1) * stride + x] : 0;
      const upLeft = x >= channels && y > 0 ? rows[(y - 1) * stride + x - channels] : 0;
      const p = left + up - upLeft;
      const [pa, pb, pc] = [Math.abs(p - left), Math.abs(p - up), Math.abs(p - upLeft)];
      const paeth = pa <= pb && pa <= pc ? left : pb <= pc ? up : upLeft;
      const predictor = [0, left, up, (left + up) >> 1, paeth][filter];
      rows[y * stride + x] = (value + predictor) & 0xff;
    }
  }
  const colours = new Set<string>();
  let ink = 0;
  for (let i = 0; i < rows.length; i += channels) {
    const key = rows.subarray(i, i + channels).toString('hex');
    colours.add(key);
    if (!key.startsWith('ffffff')) ink += 1;
  }
  return { width, height, colours: colours.size, inkShare: ink / (width * height) };
}

describe('the Atlas screen', () => {
  let browser: Browser;
  const { api } = stackUrls();

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser?.close());

  it('should draw the module map, find the dispatch core, switch level and export a PNG that is not blank', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
    const page = await context.newPage();
    const hosts = recordRequestHosts(page);
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));

    await signInThroughIdp(page);

    const snapshotId = await demoBeforeSnapshot(page);
    const graph = await page.request.get(`${api}/api/snapshots/${snapshotId}/module-graph?level=folder`);
    expect(graph.status()).toBe(200);
    const core = ((await graph.json()) as { nodes: { id: string; path: string }[] }).nodes.find((n) => n.path === 'src/dispatch-core');
    expect(core).toBeDefined();
    // The map carries a few figures per module; the side panel fetches the rest.
    const detail = await page.request.get(`${api}/api/snapshots/${snapshotId}/modules/${encodeURIComponent(core!.id)}`);
    expect(detail.status()).toBe(200);
    const coreGravity = ((await detail.json()) as { module: { gravity: number } }).module.gravity;

    await page.goto(`${api}/snapshots/${snapshotId}/atlas?level=folder`);
    await page.getByRole('heading', { name: 'Atlas', level: 1 }).waitFor();
    await page.locator('.map canvas').first().waitFor();
    // The layout runs in a web worker (allowed by the page's CSP) and settles.
    const status = page.locator('p.status');
    await expect(status.textContent()).resolves.toMatch(/\d+ of \d+ modules/);
    await page.waitForFunction(() => /kept for your next visit|last visit/.test(document.querySelector('p.status')?.textContent ?? ''), null, {
      timeout: 40_000,
    });
    const legend = await page.getByRole('region', { name: 'Legend' }).getByRole('listitem').allTextContents();
    expect(legend.length).toBeGreaterThan(1);
    await page.getByRole('navigation').getByRole('link', { name: 'Atlas' }).waitFor();
    await saveScreenshot(page, 'atlas');

    // Search with suggestions; choosing one selects it and opens the side panel.
    await page.getByLabel('Find a module').fill('dispatch-core');
    await page.locator('mat-option', { hasText: 'src/dispatch-core' }).first().click();
    const panel = page.locator('sl-module-details');
    await expect(panel.getByRole('heading', { level: 2 }).textContent()).resolves.toContain('src/dispatch-core');
    const gravity = coreGravity.toLocaleString('en-US', { maximumFractionDigits: 1 });
    await panel.locator('.gravity', { hasText: gravity }).waitFor();
    await panel.locator('.reasons li').first().waitFor();
    await expect(panel.getByRole('link', { name: /Functions in this module/ }).getAttribute('href')).resolves.toContain(
      `/snapshots/${snapshotId}/functions?module=folder:src%2Fdispatch-core`,
    );
    await expect(
      page.getByRole('listbox', { name: /Modules/ }).locator('[aria-selected="true"]').textContent(),
    ).resolves.toContain('src/dispatch-core');
    await page.waitForTimeout(600); // the camera glides to the module
    await saveScreenshot(page, 'atlas-selected');

    // A deep link keeps the selection, and the map keeps its positions (no new layout).
    expect(page.url()).toContain('focus=folder:src%2Fdispatch-core');
    await page.reload();
    await expect(page.locator('sl-module-details').getByRole('heading', { level: 2 }).textContent()).resolves.toContain(
      'src/dispatch-core',
    );
    await page.waitForFunction(() => (document.querySelector('p.status')?.textContent ?? '').includes('Same layout as your last visit'));

    // File level.
    await page.locator('mat-button-toggle', { hasText: /^\s*file\s*$/ }).locator('button').click();
    await page.waitForURL(/level=file/);
    expect(page.url()).not.toContain('focus=');
    await page.locator('.map canvas').first().waitFor();
    await page.waitForFunction(() => /kept for your next visit|last visit/.test(document.querySelector('p.status')?.textContent ?? ''), null, {
      timeout: 40_000,
    });

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export PNG' }).click()]);
    expect(download.suggestedFilename()).toBe('atlas-file.png');
    const png = pngColours(fs.readFileSync((await download.path())!));
    expect(png.width).toBeGreaterThan(200);
    expect(png.height).toBeGreaterThan(200);
    // Not blank: many colours (clusters, links, anti-aliased labels) and a fair share of ink.
    expect(png.colours).toBeGreaterThan(20);
    expect(png.inkShare).toBeGreaterThan(0.005);

    expect(errors).toEqual([]);
    expect(offLoopback(hosts)).toEqual([]);
    await context.close();
  }, 120_000);
});
