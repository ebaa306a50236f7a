import type { Request, Response } from 'express';
import type { DataSource } from 'typeorm';
import { Snapshot } from '../../db/entities';
import { toSnapshotSummary } from '../../services/snapshot-summary';

/** How often the stream looks at the snapshot's row; progress is written at most this often too. */
const POLL_MS = 500;
/** A comment line now and then keeps proxies from closing a quiet stream. */
const KEEPALIVE_MS = 15_000;

/**
 * Server-sent events for one snapshot: a `snapshot` event with its summary whenever its status,
 * phase or progress changes, ending after `ready` or `failed`. Clients without EventSource poll
 * GET /api/snapshots/:id instead.
 */
export function streamSnapshotEvents(dataSource: DataSource, snapshotId: string, req: Request, res: Response): void {
  res.set({ 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-cache, no-transform', Connection: 'keep-alive', 'X-Accel-Buffering': 'no' });
  res.flushHeaders();
  res.write('retry: 2000\n\n');
  let last = '';
  let closed = false;
  let lastWrite = Date.now();
  const tick = async () => {
    if (closed) return;
    const row = await dataSource.getRepository(Snapshot).findOneBy({ id: snapshotId });
    if (closed) return;
    if (!row) {
      res.write(`event: gone\ndata: {"id":"${snapshotId}"}\n\n`);
      return stop();
    }
    const summary = toSnapshotSummary(row);
    const key = `${summary.status}|${summary.phase}|${summary.progress}|${summary.error}`;
    if (key !== last) {
      last = key;
      lastWrite = Date.now();
      res.write(`event: snapshot\ndata: ${JSON.stringify(summary)}\n\n`);
    } else if (Date.now() - lastWrite > KEEPALIVE_MS) {
      lastWrite = Date.now();
      res.write(': still here\n\n');
    }
    if (summary.status === 'ready' || summary.status === 'failed') return stop();
    timer = setTimeout(() => void tick().catch(stop), POLL_MS);
  };
  let timer: NodeJS.Timeout | undefined;
  const stop = () => {
    closed = true;
    clearTimeout(timer);
    res.end();
  };
  req.on('close', () => {
    closed = true;
    clearTimeout(timer);
  });
  void tick().catch(stop);
}
