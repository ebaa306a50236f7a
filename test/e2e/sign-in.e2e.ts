import type { Browser } from 'playwright-core';
import { DEMO_PEOPLE, DEMO_WORKSPACE } from '../../api/src/demo/demo-people';
import { launchBrowser, offLoopback, recordRequestHosts, saveScreenshot, stackUrls } from './support/browser';

describe('signing in through the identity-provider fake', () => {
  let browser: Browser;
  const { api } = stackUrls();

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser?.close());

  for (const person of DEMO_PEOPLE) {
    it(`should bring ${person.displayName} (${person.role}) to Overview and sign out again`, async () => {
      const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
      const page = await context.newPage();
      const hosts = recordRequestHosts(page);

      await page.goto(`${api}/`);
      await page.waitForURL('**/sign-in');
      const signIn = page.getByRole('button', { name: 'Sign in with SSO' });
      await signIn.waitFor();
      if (person.role === 'owner') await saveScreenshot(page, 'sign-in');
      await signIn.click();

      // The identity-provider fake: its own page, on its own loopback port.
      await page.waitForURL(`${stackUrls().idp}/**`);
      if (person.role === 'owner') await saveScreenshot(page, 'identity-provider-fake');
      await page.getByRole('button', { name: new RegExp(person.displayName) }).click();

      await page.waitForURL('**/overview');
      await page.getByRole('heading', { name: 'Overview', exact: true }).waitFor();
      const toolbar = page.locator('mat-toolbar');
      await expect(toolbar.textContent()).resolves.toContain(DEMO_WORKSPACE.name);
      await expect(toolbar.textContent()).resolves.toContain(person.displayName);
      await expect(toolbar.textContent()).resolves.toContain(person.role);
      // Without a snapshot in view only the Overview is a link; the snapshot screens wait, disabled.
      const nav = page.getByRole('navigation', { name: 'Screens' });
      await expect(nav.getByRole('link').allTextContents()).resolves.toEqual([expect.stringContaining('Overview')]);
      await expect(nav.locator('a[aria-disabled="true"]').allTextContents()).resolves.toEqual([
        expect.stringContaining('Atlas'), expect.stringContaining('Functions'), expect.stringContaining('Gravity'),
      ]);
      // The workspace's codebases, or a clear empty state (other end-to-end tests upload into this workspace).
      await page.getByText(/No codebases yet/).or(page.getByRole('table')).first().waitFor();
      await saveScreenshot(page, `overview-${person.role}`);

      // A deep link survives a reload.
      await page.reload();
      await page.getByRole('heading', { name: 'Overview', exact: true }).waitFor();
      expect(new URL(page.url()).pathname).toBe('/overview');

      await page.getByRole('button', { name: /sign out/i }).click();
      await page.waitForURL('**/sign-in');
      const me = await page.request.get(`${api}/api/me`);
      expect(me.status()).toBe(401);

      expect(offLoopback(hosts)).toEqual([]);
      await context.close();
    });
  }
});
