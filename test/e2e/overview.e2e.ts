/**
 * The Overview in a real browser against the stack `npm test` starts: an architect sees the
 * invented demo codebase's headline figures, V(G) histogram and top gravity modules, then
 * uploads the demo zip through the upload dialog (into a codebase made for this test) and
 * watches its analysis live until it is ready.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { buildDemoZip } from '../../api/src/demo/demo-zip';
import { launchBrowser, offLoopback, recordRequestHosts, saveScreenshot, stackUrls } from './support/browser';
import { signInThroughIdp } from './support/demo';

interface SnapshotJson {
  id: string;
  status: string;
  totals: { functions: number; cyclomatic: number; decisions: number; overLimit?: number } | null;
}

describe('the Overview', () => {
  const { api } = stackUrls();
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-overview-e2e-'));
  const zip = path.join(tmp, 'otterbay-before.zip');
  const trialName = `overview-e2e-${Date.now()}`;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let hosts: Set<string>;

  beforeAll(async () => {
    await buildDemoZip('before', zip);
    browser = await launchBrowser();
    context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    page = await context.newPage();
    hosts = recordRequestHosts(page);

    await signInThroughIdp(page);
    // A deep link to the screen, as after a reload.
    await page.goto(`${api}/overview`);
    await page.getByRole('heading', { name: 'Overview' }).waitFor();
  });

  afterAll(async () => {
    // Leave the workspace as it was for the other tests: remove the codebase this test made.
    if (page) {
      const list = (await (await page.request.get(`${api}/api/codebases`)).json()) as { items: { id: string; name: string }[] };
      const trial = list.items.find((c) => c.name === trialName);
      const xsrf = (await context.cookies()).find((c) => c.name === 'XSRF-TOKEN')?.value ?? '';
      if (trial) await page.request.delete(`${api}/api/codebases/${trial.id}`, { headers: { 'X-XSRF-TOKEN': xsrf } });
    }
    await browser?.close();
    fs.rmSync(tmp, { recursive: true, force: true });
  });

  it('should show the demo codebase’s headline figures, V(G) histogram and top gravity modules', async () => {
    const list = (await (await page.request.get(`${api}/api/codebases`)).json()) as {
      items: { name: string; snapshots: SnapshotJson[] }[];
    };
    const demo = list.items.find((c) => c.name === 'otterbay-dispatch');
    expect(demo).toBeDefined();
    const latest = demo!.snapshots.find((s) => s.status === 'ready' && s.totals);
    expect(latest).toBeDefined();
    const totals = latest!.totals!;

    const card = page.getByRole('article', { name: 'otterbay-dispatch' });
    const histogram = card.getByRole('table', { name: /Functions by V\(G\) band/ });
    await histogram.waitFor({ state: 'attached' });
    await card.locator('.gravity li').first().waitFor();

    const figure = (label: RegExp) => card.locator('.figure').filter({ has: page.locator('dt', { hasText: label }) }).locator('dd');
    const number = (value: number) => value.toLocaleString('en-US');
    await expect(figure(/^Functions P/).textContent()).resolves.toBe(number(totals.functions));
    await expect(figure(/ΣV\(G\)/).textContent()).resolves.toBe(number(totals.cyclomatic));
    await expect(figure(/Σ decisions/).textContent()).resolves.toBe(number(totals.decisions));
    await expect(figure(/over the limit/).textContent()).resolves.toBe(number(totals.overLimit ?? 0));
    await expect(card.locator('.identity').textContent()).resolves.toContain(`= ${number(totals.functions)} = P`);
    await expect(card.locator('.caution').textContent()).resolves.toContain('rule of thumb');

    // The histogram's bands add up to every function of the snapshot.
    const counts = await histogram.locator('tbody tr td:nth-child(3)').allTextContents();
    expect(counts).toHaveLength(4);
    expect(counts.reduce((sum, text) => sum + Number(text.replace(/,/g, '')), 0)).toBe(totals.functions);
    await expect(card.locator('.gravity li').count()).resolves.toBe(3);
    await expect(card.getByRole('link', { name: 'Functions', exact: true }).first().getAttribute('href')).resolves.toBe(
      `/snapshots/${latest!.id}/functions`,
    );

    await saveScreenshot(page, 'overview');
  });

  it('should upload the demo zip and follow its analysis live until it is ready', async () => {
    await page.getByRole('button', { name: 'Upload a zip' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('combobox', { name: 'Codebase' }).click();
    await page.getByRole('option', { name: 'New codebase…' }).click();
    await dialog.getByRole('textbox', { name: 'Name of the new codebase' }).fill(trialName);
    await dialog.locator('input[type="file"]').setInputFiles(zip);
    await dialog.getByText('otterbay-before.zip').waitFor();
    await dialog.getByRole('textbox', { name: 'Commit (optional)' }).fill('v3.14.0');
    await dialog.getByRole('textbox', { name: 'Branch (optional)' }).fill('main');
    await dialog.getByRole('button', { name: 'Upload' }).click();

    // Queued or analysing, with the phase in words and a progress bar.
    await dialog.getByRole('status').filter({ hasText: /(Queued|Analysing): / }).waitFor({ timeout: 30_000 });
    await expect(dialog.getByRole('progressbar', { name: 'Analysis progress' }).count()).resolves.toBe(1);
    // For the picture: give the analysis a moment to get past 0 % (it may also finish first).
    await dialog.locator('.progress-detail').filter({ hasText: /^\s*[1-9]\d?%/ }).waitFor({ timeout: 15_000 }).catch(() => undefined);
    await saveScreenshot(page, 'overview-upload-progress');

    await dialog.getByText('The snapshot is ready.').waitFor({ timeout: 120_000 });
    const openFunctions = dialog.getByRole('link', { name: 'Open functions' });
    await expect(openFunctions.getAttribute('href')).resolves.toMatch(/^\/snapshots\/[0-9a-f-]+\/functions$/);
    await saveScreenshot(page, 'overview-upload-ready');

    await dialog.getByRole('button', { name: 'Close' }).click();
    const card = page.getByRole('article', { name: trialName });
    await card.getByRole('table', { name: /Functions by V\(G\) band/ }).waitFor({ state: 'attached' });
    await expect(card.locator('sl-snapshot-status-label').first().textContent()).resolves.toContain('ready');

    expect(offLoopback(hosts)).toEqual([]);
  }, 180_000);
});
