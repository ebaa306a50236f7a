/**
 * Reading the server's answers to `seamline push`
 * ===============================================
 * The server answers JSON: `{ snapshot, links }` when it accepts an upload, `{ snapshot }` for a
 * snapshot's status, and `{ error: { code, message } }` for anything it refuses. A refusal is
 * shown as the server's own message with the HTTP status; an answer that is not the expected
 * JSON (a proxy's HTML page, a redirect, a wrong address) says so, since that usually means
 * `--server` points somewhere else.
 */
import { CliInputError } from './CliInputError';
import type { HttpAnswer } from './pushHttp';

/** What the server says when it accepts an upload. */
export interface AcceptedSnapshot {
  id: string;
  status: string;
}

/** A snapshot's state on the server while it is analysed. */
export interface SnapshotState {
  id: string;
  status: string;
  /** Percent done, 0–100, while running. */
  progress?: number;
  phase?: string;
  /** Why the analysis failed. */
  error?: string;
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function json(answer: HttpAnswer): unknown {
  try {
    return JSON.parse(answer.body);
  } catch {
    return undefined;
  }
}

function statusLine(answer: HttpAnswer): string {
  return `HTTP ${answer.status}${answer.statusText ? ` ${answer.statusText}` : ''}`;
}

/** The error to throw for a non-2xx answer: the server's message when it sent one. */
export function refusal(answer: HttpAnswer, server: string): CliInputError {
  const body = json(answer);
  const error = isObject(body) && isObject(body.error) ? body.error : undefined;
  if (error && typeof error.message === 'string' && error.message.trim() !== '') {
    return new CliInputError(`${error.message.trim()} (HTTP ${answer.status})`);
  }
  if (answer.status >= 300 && answer.status < 400) {
    const where = answer.location ? ` to ${answer.location}` : '';
    return new CliInputError(
      `the server at ${server} answered ${statusLine(answer)}, a redirect${where}; give the address it redirects to as --server (redirects are not followed, so the token stays where you sent it)`,
    );
  }
  return new CliInputError(
    `the server at ${server} answered ${statusLine(answer)} without a Seamline error message; is --server the address of a Seamline server?`,
  );
}

function unexpected(answer: HttpAnswer, server: string, what: string): CliInputError {
  return new CliInputError(`the server at ${server} answered ${statusLine(answer)} but not with ${what}; is --server the address of a Seamline server?`);
}

function snapshotOf(answer: HttpAnswer): Record<string, unknown> | undefined {
  const body = json(answer);
  const snapshot = isObject(body) && isObject(body.snapshot) ? body.snapshot : undefined;
  if (!snapshot || typeof snapshot.id !== 'string' || snapshot.id === '' || typeof snapshot.status !== 'string') return undefined;
  return snapshot;
}

/** The accepted snapshot from the answer to the upload; throws CliInputError for anything else. */
export function acceptedSnapshot(answer: HttpAnswer, server: string): AcceptedSnapshot {
  if (answer.status < 200 || answer.status > 299) throw refusal(answer, server);
  const snapshot = snapshotOf(answer);
  if (!snapshot) throw unexpected(answer, server, 'the accepted snapshot (the upload may have been stored)');
  return { id: snapshot.id as string, status: snapshot.status as string };
}

/** A snapshot's state from the answer to a status request; throws CliInputError for anything else. */
export function snapshotState(answer: HttpAnswer, server: string): SnapshotState {
  if (answer.status < 200 || answer.status > 299) throw refusal(answer, server);
  const snapshot = snapshotOf(answer);
  if (!snapshot) throw unexpected(answer, server, "the snapshot's status");
  return {
    id: snapshot.id as string,
    status: snapshot.status as string,
    progress: typeof snapshot.progress === 'number' ? snapshot.progress : undefined,
    phase: typeof snapshot.phase === 'string' && snapshot.phase !== '' ? snapshot.phase : undefined,
    error: typeof snapshot.error === 'string' && snapshot.error.trim() !== '' ? snapshot.error.trim() : undefined,
  };
}
