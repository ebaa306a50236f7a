import type { Browser, Page } from 'playwright-core';
import { launchBrowser, offLoopback, recordRequestHosts, saveScreenshot, stackUrls } from './support/browser';
import { demoBeforeSnapshot, signInThroughIdp } from './support/demo';

interface FunctionSummary {
  id: string;
  name: string;
  nodes: number;
  edges: number;
  decisions: number;
  cyclomaticStrict: number;
}

/** The demo's oversized `planDispatch`, as the functions table lists it. */
async function planDispatch(page: Page, api: string, snapshotId: string): Promise<FunctionSummary> {
  const res = await page.request.get(`${api}/api/snapshots/${snapshotId}/functions?q=planDispatch`);
  expect(res.status()).toBe(200);
  const { items } = (await res.json()) as { items: FunctionSummary[] };
  const found = items.find((f) => f.name === 'planDispatch');
  if (!found) throw new Error('planDispatch is not in the demo snapshot');
  return found;
}

describe('the Flow screen', () => {
  let browser: Browser;
  const { api } = stackUrls();

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser?.close());

  it('should draw planDispatch, work V(G) out and highlight a chosen basis path, also after a reload', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const hosts = recordRequestHosts(page);

    await signInThroughIdp(page);

    const snapshotId = await demoBeforeSnapshot(page);
    const fn = await planDispatch(page, api, snapshotId);
    const detail = (await (await page.request.get(`${api}/api/snapshots/${snapshotId}/functions/${fn.id}`)).json()) as {
      basisPaths: { blocks: number[] }[];
    };

    await page.goto(`${api}/snapshots/${snapshotId}/functions/${fn.id}`);
    await page.getByRole('heading', { name: 'planDispatch', level: 1 }).waitFor();

    // The graph: one focusable, labelled block per node of the function's graph.
    const blocks = page.locator('svg.graph g[data-block]');
    await blocks.first().waitFor();
    await expect(blocks.count()).resolves.toBe(fn.nodes);
    await expect(page.locator('svg.graph path[data-edge]').count()).resolves.toBe(fn.edges);
    await expect(page.getByRole('button', { name: /^Decision 1, if on line \d+/ }).count()).resolves.toBe(1);

    // V(G) worked out with this function's own numbers, beside the caution.
    await expect(page.getByTestId('formula-graph').textContent()).resolves.toMatch(
      new RegExp(`=\\s*${fn.edges} − ${fn.nodes} \\+ 2×1 = ${fn.cyclomaticStrict}`),
    );
    await expect(page.getByTestId('formula-decisions').textContent()).resolves.toMatch(
      new RegExp(`decisions \\+ 1 = ${fn.decisions} \\+ 1 = ${fn.decisions + 1}`),
    );
    await page.getByText(/V\(G\) is a guide, not a verdict/).waitFor();
    // The source with its decisions marked, or a clear note when the snapshot does not hold it.
    await page.locator('section.source mark.decision').first().or(page.getByText(/does not hold the function's source/)).waitFor();
    await saveScreenshot(page, 'flow');

    // Choosing basis path 2 marks its blocks on the graph and keeps it in the URL.
    await expect(page.locator('svg.graph g.block.on-path').count()).resolves.toBe(0);
    await page.getByRole('radio', { name: 'Path 2', exact: true }).check();
    await page.waitForURL(/[?&]path=2\b/);
    const pathBlocks = new Set(detail.basisPaths[1].blocks).size;
    // The URL changes first and the graph redraws after it: wait for the marks, then count them.
    await page.locator('svg.graph g.block.on-path').first().waitFor();
    await expect(page.locator('svg.graph g.block.on-path').count()).resolves.toBe(pathBlocks);
    await expect(page.locator('svg.graph path.edge.on-path').count()).resolves.toBeGreaterThan(0);
    await page.locator('section.graph').scrollIntoViewIfNeeded();
    await saveScreenshot(page, 'flow-basis-path');

    await page.reload();
    await page.getByRole('heading', { name: 'planDispatch', level: 1 }).waitFor();
    await expect(page.getByRole('radio', { name: 'Path 2', exact: true }).isChecked()).resolves.toBe(true);
    await expect(page.locator('svg.graph g.block.on-path').count()).resolves.toBe(pathBlocks);

    expect(offLoopback(hosts)).toEqual([]);
    await context.close();
  }, 120_000);
});
