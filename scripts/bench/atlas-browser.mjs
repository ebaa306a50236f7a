// The Atlas in a real browser (issue targets: first frame of a 20,000-module / 60,000-edge map
// under 3 s; no main-thread task over 200 ms while the layout runs). Stores two generated
// snapshots — 2,000 and 20,000 file modules, about three links per module — starts the compiled
// API serving the built web app, and opens each map at file level in Debian's Chromium (headless,
// so WebGL is drawn in software) in a fresh browser profile each time, so no saved positions
// exist and the layout runs. Times come from the page itself: the Atlas's User Timing marks
// (web/src/app/atlas/atlas-timing.ts), the module graph's Resource Timing entry and the Long
// Tasks API, all measured from the start of navigation.
// Run through `SEAMLINE_BENCH_PART=atlas npm run bench` (which builds the server and web app first).
import * as fs from 'node:fs';
import { createRequire } from 'node:module';
import * as path from 'node:path';
import { median, ownerSession, progress, queuedSnapshot, root, runPart, serverModule, WEB_DIST } from './server-harness.mjs';
import { ensureSystemPackages } from '../lib/system-packages.mjs';

const require = createRequire(import.meta.url);
const { chromium } = require('playwright-core');
const { generateSnapshot } = require('./synthetic-snapshot.cjs');

const TARGETS = { firstFrameMs: 3000, longestLayoutTaskMs: 200 };
/** Later visits measured per map (the first visit, which builds the server's answer, is reported apart). */
const VISITS = Math.max(1, Math.min(5, Number(process.env.SEAMLINE_BENCH_ROUNDS ?? 3)));
/** Maps by file-module count: ten files per folder, ten folders per package; three functions per file. */
const SIZES = process.env.SEAMLINE_BENCH_ATLAS_MODULES?.split(',').map(Number) ?? [2_000, 20_000];
const MAPS = SIZES.map((files) => ({
  files,
  shape: { packages: files / 100, foldersPerPackage: 10, filesPerFolder: 10, functions: files * 3, callsPerFunction: 1.16, seed: `atlas-${files}` },
}));

/**
 * SEAMLINE_BENCH_PROFILE=1 also writes the main thread's CPU profile of each map's last visit
 * next to the results (open it in the browser's performance panel; build the web app with
 * SEAMLINE_BENCH_WEB_CONFIG=development for readable function names).
 */
const PROFILE = process.env.SEAMLINE_BENCH_PROFILE === '1';
/**
 * The flags the end-to-end tests use (`--disable-gpu`: software compositing, so every frame with
 * a WebGL canvas is read back to the main thread); SEAMLINE_BENCH_GPU_COMPOSITING=1 composites
 * on SwiftShader instead, closer to a browser with a graphics card.
 */
const GPU_FLAGS = process.env.SEAMLINE_BENCH_GPU_COMPOSITING === '1' ? ['--enable-unsafe-swiftshader'] : ['--disable-gpu'];

/** What one visit measured (ms from the start of navigation). */
async function visit(browser, base, cookie, snapshotId, screenshot, profileFile) {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  try {
    await context.addCookies([{ ...cookie, url: base }]);
    await context.addInitScript(() => {
      window.__seamlineLongTasks = [];
      new PerformanceObserver((list) => {
        for (const e of list.getEntries()) window.__seamlineLongTasks.push({ start: e.startTime, duration: e.duration });
      }).observe({ type: 'longtask', buffered: true });
    });
    const page = await context.newPage();
    const cdp = profileFile ? await context.newCDPSession(page) : null;
    if (cdp) {
      await browser.startTracing(page, { path: profileFile.replace(/\.cpuprofile$/, '.trace.json'), categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'blink', 'gpu', 'cc', 'v8'] });
      await cdp.send('Profiler.enable');
      await cdp.send('Profiler.setSamplingInterval', { interval: 500 });
      await cdp.send('Profiler.start');
    }
    const errors = [];
    page.on('pageerror', (err) => errors.push(err.message));
    await page.goto(`${base}/snapshots/${snapshotId}/atlas?level=file`);
    await page.waitForFunction(() => performance.getEntriesByName('seamline:atlas:layout-end').length > 0, null, { timeout: 90_000 })
      .catch((err) => {
        throw new Error(`the Atlas did not finish its layout (${errors.join('; ') || err.message})`);
      });
    // The result is drawn with its links after the layout ends: let that frame reach the screen.
    await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(() => setTimeout(resolve, 300)))));
    const figures = await page.evaluate(() => {
      const mark = (name) => performance.getEntriesByName(`seamline:atlas:${name}`)[0]?.startTime ?? null;
      const graph = performance.getEntriesByType('resource').find((r) => r.name.includes('/module-graph'));
      return {
        data: mark('data'), firstFrame: mark('first-frame'), layoutStart: mark('layout-start'), layoutEnd: mark('layout-end'),
        graphRequestStart: graph?.requestStart ?? null, graphResponseEnd: graph?.responseEnd ?? null,
        graphTransferBytes: graph?.transferSize ?? null, graphBodyBytes: graph?.decodedBodySize ?? null,
        longTasks: window.__seamlineLongTasks,
        status: document.querySelector('.status')?.textContent?.trim() ?? null,
      };
    });
    if (cdp) {
      fs.writeFileSync(profileFile, JSON.stringify((await cdp.send('Profiler.stop')).profile));
      await browser.stopTracing();
    }
    if (screenshot) await page.screenshot({ path: screenshot });
    const during = figures.longTasks.filter((t) => t.start >= figures.layoutStart && t.start < figures.layoutEnd);
    const before = figures.longTasks.filter((t) => t.start < figures.firstFrame);
    const after = figures.longTasks.filter((t) => t.start >= figures.layoutEnd);
    return {
      ...figures,
      longTasks: undefined,
      longestLayoutTask: Math.max(0, ...during.map((t) => t.duration)),
      layoutLongTasks: during.length,
      longestTaskBeforeFirstFrame: Math.max(0, ...before.map((t) => t.duration)),
      longestTaskAfterLayout: Math.max(0, ...after.map((t) => t.duration)),
      layoutMs: figures.layoutEnd - figures.layoutStart,
    };
  } finally {
    await context.close();
  }
}

