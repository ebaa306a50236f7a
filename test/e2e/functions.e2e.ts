import * as fs from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, offLoopback, recordRequestHosts, saveScreenshot, stackUrls } from './support/browser';
import { demoBeforeSnapshot, signInThroughIdp } from './support/demo';

/** The text of each cell of one column of the functions table (1-based column). */
function columnTexts(page: Page, column: number): Promise<string[]> {
  return page.locator(`table tbody tr td:nth-child(${column})`).allTextContents().then((all) => all.map((t) => t.trim()));
}

/** Waits until the URL carries `name=value` (value null: the parameter is absent). */
async function waitForParam(page: Page, name: string, value: string | null): Promise<void> {
  await page.waitForFunction(([n, v]) => new URL(window.location.href).searchParams.get(n) === v, [name, value] as const);
}

/** Waits until no page request is on its way. */
async function settled(page: Page): Promise<void> {
  await page.locator('table[aria-busy="false"]').waitFor();
}

describe('the Functions screen', () => {
  let browser: Browser;
  const { api } = stackUrls();

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser?.close());

  it('should sort, filter and page on the server, keep the place on reload and export the rows as CSV', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
    const page = await context.newPage();
    const hosts = recordRequestHosts(page);

    await signInThroughIdp(page);

    const snapshotId = await demoBeforeSnapshot(page);
    await page.goto(`${api}/snapshots/${snapshotId}/functions`);
    await page.getByRole('heading', { name: 'Functions', level: 1 }).waitFor();
    await page.locator('table tbody tr').first().waitFor();
    await settled(page);
    await expect(page.locator('.caution').textContent()).resolves.toMatch(/Limit 10 — a rule of thumb, not a verdict/);
    await page.getByRole('navigation').getByRole('link', { name: 'Functions' }).waitFor();

    // Sort by name first, then by V(G): a figure column starts highest first.
    await page.getByRole('button', { name: 'Function', exact: true }).click();
    await waitForParam(page, 'sort', 'name');
    await settled(page);
    await page.getByRole('button', { name: 'V(G)', exact: true }).click();
    // V(G) highest first is the screen's default order, so the URL drops it.
    await waitForParam(page, 'sort', null);
    await settled(page);
    const names = await columnTexts(page, 1);
    expect(names[0]).toBe('planDispatch');
    const figures = (await columnTexts(page, 3)).map((t) => Number.parseInt(t, 10));
    expect(figures).toEqual([...figures].sort((a, b) => b - a));
    await expect(page.locator('th[aria-sort="descending"]').textContent()).resolves.toContain('V(G)');
    await saveScreenshot(page, 'functions');

    // Filter by text (debounced) and by band.
    await page.getByLabel('Search name or file').fill('dispatch');
    await waitForParam(page, 'q', 'dispatch');
    await settled(page);
    const files = await columnTexts(page, 2);
    const functionNames = await columnTexts(page, 1);
    expect(files.length).toBeGreaterThan(0);
    files.forEach((file, i) => expect(`${functionNames[i]} ${file}`.toLowerCase()).toContain('dispatch'));
    await page.getByRole('option', { name: /^calm/ }).click();
    await waitForParam(page, 'band', 'calm');
    await settled(page);
    const bandColumn = (await page.locator('table thead th').allTextContents()).findIndex((t) => t.trim() === 'Band') + 1;
    const bands = await columnTexts(page, bandColumn);
    expect(bands.length).toBeGreaterThan(0);
    expect(new Set(bands)).toEqual(new Set(['calm']));

    // Page 2 of the filtered rows.
    const range = page.locator('.mat-mdc-paginator-range-label');
    const total = Number((await range.textContent())?.match(/of (\d+)/)?.[1]);
    expect(total).toBeGreaterThan(50);
    await page.getByRole('button', { name: 'Next page' }).click();
    await waitForParam(page, 'page', '2');
    await settled(page);
    await expect(range.textContent()).resolves.toMatch(new RegExp(`51 – ${Math.min(100, total)} of ${total}`));
    const pageTwo = await columnTexts(page, 1);
    await page.mouse.move(0, 0); // no paginator tooltip in the picture
    await saveScreenshot(page, 'functions-filtered');

    // A reload keeps sort, filters and page.
    await page.reload();
    await page.locator('table tbody tr').first().waitFor();
    await settled(page);
    const params = new URL(page.url()).searchParams;
    expect([params.get('q'), params.get('band'), params.get('page'), params.get('sort')]).toEqual(['dispatch', 'calm', '2', null]);
    await expect(page.locator('th[aria-sort="descending"]').textContent()).resolves.toContain('V(G)');
    await expect(page.getByLabel('Search name or file').inputValue()).resolves.toBe('dispatch');
    await expect(page.getByRole('option', { name: /^calm/ }).getAttribute('aria-selected')).resolves.toBe('true');
    await expect(range.textContent()).resolves.toMatch(new RegExp(`51 – ${Math.min(100, total)} of ${total}`));
    await expect(columnTexts(page, 1)).resolves.toEqual(pageTwo);

    // CSV of every filtered row, built in the browser.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^functions-.+-filtered\.csv$/);
    const csv = fs.readFileSync(await download.path(), 'utf8').replace(/^\uFEFF/, '');
    const lines = csv.split('\r\n');
    expect(lines[0]).toMatch(/^id,qualifiedName,kind,file,line,endLine,cyclomatic,essential,decisions,loc,band,overLimit,cluster/);
    expect(lines.at(-1)).toBe('');
    expect(lines).toHaveLength(total + 2);
    const bandIndex = lines[0].split(',').indexOf('band');
    expect(lines.slice(1, -1).every((line) => line.split(',')[bandIndex] === 'calm')).toBe(true);

    expect(offLoopback(hosts)).toEqual([]);
    await context.close();
  }, 120_000);
});
