import type { Browser } from 'playwright-core';
import { launchBrowser, offLoopback, recordRequestHosts, saveScreenshot, stackUrls } from './support/browser';
import { demoBeforeSnapshot, signInThroughIdp } from './support/demo';

describe('the Gravity screen', () => {
  let browser: Browser;
  const { api } = stackUrls();

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser?.close());

  it('should rank the dispatch core first with its reasons, switch level and keep it on reload', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const hosts = recordRequestHosts(page);

    await signInThroughIdp(page);

    const snapshotId = await demoBeforeSnapshot(page);
    await page.goto(`${api}/snapshots/${snapshotId}/gravity?level=folder`);
    await page.getByRole('heading', { name: 'Gravity', level: 1 }).waitFor();
    const ranking = page.getByRole('list', { name: /Gravity ranking of folders/ });
    const first = ranking.locator('li.module').first();
    await first.waitFor();
    await expect(first.getByRole('heading', { level: 2 }).textContent()).resolves.toMatch(/Rank 1:\s*src\/dispatch-core/);
    const reasons = await first.getByRole('list', { name: 'Why it ranks here' }).getByRole('listitem').allTextContents();
    expect(reasons.length).toBeGreaterThan(0);
    expect(reasons.every((r) => /^\S.*\.$/.test(r.trim()))).toBe(true);
    await expect(first.getByRole('link', { name: /Functions in this module/ }).getAttribute('href')).resolves.toContain(
      `/snapshots/${snapshotId}/functions?module=folder:src%2Fdispatch-core`,
    );
    // The navigation offers the screen for the snapshot in view.
    await page.getByRole('navigation').getByRole('link', { name: 'Gravity' }).waitFor();
    await saveScreenshot(page, 'gravity');

    await page.getByRole('radio', { name: 'file' }).click();
    await page.waitForURL(/[?&]level=file/);
    const files = page.getByRole('list', { name: /Gravity ranking of files/ });
    await expect(files.locator('li.module .path .sl-mono').first().textContent()).resolves.toMatch(/\.[cm]?[jt]sx?$/);

    await page.reload();
    await page.getByRole('list', { name: /Gravity ranking of files/ }).locator('li.module').first().waitFor();
    expect(new URL(page.url()).searchParams.get('level')).toBe('file');
    await expect(page.getByRole('radio', { name: 'file' }).getAttribute('aria-checked')).resolves.toBe('true');

    expect(offLoopback(hosts)).toEqual([]);
    await context.close();
  });
});