await runPart('atlas-browser', async (stack) => {
  ensureSystemPackages(['chromium']);
  const index = path.join(WEB_DIST, 'browser', 'index.html');
  if (!fs.existsSync(index)) throw new Error(`${path.relative(root, index)} is missing: run \`SEAMLINE_BENCH_PART=atlas npm run bench\`, which builds the web app first.`);
  const { url, dataSource } = await stack.database('seamline_bench_atlas');
  const { storeSnapshot } = serverModule('api/src/analysis/store-snapshot.js');
  const session = await ownerSession(stack, dataSource, url);
  for (const map of MAPS) {
    progress(`generating and storing a snapshot with ${map.files.toLocaleString('en')} file modules…`);
    const snapshot = generateSnapshot(map.shape);
    const { snapshot: row } = await queuedSnapshot(dataSource, session.workspace.id, `synthetic-${map.files}`);
    await storeSnapshot(dataSource, row.id, snapshot);
    map.snapshotId = row.id;
    map.nodes = snapshot.modules.filter((m) => m.level === 'file').length;
    map.edges = snapshot.moduleEdges.filter((e) => e.level === 'file').length;
  }
  await dataSource.query('ANALYZE');
  const { base } = await stack.startApi(url, { SEAMLINE_WEB_DIST: path.join(WEB_DIST, 'browser') });
  const [name, value] = session.headers.Cookie.split('=');
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', ...GPU_FLAGS, '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  const results = {};
  try {
    for (const map of MAPS) {
      progress(`${map.nodes.toLocaleString('en')} modules: first visit, then ${VISITS} more…`);
      const shot = path.join(stack.dataDir, '..', 'results', `atlas-${map.files}.png`);
      fs.mkdirSync(path.dirname(shot), { recursive: true });
      const first = await visit(browser, base, { name, value }, map.snapshotId, null);
      const later = [];
      for (let i = 0; i < VISITS; i++) {
        const last = i === VISITS - 1;
        const profile = PROFILE && last ? shot.replace(/\.png$/, '.cpuprofile') : null;
        later.push(await visit(browser, base, { name, value }, map.snapshotId, last ? shot : null, profile));
      }
      results[map.files] = { nodes: map.nodes, edges: map.edges, first, later, screenshot: path.relative(root, shot) };
    }
  } finally {
    await browser.close();
  }

  const f = (x) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : Math.round(x).toLocaleString('en'));
  const mb = (x) => (x ? (x / 2 ** 20).toFixed(1) : '—');
  const med = (visits, key) => median(visits.map((v) => v[key]));
  const rows = [];
  for (const { nodes, edges, first, later } of Object.values(results)) {
    for (const [label, visits] of [['first visit (server builds its answer)', [first]], [`later visits (median of ${later.length})`, later]]) {
      const firstFrame = med(visits, 'firstFrame');
      const longest = med(visits, 'longestLayoutTask');
      rows.push(`| ${f(nodes)} / ${f(edges)} | ${label} | ${f(med(visits, 'graphResponseEnd'))} | ${mb(visits[0].graphTransferBytes)} / ${mb(visits[0].graphBodyBytes)} | ${f(med(visits, 'data'))} | ${f(firstFrame)} | ${f(med(visits, 'longestTaskBeforeFirstFrame'))} | ${f(med(visits, 'layoutMs'))} | ${f(longest)} (${f(med(visits, 'layoutLongTasks'))} over 50 ms) | ${f(med(visits, 'longestTaskAfterLayout'))} | ${nodes >= 20_000 ? `${firstFrame < TARGETS.firstFrameMs ? 'yes' : 'no'} / ${longest <= TARGETS.longestLayoutTaskMs ? 'yes' : 'no'}` : 'no target'} |`);
    }
  }
  const text = [
    `The Atlas in headless Chromium (WebGL in software, 1440×900), file level, fresh profile per visit (the layout always runs); ms from the start of navigation:`,
    '| modules / links | visit | module graph received | answer MB (sent / JSON) | data parsed | first frame | longest task before it | layout ran | longest task while the layout runs | longest task after it (the result drawn with links) | first frame < 3,000 / task ≤ 200 |',
    '| --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- |',
    ...rows,
  ].join('\n');
  return { figures: { targets: TARGETS, results }, text };
});
