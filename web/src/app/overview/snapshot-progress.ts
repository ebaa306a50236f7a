import { HttpErrorResponse } from '@angular/common/http';
import { inject, Injectable, InjectionToken } from '@angular/core';
import {
  catchError,
  exhaustMap,
  interval,
  map,
  Observable,
  of,
  retry,
  startWith,
  Subscription,
  takeWhile,
  throwError,
} from 'rxjs';

import type { Snapshot } from '../api-types';
import { SnapshotFiguresApi } from './snapshot-figures-api';

/** The part of the browser's EventSource this service uses. */
export interface EventSourceLike {
  addEventListener(type: string, listener: (event: MessageEvent<string>) => void): void;
  onerror: ((event: Event) => void) | null;
  close(): void;
}

/** Opens a server-sent event stream, or gives null where the browser has no EventSource. */
export type EventSourceFactory = (url: string) => EventSourceLike | null;

/** How the service opens event streams (tests pass a fake). */
export const EVENT_SOURCE_FACTORY = new InjectionToken<EventSourceFactory>('EVENT_SOURCE_FACTORY', {
  providedIn: 'root',
  factory: () => (url: string) => (typeof EventSource === 'function' ? new EventSource(url) : null),
});

/** How often the fallback asks for the snapshot's state, in milliseconds. */
export const PROGRESS_POLL_MS = new InjectionToken<number>('PROGRESS_POLL_MS', {
  providedIn: 'root',
  factory: () => 2000,
});

/** What following a snapshot reports: its latest state, or that it was deleted. */
export type ProgressUpdate = { kind: 'snapshot'; snapshot: Snapshot } | { kind: 'gone' };

/** Failed polls in a row that are tolerated before the follow fails. */
const POLL_RETRIES = 3;

/** Whether the update is the last one: the analysis ended, or the snapshot is gone. */
export function isFinal(update: ProgressUpdate): boolean {
  return update.kind === 'gone' || update.snapshot.status === 'ready' || update.snapshot.status === 'failed';
}

/**
 * Follows a snapshot's analysis live: server-sent events from `/api/snapshots/:id/events`
 * (`snapshot` with its summary, `gone` once deleted), and polling `GET /api/snapshots/:id`
 * when the browser has no EventSource or the stream fails. Completes after ready, failed or gone.
 */
@Injectable({ providedIn: 'root' })
export class SnapshotProgress {
  private readonly openEventSource = inject(EVENT_SOURCE_FACTORY);
  private readonly pollMs = inject(PROGRESS_POLL_MS);
  private readonly figures = inject(SnapshotFiguresApi);

  /** The snapshot's states from now until the analysis ends (or the snapshot is deleted). */
  follow(snapshotId: string): Observable<ProgressUpdate> {
    return new Observable<ProgressUpdate>((subscriber) => {
      const source = this.openEventSource(`/api/snapshots/${encodeURIComponent(snapshotId)}/events`);
      if (!source) {
        return this.followByPolling(snapshotId).subscribe(subscriber);
      }
      let fallback: Subscription | null = null;
      const fallBackToPolling = () => {
        source.close();
        fallback ??= this.followByPolling(snapshotId).subscribe(subscriber);
      };
      const deliver = (update: ProgressUpdate) => {
        subscriber.next(update);
        if (isFinal(update)) {
          source.close();
          subscriber.complete();
        }
      };
      source.addEventListener('snapshot', (event) => {
        const snapshot = parseSnapshot(event.data);
        if (snapshot) deliver({ kind: 'snapshot', snapshot });
        else fallBackToPolling();
      });
      source.addEventListener('gone', () => deliver({ kind: 'gone' }));
      source.onerror = fallBackToPolling;
      return () => {
        source.close();
        fallback?.unsubscribe();
      };
    });
  }

  /**
   * The same updates by asking `GET /api/snapshots/:id` every few seconds (404 means gone). Also
   * for following many snapshots at once: each event stream holds one of the browser's few
   * connections per server.
   */
  followByPolling(snapshotId: string): Observable<ProgressUpdate> {
    // The first ask goes at once; then one every pollMs.
    return interval(this.pollMs).pipe(
      startWith(-1),
      exhaustMap(() =>
        this.figures.snapshot(snapshotId).pipe(
          map((snapshot): ProgressUpdate => ({ kind: 'snapshot', snapshot })),
          catchError((error: unknown) =>
            error instanceof HttpErrorResponse && error.status === 404
              ? of<ProgressUpdate>({ kind: 'gone' })
              : throwError(() => error),
          ),
        ),
      ),
      // A few failed polls in a row (a restart, a dropped connection) are waited out.
      retry({ count: POLL_RETRIES, delay: this.pollMs, resetOnSuccess: true }),
      takeWhile((update) => !isFinal(update), true),
    );
  }
}

/** The snapshot in an event's data, or null when the data is not a snapshot summary. */
function parseSnapshot(data: string): Snapshot | null {
  try {
    const value = JSON.parse(data) as Partial<Snapshot> | null;
    return value && typeof value.id === 'string' && typeof value.status === 'string' ? (value as Snapshot) : null;
  } catch {
    return null; // a garbled event: the caller polls instead
  }
}
