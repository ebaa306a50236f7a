/**
 * `seamline push --wait`
 * ======================
 * Asks the server for the snapshot's status once per interval until it is `ready` or `failed`
 * or the time is up, writing a line on stderr whenever the status or phase changes so a CI log
 * shows where the analysis is. A few dropped connections or gateway errors in a row are ridden
 * out (the upload already succeeded; a proxy restarting should not fail the pipeline).
 */
import type { Writable } from 'node:stream';
import { CliInputError } from './CliInputError';
import { refusal, snapshotState } from './pushAnswers';
import type { SnapshotState } from './pushAnswers';
import { exchange } from './pushHttp';
import type { HttpAnswer } from './pushHttp';

/** The clock the wait runs on; tests shorten it. */
export interface PushTiming {
  /** Give up on one request after this long without traffic. */
  idleTimeoutMs: number;
  /** Time between two status requests. */
  pollIntervalMs: number;
  now(): number;
  sleep(ms: number): Promise<void>;
}

export const DEFAULT_PUSH_TIMING: PushTiming = {
  idleTimeoutMs: 120_000,
  pollIntervalMs: 1000,
  now: () => Date.now(),
  sleep: (ms) => new Promise((resolve) => setTimeout(resolve, ms)),
};

/** Failed status requests in a row that end the wait. */
export const MAX_FAILED_POLLS = 3;
const GATEWAY_ERRORS = new Set([502, 503, 504]);

export interface WaitRequest {
  server: string;
  token: string;
  /** The snapshot's status address. */
  url: string;
  id: string;
  timeoutSeconds: number;
  stderr: Writable;
}

function describe(state: SnapshotState): string {
  const phase = state.phase ? ` — ${state.phase}` : '';
  const progress = state.status === 'running' && state.progress !== undefined ? ` (${state.progress}%)` : '';
  return `snapshot ${state.id}: ${state.status}${phase}${progress}`;
}

// An answer, or the connection error in its place.
async function poll(request: WaitRequest, timing: PushTiming): Promise<HttpAnswer | CliInputError> {
  try {
    return await exchange({
      method: 'GET',
      url: new URL(request.url),
      headers: { Authorization: `Bearer ${request.token}`, Accept: 'application/json' },
      idleTimeoutMs: timing.idleTimeoutMs,
      server: request.server,
    });
  } catch (error) {
    if (error instanceof CliInputError) return error;
    throw error;
  }
}

/** Wait for the analysis; resolves with the final state (`ready` or `failed`), throws CliInputError otherwise. */
export async function waitForAnalysis(request: WaitRequest, timing: PushTiming = DEFAULT_PUSH_TIMING): Promise<SnapshotState> {
  const deadline = timing.now() + request.timeoutSeconds * 1000;
  let shown = '';
  let failures = 0;
  let last: SnapshotState | undefined;
  for (;;) {
    const left = deadline - timing.now();
    if (left <= 0) {
      const where = last ? `still ${last.status}` : 'not analysed';
      throw new CliInputError(
        `snapshot ${request.id} is ${where} after ${request.timeoutSeconds} s (--timeout); the server goes on with it: ${request.url}`,
      );
    }
    await timing.sleep(Math.min(timing.pollIntervalMs, left));
    const answer = await poll(request, timing);
    if (answer instanceof CliInputError || GATEWAY_ERRORS.has(answer.status)) {
      failures++;
      if (failures >= MAX_FAILED_POLLS) throw answer instanceof CliInputError ? answer : refusal(answer, request.server);
      continue;
    }
    failures = 0;
    last = snapshotState(answer, request.server);
    if (last.status === 'ready' || last.status === 'failed') return last;
    const line = describe(last);
    const key = `${last.status}\u0000${last.phase ?? ''}`;
    if (key !== shown) {
      request.stderr.write(`${line}\n`);
      shown = key;
    }
  }
}
