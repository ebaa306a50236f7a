// The server's addresses `seamline push` talks to, under the base address given as --server.
import type { PushCommand } from './pushCommandLine';

/** `POST {server}/api/push?codebase=…&commit=…&branch=…` (commit and branch only when given). */
export function pushUrl(command: Pick<PushCommand, 'server' | 'codebase' | 'commit' | 'branch'>): URL {
  const url = new URL(`${command.server}/api/push`);
  url.searchParams.set('codebase', command.codebase);
  if (command.commit !== undefined) url.searchParams.set('commit', command.commit);
  if (command.branch !== undefined) url.searchParams.set('branch', command.branch);
  return url;
}

/** `{server}/api/snapshots/{id}`: a snapshot's status. */
export function snapshotUrl(server: string, id: string): string {
  return `${server}/api/snapshots/${encodeURIComponent(id)}`;
}

/** Whether a plain-http address leaves this machine, so the token would cross a network unencrypted. */
export function sendsTokenInClear(server: string): boolean {
  const url = new URL(server);
  if (url.protocol !== 'http:') return false;
  const host = url.hostname.replace(/^\[|\]$/g, '');
  return !(host === 'localhost' || host.endsWith('.localhost') || host === '::1' || /^127\.\d+\.\d+\.\d+$/.test(host));
}
