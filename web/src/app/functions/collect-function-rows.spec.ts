import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { errorBody } from '../testing/api-fixtures';
import { collectFunctionRows, type ExportProgress, ExportTooLargeError } from './collect-function-rows';
import { DEFAULT_QUERY } from './function-query';
import { functionPage, manyRows } from './function-fixtures';
import { FunctionsApi } from './functions-api';

describe('collectFunctionRows', () => {
  let api: FunctionsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(FunctionsApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const query = { ...DEFAULT_QUERY, band: 'calm' as const, sort: 'name' as const, order: 'asc' as const };
  const fetchPage = (page: number, pageSize: number) => api.page('s-1', { ...query, page, pageSize });
  const pageRequest = (page: number) =>
    http.expectOne((r) => r.url === '/api/snapshots/s-1/functions' && r.params.get('page') === String(page));

  it('should fetch the pages one after another with the filters and report progress', () => {
    const events: ExportProgress[] = [];
    let failed: unknown;
    collectFunctionRows(fetchPage, 50_000, 3).subscribe({ next: (e) => events.push(e), error: (e) => (failed = e) });

    const first = pageRequest(1);
    expect(first.request.params.get('pageSize')).toBe('3');
    expect(first.request.params.get('band')).toBe('calm');
    expect(first.request.params.get('sort')).toBe('name');
    // One request at a time: page 2 is asked for only after page 1 arrives.
    http.expectNone((r) => r.params.get('page') === '2');
    first.flush(functionPage(manyRows(3, 0), { total: 7, page: 1, pageSize: 3 }));
    pageRequest(2).flush(functionPage(manyRows(3, 3), { total: 7, page: 2, pageSize: 3 }));
    pageRequest(3).flush(functionPage(manyRows(1, 6), { total: 7, page: 3, pageSize: 3 }));

    expect(failed).toBeUndefined();
    expect(events.slice(0, 3)).toEqual([
      { kind: 'progress', fetched: 3, total: 7 },
      { kind: 'progress', fetched: 6, total: 7 },
      { kind: 'progress', fetched: 7, total: 7 },
    ]);
    const done = events[3];
    expect(done.kind).toBe('done');
    expect(done.kind === 'done' && done.rows.map((r) => r.id)).toEqual(['fn-0', 'fn-1', 'fn-2', 'fn-3', 'fn-4', 'fn-5', 'fn-6']);
    expect(events).toHaveLength(4);
  });

  it('should finish at once when nothing matches', () => {
    const events: ExportProgress[] = [];
    collectFunctionRows(fetchPage).subscribe((e) => events.push(e));
    pageRequest(1).flush(functionPage([], { total: 0 }));
    expect(events).toEqual([
      { kind: 'progress', fetched: 0, total: 0 },
      { kind: 'done', rows: [], total: 0 },
    ]);
  });

  it('should refuse after the first page when the filters match more than the cap', () => {
    let failed: unknown;
    const events: ExportProgress[] = [];
    collectFunctionRows(fetchPage, 5, 3).subscribe({ next: (e) => events.push(e), error: (e) => (failed = e) });
    pageRequest(1).flush(functionPage(manyRows(3), { total: 6, pageSize: 3 }));

    expect(events).toEqual([]);
    expect(failed).toBeInstanceOf(ExportTooLargeError);
    expect((failed as Error).message).toBe(
      'These filters match 6 functions; an export holds at most 5. Narrow the filters (for example by module or band) and export again.',
    );
  });

  it('should fail with the server error of any page', () => {
    let failed: unknown;
    collectFunctionRows(fetchPage, 50_000, 2).subscribe({ error: (e) => (failed = e) });
    pageRequest(1).flush(functionPage(manyRows(2), { total: 4, pageSize: 2 }));
    pageRequest(2).flush(errorBody('internal', 'Database gone.'), { status: 503, statusText: 'Unavailable' });
    expect(failed).toMatchObject({ status: 503 });
  });

  it('should stop asking when unsubscribed', () => {
    const subscription = collectFunctionRows(fetchPage, 50_000, 2).subscribe();
    pageRequest(1).flush(functionPage(manyRows(2), { total: 6, pageSize: 2 }));
    const second = pageRequest(2);
    subscription.unsubscribe();
    expect(second.cancelled).toBe(true);
  });
});
