/**
 * One HTTP exchange for `seamline push`
 * ======================================
 * Sends a request with node:http(s), optionally streaming a file from disk as the body (with its
 * Content-Length, so the file is never held in memory and the server can refuse a large upload
 * at once), and collects the answer's text up to a cap. No redirects are followed: the token
 * must not travel to an address nobody gave. Connection failures become a `CliInputError` that
 * names the server and says what to check.
 */
import { createReadStream } from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import { CliInputError } from './CliInputError';

/** An answer from the server, whatever its status. */
export interface HttpAnswer {
  status: number;
  statusText: string;
  contentType: string;
  /** The `Location` header of a redirect. */
  location?: string;
  body: string;
}

export interface HttpExchange {
  method: 'GET' | 'POST';
  url: URL;
  headers: Record<string, string>;
  /** A file sent as the body, with its size in bytes. */
  bodyFile?: { path: string; size: number };
  /** Give up after this long without any traffic. */
  idleTimeoutMs: number;
  /** How the server is named in errors (its base address). */
  server: string;
}

/** Answers are small JSON; a larger one is not from a Seamline server. */
export const MAX_ANSWER_BYTES = 1024 * 1024;

class IdleTimeout extends Error {}

/** A sentence for a failed connection: what happened, named after the server. */
export function describeNetworkError(error: unknown, server: string, idleTimeoutMs: number): string {
  const { code, message } = error as NodeJS.ErrnoException;
  const at = `the Seamline server at ${server}`;
  if (error instanceof IdleTimeout) return `${at} did not answer within ${idleTimeoutMs / 1000} s; check --server and try again`;
  switch (code) {
    case 'ECONNREFUSED':
      return `cannot reach ${at}: the connection was refused (is the address right and the server running?)`;
    case 'ENOTFOUND':
    case 'EAI_AGAIN':
      return `cannot reach ${at}: its host name could not be resolved (check --server and the network)`;
    case 'ECONNRESET':
    case 'EPIPE':
      return `the connection to ${at} was closed before it answered; try again`;
    case 'ETIMEDOUT':
    case 'ENETUNREACH':
    case 'EHOSTUNREACH':
      return `cannot reach ${at}: the network gave up (${code}); check --server and the network`;
    default:
      if (typeof code === 'string' && /CERT|SSL|TLS/.test(code)) return `cannot reach ${at}: its TLS certificate was refused (${code}: ${message})`;
      return `cannot reach ${at}: ${code ? `${code}: ` : ''}${message}`;
  }
}

/** Send one request; resolves with any answer the server gives, rejects with CliInputError when there is none. */
export function exchange(request: HttpExchange): Promise<HttpAnswer> {
  const client = request.url.protocol === 'https:' ? https : http;
  const headers = request.bodyFile ? { ...request.headers, 'Content-Length': String(request.bodyFile.size) } : request.headers;
  return new Promise<HttpAnswer>((resolve, reject) => {
    let settled = false;
    let answered = false;
    let timedOut = false;
    const fail = (error: unknown) => {
      if (settled) return;
      settled = true;
      reject(error instanceof CliInputError ? error : new CliInputError(describeNetworkError(error, request.server, request.idleTimeoutMs)));
    };
    // agent: false: one connection per request, closed afterwards, so nothing keeps the process alive.
    const req = client.request(request.url, { method: request.method, headers, agent: false }, (res) => {
      answered = true;
      const chunks: Buffer[] = [];
      let size = 0;
      res.on('data', (chunk: Buffer) => {
        size += chunk.length;
        if (size <= MAX_ANSWER_BYTES) chunks.push(chunk);
        else {
          fail(new CliInputError(`the server at ${request.server} sent an answer larger than ${MAX_ANSWER_BYTES / 1024} KiB (HTTP ${res.statusCode}); is --server the address of a Seamline server?`));
          req.destroy();
        }
      });
      // 'close' also follows a cut connection: what arrived is judged by its status and text.
      res.on('error', () => undefined);
      res.on('close', () => {
        if (timedOut) fail(new IdleTimeout());
        if (settled) return;
        settled = true;
        resolve({
          status: res.statusCode ?? 0,
          statusText: res.statusMessage ?? '',
          contentType: res.headers['content-type'] ?? '',
          location: res.headers.location,
          body: Buffer.concat(chunks).toString('utf8'),
        });
      });
    });
    req.setTimeout(request.idleTimeoutMs, () => {
      timedOut = true;
      req.destroy(new IdleTimeout());
    });
    // A server may answer (413, 401) before it has read the whole body and close the connection;
    // should writing the rest fail then, the answer is what counts.
    req.on('error', (error) => {
      if (!answered) fail(error);
    });
    if (!request.bodyFile) {
      req.end();
      return;
    }
    const file = createReadStream(request.bodyFile.path);
    file.on('error', (error) => {
      fail(new CliInputError(`cannot read ${request.bodyFile!.path} while uploading it: ${error.message}`));
      req.destroy();
    });
    req.on('close', () => file.destroy());
    file.pipe(req);
  });
}
