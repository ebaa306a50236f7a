import * as fs from 'node:fs';
import * as path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

/** Where `npm test` started the end-to-end stack (set by scripts/test.mjs). */
export function stackUrls() {
  const api = process.env['SEAMLINE_E2E_URL'];
  const idp = process.env['SEAMLINE_E2E_IDP_URL'];
  if (!api || !idp) throw new Error('The end-to-end stack is not running: run the tests through `npm test`.');
  return { api, idp, screenshots: process.env['SEAMLINE_E2E_SCREENSHOTS'] ?? path.resolve('test-results/screenshots') };
}

/** Debian's Chromium, headless, with the flags that keep it off the network. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
      '--disable-sync', '--no-first-run', '--disable-quic'],
  });
}

/** Saves a full-page screenshot under test-results/screenshots for a person to look at. */
export async function saveScreenshot(page: Page, name: string): Promise<string> {
  const dir = stackUrls().screenshots;
  fs.mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Records the host of every request a page makes, so a test can assert none leaves loopback. */
export function recordRequestHosts(page: Page): Set<string> {
  const hosts = new Set<string>();
  page.on('request', (req) => {
    const url = new URL(req.url());
    if (url.protocol === 'http:' || url.protocol === 'https:' || url.protocol === 'ws:' || url.protocol === 'wss:') hosts.add(url.hostname);
  });
  return hosts;
}

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '[::1]', '::1']);

/** The recorded hosts that are not this machine (a page must fetch nothing from outside). */
export function offLoopback(hosts: Set<string>): string[] {
  return [...hosts].filter((h) => !LOOPBACK.has(h));
}
