import type { Page } from 'playwright-core';
import { stackUrls } from './browser';

interface SnapshotSummary {
  id: string;
  status: string;
  commit?: string | null;
  root?: string | null;
  createdAt: string;
}

/**
 * Signs in through the identity-provider fake as one of its people (the demo architect unless
 * told), from the sign-in screen to the Overview.
 */
export async function signInThroughIdp(page: Page, person: RegExp = /Tomás Reyes/): Promise<void> {
  const { api, idp } = stackUrls();
  await page.goto(`${api}/`);
  await page.getByRole('button', { name: 'Sign in with SSO' }).click();
  await page.waitForURL(`${idp}/**`);
  await page.getByRole('button', { name: person }).click();
  await page.waitForURL('**/overview');
}

/** The invented demo's "before" snapshot (3.14) of `otterbay-dispatch`, else its oldest ready one. */
export async function demoBeforeSnapshot(page: Page): Promise<string> {
  const res = await page.request.get(`${stackUrls().api}/api/codebases`);
  expect(res.status()).toBe(200);
  const { items } = (await res.json()) as { items: { name: string; snapshots: SnapshotSummary[] }[] };
  const ready = (items.find((c) => c.name === 'otterbay-dispatch')?.snapshots ?? []).filter((s) => s.status === 'ready');
  const before =
    ready.find((s) => s.root === 'otterbay-before' || s.commit === 'v3.14.0') ??
    [...ready].sort((a, b) => a.createdAt.localeCompare(b.createdAt))[0];
  if (!before) throw new Error('the demo codebase otterbay-dispatch has no ready snapshot');
  return before.id;
}
