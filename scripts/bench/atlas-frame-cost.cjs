// What one frame of the map costs in headless Chromium with nothing of Seamline around it: sigma
// and graphology from node_modules on a blank page, a random graph of N nodes and M links, the
// same flags as the browser benchmark. Times the constructor, then each kind of frame from the
// start of drawing to the second frame callback after it (by then the picture is on screen).
// Usage: node scripts/bench/atlas-frame-cost.cjs [N=20000] [M=60000]
'use strict';
const path = require('node:path');
const { chromium } = require('playwright-core');

const modules = path.join(__dirname, '../../node_modules');
const N = Number(process.argv[2] ?? 20000), M = Number(process.argv[3] ?? 60000);
(async () => {
  const b = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'] });
  const p = await b.newPage({ viewport: { width: 1440, height: 900 } });
  await p.setContent('<div id=c style="width:860px;height:630px"></div>');
  await p.addScriptTag({ path: path.join(modules, 'graphology/dist/graphology.umd.min.js') });
  await p.addScriptTag({ path: path.join(modules, 'sigma/dist/sigma.min.js') });
  const r = await p.evaluate(async ({ N, M }) => {
    const frame = () => new Promise((res) => requestAnimationFrame(() => requestAnimationFrame(res)));
    const g = new graphology.Graph();
    let seed = 1; const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    for (let i = 0; i < N; i++) g.addNode('n' + i, { x: rnd() * 1000, y: rnd() * 1000, size: 3 + rnd() * 6, color: '#3366aa', label: 'n' + i });
    for (let j = 0; j < M; j++) { const a = 'n' + Math.floor(rnd() * N), c = 'n' + Math.floor(rnd() * N); if (a !== c && !g.hasEdge(a, c)) g.addEdge(a, c, { size: 1, color: 'rgba(34,38,42,0.35)' }); }
    const out = {};
    let hide = true;
    let t = performance.now();
    const s = new Sigma(g, document.getElementById('c'), { edgeReducer: (e, d) => (hide ? { ...d, hidden: true } : d), labelRenderedSizeThreshold: 9 });
    out.constructMs = performance.now() - t;
    await frame(); out.firstFrameMs = performance.now() - t;
    t = performance.now(); s.refresh(); out.refreshJs = performance.now() - t; await frame(); out.secondNodesOnly = performance.now() - t;
    hide = false;
    t = performance.now(); s.refresh(); out.refreshWithEdgesJs = performance.now() - t; await frame(); out.withEdges = performance.now() - t;
    t = performance.now(); s.refresh(); await frame(); out.withEdgesAgain = performance.now() - t;
    t = performance.now(); s.scheduleRender(); await frame(); out.renderOnlyWithEdges = performance.now() - t;
    s.setSetting('renderLabels', false);
    t = performance.now(); s.refresh(); await frame(); out.withEdgesNoLabels = performance.now() - t;
    return out;
  }, { N, M });
  console.log(N, M, JSON.stringify(r, (k, v) => typeof v === 'number' ? Math.round(v) : v));
  await b.close();
})();
