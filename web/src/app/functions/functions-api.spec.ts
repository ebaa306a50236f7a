import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { snapshot } from '../testing/api-fixtures';
import { DEFAULT_QUERY } from './function-query';
import { functionPage, functionRow } from './function-fixtures';
import { FunctionsApi } from './functions-api';
import type { ClusterSummary, FunctionPage, ModuleOption } from './functions-types';

describe('FunctionsApi', () => {
  let api: FunctionsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(FunctionsApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should ask for one page with the filters, sort and page as query parameters', () => {
    let answer: FunctionPage | undefined;
    api
      .page('snap 1', { ...DEFAULT_QUERY, q: 'plan', band: 'tangled', overLimit: true, sort: 'loc', order: 'asc', page: 3 })
      .subscribe((page) => (answer = page));

    const req = http.expectOne((r) => r.url === '/api/snapshots/snap%201/functions');
    expect(req.request.method).toBe('GET');
    expect(req.request.params.keys().sort()).toEqual(['band', 'order', 'overLimit', 'page', 'pageSize', 'q', 'sort']);
    expect(req.request.params.get('q')).toBe('plan');
    expect(req.request.params.get('band')).toBe('tangled');
    expect(req.request.params.get('overLimit')).toBe('true');
    expect(req.request.params.get('sort')).toBe('loc');
    expect(req.request.params.get('order')).toBe('asc');
    expect(req.request.params.get('page')).toBe('3');
    expect(req.request.params.get('pageSize')).toBe('50');
    const page = functionPage([functionRow()], { page: 3, total: 101 });
    req.flush(page);
    expect(answer).toEqual(page);
  });

  it('should read the snapshot summary with its coverage', () => {
    let coverage: unknown;
    api.snapshot('s-1').subscribe((s) => (coverage = s.coverage));
    http.expectOne('/api/snapshots/s-1').flush({ snapshot: { ...snapshot(), coverage: { format: 'lcov', unmatchedFiles: [] } } });
    expect(coverage).toEqual({ format: 'lcov', unmatchedFiles: [] });
  });

  it('should list package, folder and file modules, each level sorted by path', () => {
    let modules: ModuleOption[] = [];
    api.modules('s-1').subscribe((list) => (modules = list));

    const byLevel = (level: string) =>
      http.expectOne((r) => r.url === '/api/snapshots/s-1/modules' && r.params.get('level') === level);
    byLevel('file').flush({
      level: 'file',
      items: [
        { id: 'file:src/orders/order.ts', path: 'src/orders/order.ts', functions: 4, gravity: 1 },
        { id: 'file:src/billing/invoice.ts', path: 'src/billing/invoice.ts', functions: 2, gravity: 2 },
      ],
    });
    byLevel('folder').flush({ level: 'folder', items: [{ id: 'folder:src/orders', path: 'src/orders', functions: 9 }] });
    byLevel('package').flush({ level: 'package', items: [] });

    expect(modules).toEqual([
      { id: 'folder:src/orders', level: 'folder', path: 'src/orders', functions: 9 },
      { id: 'file:src/billing/invoice.ts', level: 'file', path: 'src/billing/invoice.ts', functions: 2 },
      { id: 'file:src/orders/order.ts', level: 'file', path: 'src/orders/order.ts', functions: 4 },
    ]);
  });

  it('should read the file-level clusters', () => {
    let clusters: ClusterSummary[] = [];
    api.clusters('s-1').subscribe((list) => (clusters = list));
    const req = http.expectOne((r) => r.url === '/api/snapshots/s-1/clusters');
    expect(req.request.params.get('level')).toBe('file');
    req.flush({
      level: 'file',
      items: [{ id: 'c1', members: ['file:src/a.ts'], functions: 3, cyclomatic: 7, decisions: 4, internalWeight: 1, externalWeight: 0 }],
    });
    expect(clusters).toEqual([{ id: 'c1', members: ['file:src/a.ts'], functions: 3, cyclomatic: 7 }]);
  });
});
