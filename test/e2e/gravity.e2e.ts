import type { Browser, Page } from 'playwright-core';
import { launchBrowser, recordRequestHosts, saveScreenshot, stackUrls } from './support/browser';

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '[::1]', '::1']);

interface SnapshotSummary {
  id: string;
  status: string;
  root?: string | null;
  createdAt: string;
}

/** The demo's "before" snapshot: the oldest ready snapshot of `otterbay-dispatch`. */
async function demoBeforeSnapshot(page: Page, api: string): Promise<string> {
  const res = await page.request.get(`${api}/api/codebases`);
  expect(res.status()).toBe(200);
  const { items } = (await res.json()) as { items: { name: string; snapshots: SnapshotSummary[] }[] };
  const demo = items.find((c) => c.name === 'otterbay-dispatch');
  const ready = (demo?.snapshots ?? []).filter((s) => s.status === 'ready');
  const before = ready.find((s) => s.root === 'otterbay-before') ?? [...ready].sort((a, b) => a.createdAt.localeCompare(b.createdAt))[0];
  if (!before) throw new Error('the demo codebase otterbay-dispatch has no ready snapshot');
  return before.id;
}

describe('the Gravity screen', () => {
  let browser: Browser;
  const { api, idp } = stackUrls();

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser?.close());

  it('should rank the dispatch core first with its reasons, switch level and keep it on reload', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const hosts = recordRequestHosts(page);

    await page.goto(`${api}/`);
    await page.getByRole('button', { name: 'Sign in with SSO' }).click();
    await page.waitForURL(`${idp}/**`);
    await page.getByRole('button', { name: /Tomás Reyes/ }).click();
    await page.waitForURL('**/overview');

    const snapshotId = await demoBeforeSnapshot(page, api);
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

    expect([...hosts].filter((h) => !LOOPBACK.has(h))).toEqual([]);
    await context.close();
  });
});
