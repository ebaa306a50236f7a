import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { Snapshot } from '../api-types';
import { errorBody, snapshot } from '../testing/api-fixtures';
import {
  EVENT_SOURCE_FACTORY,
  isFinal,
  PROGRESS_POLL_MS,
  ProgressUpdate,
  SnapshotProgress,
} from './snapshot-progress';
import { FakeEventSource } from '../testing/fake-event-source';

const POLL_MS = 2000;

describe('SnapshotProgress', () => {
  let sources: FakeEventSource[];
  let hasEventSource: boolean;
  let http: HttpTestingController;
  let updates: ProgressUpdate[];
  let done: boolean;
  let failure: unknown;

  beforeEach(() => {
    jest.useFakeTimers();
    sources = [];
    hasEventSource = true;
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: PROGRESS_POLL_MS, useValue: POLL_MS },
        {
          provide: EVENT_SOURCE_FACTORY,
          useValue: (url: string) => {
            if (!hasEventSource) return null;
            const source = new FakeEventSource(url);
            sources.push(source);
            return source;
          },
        },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    updates = [];
    done = false;
    failure = undefined;
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  function follow(id = 's-9') {
    return TestBed.inject(SnapshotProgress)
      .follow(id)
      .subscribe({
        next: (update) => updates.push(update),
        complete: () => (done = true),
        error: (error: unknown) => (failure = error),
      });
  }

  function statuses(): string[] {
    return updates.map((u) => (u.kind === 'gone' ? 'gone' : `${u.snapshot.status}:${u.snapshot.progress}`));
  }

  function answerPoll(value: Partial<Snapshot>, id = 's-9'): void {
    http.expectOne({ method: 'GET', url: `/api/snapshots/${id}` }).flush({ snapshot: snapshot({ id, ...value }) });
  }

  it('should pass on each snapshot event and finish when the analysis is ready', () => {
    follow();
    expect(sources.map((s) => s.url)).toEqual(['/api/snapshots/s-9/events']);

    sources[0].emit('snapshot', snapshot({ id: 's-9', status: 'queued', progress: 0, totals: null }));
    sources[0].emit('snapshot', snapshot({ id: 's-9', status: 'running', progress: 40, phase: 'analyse', totals: null }));
    expect(done).toBe(false);
    sources[0].emit('snapshot', snapshot({ id: 's-9', status: 'ready', progress: 100 }));

    expect(statuses()).toEqual(['queued:0', 'running:40', 'ready:100']);
    expect(done).toBe(true);
    expect(sources[0].closed).toBe(true);
    http.expectNone('/api/snapshots/s-9');
  });

  it('should finish with the reason when the analysis failed', () => {
    follow();
    sources[0].emit('snapshot', snapshot({ id: 's-9', status: 'failed', error: 'No TypeScript or JavaScript files found.' }));

    const last = updates.at(-1);
    expect(last?.kind === 'snapshot' && last.snapshot.error).toBe('No TypeScript or JavaScript files found.');
    expect(done).toBe(true);
  });

  it('should report a deleted snapshot as gone', () => {
    follow();
    sources[0].emit('gone', { id: 's-9' });

    expect(updates).toEqual([{ kind: 'gone' }]);
    expect(done).toBe(true);
    expect(sources[0].closed).toBe(true);
  });

  it('should poll every two seconds when the browser has no EventSource', () => {
    hasEventSource = false;
    follow();

    answerPoll({ status: 'running', progress: 10, totals: null });
    jest.advanceTimersByTime(POLL_MS - 1);
    http.expectNone('/api/snapshots/s-9');
    jest.advanceTimersByTime(1);
    answerPoll({ status: 'running', progress: 60, totals: null });
    jest.advanceTimersByTime(POLL_MS);
    answerPoll({ status: 'ready', progress: 100 });

    expect(statuses()).toEqual(['running:10', 'running:60', 'ready:100']);
    expect(done).toBe(true);
    jest.advanceTimersByTime(POLL_MS * 3);
    http.expectNone('/api/snapshots/s-9');
  });

  it('should close the stream and poll instead when it errors', () => {
    follow();
    sources[0].emit('snapshot', snapshot({ id: 's-9', status: 'running', progress: 20, totals: null }));
    sources[0].fail();

    expect(sources[0].closed).toBe(true);
    answerPoll({ status: 'failed', progress: 20, error: 'took longer than its limit' });
    expect(statuses()).toEqual(['running:20', 'failed:20']);
    expect(done).toBe(true);
  });

  it('should poll instead when an event is not a snapshot', () => {
    follow();
    sources[0].emit('snapshot', 'not json');

    answerPoll({ status: 'ready' });
    expect(statuses()).toEqual(['ready:100']);
  });

  it('should say gone when polling finds no snapshot', () => {
    hasEventSource = false;
    follow();

    http
      .expectOne('/api/snapshots/s-9')
      .flush(errorBody('not_found', 'No such snapshot in this workspace.'), { status: 404, statusText: 'Not Found' });
    expect(updates).toEqual([{ kind: 'gone' }]);
    expect(done).toBe(true);
  });

  it('should wait out a few failed polls, then give up with the error', () => {
    hasEventSource = false;
    follow();

    for (let attempt = 0; attempt < 4; attempt++) {
      http.expectOne('/api/snapshots/s-9').flush(errorBody('internal', 'down'), { status: 503, statusText: 'Unavailable' });
      jest.advanceTimersByTime(POLL_MS);
    }
    expect(failure).toBeDefined();
    expect(updates).toEqual([]);
  });

  it('should close the stream when the follower stops listening', () => {
    const subscription = follow();
    subscription.unsubscribe();

    expect(sources[0].closed).toBe(true);
  });

  it('should tell final updates from passing ones', () => {
    expect(isFinal({ kind: 'gone' })).toBe(true);
    expect(isFinal({ kind: 'snapshot', snapshot: snapshot({ status: 'ready' }) })).toBe(true);
    expect(isFinal({ kind: 'snapshot', snapshot: snapshot({ status: 'failed' }) })).toBe(true);
    expect(isFinal({ kind: 'snapshot', snapshot: snapshot({ status: 'running' }) })).toBe(false);
    expect(isFinal({ kind: 'snapshot', snapshot: snapshot({ status: 'queued' }) })).toBe(false);
  });
});
