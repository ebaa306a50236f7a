// HTTP load against the API on loopback with autocannon: fixed connections for a fixed time,
// each request's path taken in turn from a list; latencies come from every response, so the
// percentiles are exact rather than read off a histogram.
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const autocannon = require('autocannon');

/** The value at percentile p (0–100) of an ascending list. */
function percentile(sorted, p) {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

/**
 * Sends GETs to `base` + each of `paths` in turn from `connections` connections for `seconds`.
 * Resolves with p50/p95/p99 and max (ms), requests/s, bytes per response and errors (connection
 * errors, timeouts and answers other than 200).
 */
export function loadPaths({ base, headers, paths, seconds, connections = 20 }) {
  return new Promise((resolve, reject) => {
    const latencies = [];
    const statuses = {};
    let bytes = 0;
    let next = 0;
    const instance = autocannon({
      url: base,
      connections,
      duration: seconds,
      timeout: 30,
      headers,
      requests: [{ method: 'GET', setupRequest: (req) => ({ ...req, path: paths[next++ % paths.length] }) }],
    }, (err, result) => {
      if (err) return reject(err);
      latencies.sort((a, b) => a - b);
      const ok = statuses[200] ?? 0;
      resolve({
        requests: latencies.length,
        perSecond: latencies.length / seconds,
        p50: percentile(latencies, 50),
        p95: percentile(latencies, 95),
        p99: percentile(latencies, 99),
        max: latencies[latencies.length - 1],
        meanKb: latencies.length ? bytes / latencies.length / 1024 : 0,
        errors: result.errors + result.timeouts + (latencies.length - ok),
        statuses,
        connectionErrors: result.errors,
        timeouts: result.timeouts,
      });
    });
    instance.on('response', (client, statusCode, resBytes, responseTime) => {
      latencies.push(responseTime);
      bytes += resBytes;
      statuses[statusCode] = (statuses[statusCode] ?? 0) + 1;
    });
  });
}
