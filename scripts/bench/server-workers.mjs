// Analysis throughput with 1, 2 and 4 worker processes (issue: "two or more workers can run at
// once … a bench run shows the throughput with 1, 2 and 4 workers"). For each count, on a fresh
// database of the same cluster: the API takes SEAMLINE_BENCH_JOBS (8) uploads of the demo's
// `before` zip while no worker runs, then the workers start (one job at a time each) and the
// clock runs from the first job's start to the last one's end, as the snapshot rows record them.
// The baseline is the same run with one worker: the figure is jobs/minute and its ratio to it.
// Run through `SEAMLINE_BENCH_PART=workers npm run bench` (which compiles the server first).
import * as os from 'node:os';
import { createCodebase, demoZip, machineCpu, median, ownerSession, processCpuMs, progress, runPart, untilFinished, uploadZip } from './server-harness.mjs';

const JOBS = Math.max(2, Number(process.env.SEAMLINE_BENCH_JOBS ?? 8));
const COUNTS = [1, 2, 4];

/** The most analyses that ran at the same moment, from their start and end times. */
function peakOverlap(spans) {
  const events = spans.flatMap((r) => [[Number(r.start), 1], [Number(r.end), -1]]).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  let running = 0;
  let peak = 0;
  for (const [, step] of events) peak = Math.max(peak, (running += step));
  return peak;
}

await runPart('workers', async (stack) => {
  const zip = await demoZip(stack);
  const runs = [];
  const loadBefore = os.loadavg()[0];
  for (const count of COUNTS) {
    const { url, dataSource } = await stack.database(`seamline_bench_workers_${count}`);
    const session = await ownerSession(stack, dataSource, url);
    const api = await stack.startApi(url);
    const codebaseId = await createCodebase(api.base, session.headers, 'otterbay');
    const ids = [];
    for (let i = 0; i < JOBS; i++) ids.push(await uploadZip(api.base, session.headers, codebaseId, zip));
    progress(`${count} worker${count > 1 ? 's' : ''}: ${JOBS} demo analyses queued…`);
    const started = Date.now();
    const machineBefore = machineCpu();
    const workers = Array.from({ length: count }, (_, i) => stack.startWorker(url, i));
    const finished = [];
    for (const id of ids) finished.push(await untilFinished(dataSource, id));
    const wallMs = Date.now() - started;
    // CPU the workers used (their analysis threads included) against what the whole machine did meanwhile.
    const workerCpuMs = workers.reduce((sum, w) => sum + processCpuMs(w.pid), 0);
    const machineAfter = machineCpu();
    const machineMs = machineAfter.totalMs - machineBefore.totalMs;
    const machineBusy = (machineAfter.busyMs - machineBefore.busyMs) / machineMs;
    const failed = finished.filter((f) => f.status !== 'ready');
    if (failed.length > 0) throw new Error(`${failed.length} of ${JOBS} analyses failed with ${count} workers: ${failed[0].error}`);
    const spans = await dataSource.query(
      `SELECT extract(epoch FROM started_at) * 1000 AS start, extract(epoch FROM finished_at) * 1000 AS end FROM snapshot WHERE id = ANY($1::uuid[])`, [ids]);
    const spanMs = Math.max(...spans.map((r) => Number(r.end))) - Math.min(...spans.map((r) => Number(r.start)));
    await stack.stopChildren([...workers, api.child]);
    const run = { workers: count, jobs: JOBS, spanMs, wallMs, medianJobMs: median(finished.map((f) => f.runMs)), jobsPerMinute: (JOBS * 60_000) / spanMs, peakAtOnce: peakOverlap(spans),
      cpuPerJobMs: workerCpuMs / JOBS, machineBusy, workersShare: workerCpuMs / machineMs };
    runs.push(run);
    progress(`${count} worker${count > 1 ? 's' : ''}: ${run.jobsPerMinute.toFixed(1)} jobs/minute (${(run.spanMs / 1000).toFixed(1)} s from first start to last end)`);
  }
  const base = runs[0].jobsPerMinute;
  const figures = { jobs: JOBS, runs, cores: os.availableParallelism(), loadAverage: { before: loadBefore, after: os.loadavg()[0] } };
  const f1 = (x) => x.toFixed(1);
  const pct = (x) => `${Math.round(100 * x)} %`;
  const lines = [
    `Demo analyses (otterbay before, ${JOBS} queued per row) with 1, 2 and 4 worker processes, one job at a time each, ${figures.cores} cores:`,
    '| workers | most jobs at once | first start → last end (s) | incl. worker start-up (s) | median job (s) | worker CPU per job (s) | machine busy | of it these workers | jobs/minute | ratio to 1 worker |',
    '| ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |',
    ...runs.map((r) => `| ${r.workers} | ${r.peakAtOnce} | ${f1(r.spanMs / 1000)} | ${f1(r.wallMs / 1000)} | ${f1(r.medianJobMs / 1000)} | ${f1(r.cpuPerJobMs / 1000)} | ${pct(r.machineBusy)} | ${pct(r.workersShare)} | ${f1(r.jobsPerMinute)} | ${(r.jobsPerMinute / base).toFixed(2)} |`),
    '',
    `machine busy: share of both cores' time used by any process while the row ran; "of it these workers": their processes' share (the API and PostgreSQL are the rest of ours, anything else is other work on the machine). 1-minute load average ${loadBefore.toFixed(1)} before, ${figures.loadAverage.after.toFixed(1)} after`,
  ];
  return { figures, text: lines.join('\n') };
});
