import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatChipOptionHarness } from '@angular/material/chips/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHeaderHarness } from '@angular/material/sort/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { errorBody, snapshot } from '../testing/api-fixtures';
import { functionPage, functionRow, manyRows } from './function-fixtures';
import { Functions } from './functions';
import type { FunctionPage } from './functions-types';

@Component({ template: 'flow' })
class FlowStub {}

const BASE = '/snapshots/s-1/functions';

describe('Functions', () => {
  let harness: RouterTestingHarness;
  let http: HttpTestingController;
  let loader: HarnessLoader;
  let router: Router;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'snapshots/:snapshotId/functions', component: Functions },
          { path: 'snapshots/:snapshotId/functions/:functionId', component: FlowStub },
        ]),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => http.verify());

  function page(): HTMLElement {
    return harness.routeNativeElement as HTMLElement;
  }

  async function open(url = BASE): Promise<void> {
    await harness.navigateByUrl(url);
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
  }

  function functionsRequest(): TestRequest {
    return http.expectOne((r) => r.url === '/api/snapshots/s-1/functions');
  }

  async function answerPage(body: FunctionPage): Promise<void> {
    functionsRequest().flush(body);
    await harness.fixture.whenStable();
  }

  /** Answers the summary, modules and clusters the screen asks for once per snapshot. */
  async function answerContext(coverage: object | null = null): Promise<void> {
    http.expectOne('/api/snapshots/s-1').flush({ snapshot: { ...snapshot({ id: 's-1', commit: 'v3.14.0' }), coverage } });
    for (const level of ['package', 'folder', 'file']) {
      http
        .expectOne((r) => r.url === '/api/snapshots/s-1/modules' && r.params.get('level') === level)
        .flush({
          level,
          items:
            level === 'folder'
              ? [
                  { id: 'folder:src/orders', path: 'src/orders', functions: 40 },
                  { id: 'folder:src/dispatch-core', path: 'src/dispatch-core', functions: 155 },
                ]
              : [],
        });
    }
    http.expectOne((r) => r.url === '/api/snapshots/s-1/clusters').flush({
      level: 'file',
      items: [{ id: 'c1', members: ['file:src/dispatch-core/planDispatch.ts'], functions: 155, cyclomatic: 409 }],
    });
    await harness.fixture.whenStable();
  }

  function cellTexts(): string[][] {
    return Array.from(page().querySelectorAll('tr.mat-mdc-row')).map((row) =>
      Array.from(row.querySelectorAll('td')).map((cell) => cell.textContent?.replace(/\s+/g, ' ').trim() ?? ''),
    );
  }

  function headerTexts(): string[] {
    return Array.from(page().querySelectorAll('th')).map((th) => th.textContent?.trim() ?? '');
  }

  function currentUrl(): string {
    return router.url;
  }

  const plan = functionRow();
  const quote = functionRow({
    id: 'fn-quote',
    qualifiedName: 'PriceBook.quote',
    kind: 'method',
    file: 'src/pricing/PriceBook.ts',
    line: 8,
    cyclomatic: 4,
    essential: 1,
    decisions: 3,
    loc: 12,
    band: 'calm',
    overLimit: false,
  });

  it('should show a progress bar, then the functions with their figures, bands and Flow links', async () => {
    await open();
    expect(page().querySelector('mat-progress-bar')).not.toBeNull();
    expect(page().querySelector('h1')?.textContent).toBe('Functions');

    await answerContext();
    await answerPage(functionPage([plan, quote], { total: 2 }));

    expect(headerTexts()).toEqual(['Function', 'File', 'V(G)', 'ev(G)', 'Decisions', 'Lines', 'Band']);
    expect(cellTexts()).toEqual([
      ['planDispatch', 'src/dispatch-core/planDispatch.ts:23', '41, over the limit', '17', '40', '96', 'tangled'],
      ['PriceBook.quote, method', 'src/pricing/PriceBook.ts:8', '4', '1', '3', '12', 'calm'],
    ]);
    const link = page().querySelector('td a') as HTMLAnchorElement;
    expect(link.getAttribute('href')).toBe('/snapshots/s-1/functions/fn-plan');
    expect(page().querySelector('.subtitle')?.textContent).toContain('2 functions');
    expect(page().querySelector('.caution')?.textContent).toContain(
      'Limit 10 — a rule of thumb, not a verdict; teams commonly allow up to 15 with a reason.',
    );
  });

  it('should add coverage and CRAP when the snapshot has coverage', async () => {
    await open();
    await answerContext({ format: 'lcov', unmatchedFiles: [] });
    await answerPage(
      functionPage([
        functionRow({ outcomesCovered: 36, outcomesTotal: 80, crap: 320.676 }),
        functionRow({ id: 'fn-2', outcomesCovered: 0, outcomesTotal: 0, crap: 2, cyclomatic: 1, band: 'calm', overLimit: false }),
        functionRow({ id: 'fn-3', outcomesCovered: null, outcomesTotal: null, crap: null, cyclomatic: 2, band: 'calm', overLimit: false }),
      ]),
    );

    expect(headerTexts()).toEqual(['Function', 'File', 'V(G)', 'ev(G)', 'Decisions', 'Lines', 'Coverage', 'CRAP', 'Band']);
    expect(cellTexts().map((row) => row.slice(6, 8))).toEqual([
      ['45%', '320.7'],
      ['—', '2'],
      ['—', '—'],
    ]);
  });

  it('should open a deep link with its filters, sort and page, and show them', async () => {
    await open(`${BASE}?q=plan&band=busy&overLimit=true&cluster=c1&module=folder:src/orders&sort=loc&order=asc&page=2&pageSize=25`);
    await answerContext();
    const req = functionsRequest();
    const params = req.request.params;
    expect(['q', 'band', 'overLimit', 'cluster', 'module', 'sort', 'order', 'page', 'pageSize'].map((k) => params.get(k))).toEqual([
      'plan',
      'busy',
      'true',
      'c1',
      'folder:src/orders',
      'loc',
      'asc',
      '2',
      '25',
    ]);
    req.flush(functionPage(manyRows(25, 25), { total: 60, page: 2, pageSize: 25 }));
    await harness.fixture.whenStable();

    expect((page().querySelector('input[type="search"]') as HTMLInputElement).value).toBe('plan');
    expect(await (await loader.getHarness(MatChipOptionHarness.with({ text: /busy/ }))).isSelected()).toBe(true);
    expect(await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Over the limit' }))).isChecked()).toBe(true);
    expect(await (await loader.getHarness(MatSelectHarness)).getValueText()).toBe('c1 · mostly src/dispatch-core · 155 functions');
    expect(await (await loader.getHarness(MatAutocompleteHarness)).getValue()).toBe('folder src/orders');
    const sorted = await loader.getHarness(MatSortHeaderHarness.with({ label: 'Lines' }));
    expect(await sorted.getSortDirection()).toBe('asc');
    const paginator = await loader.getHarness(MatPaginatorHarness);
    expect(await paginator.getRangeLabel()).toBe('26 – 50 of 60');
    expect(await paginator.getPageSize()).toBe(25);
    expect(page().querySelector('.subtitle')?.textContent).toContain('60 functions match these filters');
  });

  it('should sort on the server when a header is clicked, keeping the sort in the URL', async () => {
    await open();
    await answerContext();
    await answerPage(functionPage([plan, quote]));

    await (await loader.getHarness(MatSortHeaderHarness.with({ label: 'V(G)' }))).click();
    expect(currentUrl()).toBe(`${BASE}?sort=cyclomatic&order=asc`);
    const req = functionsRequest();
    expect([req.request.params.get('sort'), req.request.params.get('order')]).toEqual(['cyclomatic', 'asc']);
    req.flush(functionPage([quote, plan], { order: 'asc' }));
    await harness.fixture.whenStable();
    expect(cellTexts()[0][0]).toContain('PriceBook.quote');

    // A new column starts in its natural order: names A–Z, figures highest first.
    await (await loader.getHarness(MatSortHeaderHarness.with({ label: 'Function' }))).click();
    expect(currentUrl()).toBe(`${BASE}?sort=name&order=asc`);
    await answerPage(functionPage([quote, plan]));
    await (await loader.getHarness(MatSortHeaderHarness.with({ label: 'ev(G)' }))).click();
    expect(currentUrl()).toBe(`${BASE}?sort=essential&order=desc`);
    await answerPage(functionPage([plan, quote]));
  });

  it('should search after typing pauses and go back to page 1', async () => {
    await open(`${BASE}?page=3`);
    await answerContext();
    await answerPage(functionPage(manyRows(50), { total: 400, page: 3 }));

    const input = page().querySelector('input[type="search"]') as HTMLInputElement;
    input.value = 'pla';
    input.dispatchEvent(new Event('input'));
    input.value = 'plan ';
    input.dispatchEvent(new Event('input'));
    http.expectNone((r) => r.url.endsWith('/functions'));
    await new Promise((resolve) => setTimeout(resolve, 350));
    await harness.fixture.whenStable();

    expect(currentUrl()).toBe(`${BASE}?q=plan`);
    const req = functionsRequest();
    expect(req.request.params.get('q')).toBe('plan');
    expect(req.request.params.get('page')).toBe('1');
    req.flush(functionPage([plan]));
    await harness.fixture.whenStable();
    // What the person typed stays as typed.
    expect(input.value).toBe('plan ');
  });

  it('should filter by band, limit, cluster and module through the URL', async () => {
    await open();
    await answerContext();
    await answerPage(functionPage([plan, quote]));

    await (await loader.getHarness(MatChipOptionHarness.with({ text: /knotted/ }))).select();
    expect(currentUrl()).toBe(`${BASE}?band=knotted`);
    await answerPage(functionPage([]));

    // The empty state offers to reset; the band chip stays in reach above it.
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Over the limit' }))).check();
    expect(currentUrl()).toBe(`${BASE}?band=knotted&overLimit=true`);
    await answerPage(functionPage([]));

    const cluster = await loader.getHarness(MatSelectHarness);
    await cluster.open();
    await cluster.clickOptions({ text: /^c1/ });
    expect(currentUrl()).toBe(`${BASE}?cluster=c1&band=knotted&overLimit=true`);
    await answerPage(functionPage([]));

    const moduleBox = await loader.getHarness(MatAutocompleteHarness);
    await moduleBox.enterText('dispatch');
    const options = await moduleBox.getOptions();
    expect(await Promise.all(options.map((o) => o.getText()))).toEqual(['src/dispatch-core · 155 fn']);
    await moduleBox.selectOption({ text: /dispatch-core/ });
    expect(currentUrl()).toBe(`${BASE}?module=folder:src%2Fdispatch-core&cluster=c1&band=knotted&overLimit=true`);
    await answerPage(functionPage([]));
  });

  it('should say when no function matches and reset the filters, keeping the sort', async () => {
    await open(`${BASE}?band=knotted&q=zzz&sort=loc&order=desc`);
    await answerContext();
    await answerPage(functionPage([], { total: 0 }));

    const status = page().querySelector('[role="status"]');
    expect(status?.textContent).toContain('No function matches these filters.');
    expect(page().querySelector('table')).toBeNull();
    (status?.querySelector('button') as HTMLButtonElement).click();
    await harness.fixture.whenStable();

    expect(currentUrl()).toBe(`${BASE}?sort=loc&order=desc`);
    await answerPage(functionPage([plan]));
    expect((page().querySelector('input[type="search"]') as HTMLInputElement).value).toBe('');
    expect(cellTexts()).toHaveLength(1);
  });

  it('should page through the server and move a link past the end to the last page', async () => {
    await open();
    await answerContext();
    await answerPage(functionPage(manyRows(50), { total: 120 }));

    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    expect(currentUrl()).toBe(`${BASE}?page=2`);
    await answerPage(functionPage(manyRows(50, 50), { total: 120, page: 2 }));

    await harness.navigateByUrl(`${BASE}?page=9`);
    functionsRequest().flush(functionPage([], { total: 120, page: 9 }));
    await harness.fixture.whenStable();
    expect(currentUrl()).toBe(`${BASE}?page=3`);
    await answerPage(functionPage(manyRows(20, 100), { total: 120, page: 3 }));
    expect(cellTexts()).toHaveLength(20);
  });

  it('should show why a snapshot that is not ready has no functions, and retry', async () => {
    await open();
    await answerContext();
    functionsRequest().flush(errorBody('snapshot_not_ready', 'This snapshot is still being analysed (42%).'), {
      status: 409,
      statusText: 'Conflict',
    });
    await harness.fixture.whenStable();

    const alert = page().querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('Could not load the functions. This snapshot is still being analysed (42%).');
    expect(alert?.querySelector('a')?.getAttribute('href')).toBe('/overview');
    // Without any page the filters are left out; the error is what matters.
    expect(page().querySelector('section.filters')).toBeNull();
    const retry = Array.from(alert?.querySelectorAll('button') ?? []).find((b) => b.textContent?.includes('Retry'));
    retry?.click();
    await harness.fixture.whenStable();
    await answerPage(functionPage([plan]));
    expect(page().querySelector('[role="alert"]')).toBeNull();
    expect(cellTexts()).toHaveLength(1);
  });

  it('should say when the module map is missing and disable those filters', async () => {
    await open();
    http.expectOne('/api/snapshots/s-1').flush({ snapshot: snapshot({ id: 's-1' }) });
    const noMap = errorBody('no_module_map', 'This snapshot was made without the call graph.');
    for (const req of http.match((r) => r.url.endsWith('/modules') || r.url.endsWith('/clusters'))) {
      if (!req.cancelled) req.flush(noMap, { status: 409, statusText: 'Conflict' });
    }
    await answerPage(functionPage([plan]));

    expect(page().querySelector('.hint')?.textContent).toContain('This snapshot was made without the call graph.');
    expect(await (await loader.getHarness(MatSelectHarness)).isDisabled()).toBe(true);
    expect(await (await loader.getHarness(MatAutocompleteHarness)).isDisabled()).toBe(true);
  });

  describe('CSV export', () => {
    let blobs: Blob[];
    let downloads: string[];
    const originalCreate = URL.createObjectURL;
    const originalRevoke = URL.revokeObjectURL;

    beforeEach(() => {
      blobs = [];
      downloads = [];
      URL.createObjectURL = (blob: Blob) => {
        blobs.push(blob);
        return 'blob:export';
      };
      URL.revokeObjectURL = () => undefined;
      jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
        downloads.push(this.download);
      });
    });

    afterEach(() => {
      URL.createObjectURL = originalCreate;
      URL.revokeObjectURL = originalRevoke;
      jest.restoreAllMocks();
    });

    function exportButton(): HTMLButtonElement {
      return Array.from(page().querySelectorAll('button')).find((b) => b.textContent?.includes('Export CSV')) as HTMLButtonElement;
    }

    it('should fetch every page of the filters with progress and download the CSV', async () => {
      await open(`${BASE}?band=calm&sort=name&order=asc`);
      await answerContext();
      await answerPage(functionPage(manyRows(50), { total: 620 }));

      exportButton().click();
      await harness.fixture.whenStable();
      expect(exportButton().disabled).toBe(true);
      const first = http.expectOne((r) => r.url.endsWith('/functions') && r.params.get('pageSize') === '500');
      expect(first.request.params.get('band')).toBe('calm');
      expect(first.request.params.get('sort')).toBe('name');
      first.flush(functionPage(manyRows(500), { total: 620, pageSize: 500 }));
      await harness.fixture.whenStable();
      expect(page().querySelector('.export-progress')?.textContent).toContain('Exporting 500 of 620 functions…');

      const second = http.expectOne((r) => r.url.endsWith('/functions') && r.params.get('page') === '2');
      second.flush(functionPage(manyRows(120, 500), { total: 620, page: 2, pageSize: 500 }));
      await harness.fixture.whenStable();

      expect(downloads).toEqual(['functions-v3.14.0-filtered.csv']);
      const text = await readText(blobs[0]);
      const lines = text.replace(/^\uFEFF/, '').split('\r\n');
      expect(lines[0]).toBe('id,qualifiedName,kind,file,line,endLine,cyclomatic,essential,decisions,loc,band,overLimit,cluster');
      expect(lines).toHaveLength(622);
      expect(lines[620]).toContain('fn-619,step619,');
      expect(page().querySelector('.export-progress')).toBeNull();
      expect(exportButton().disabled).toBe(false);
    });

    it('should explain when the filters match more rows than an export holds', async () => {
      await open();
      await answerContext();
      await answerPage(functionPage(manyRows(50), { total: 60_000 }));

      exportButton().click();
      await harness.fixture.whenStable();
      http
        .expectOne((r) => r.url.endsWith('/functions') && r.params.get('pageSize') === '500')
        .flush(functionPage(manyRows(500), { total: 60_000, pageSize: 500 }));
      await harness.fixture.whenStable();

      const alert = page().querySelector('[role="alert"]');
      expect(alert?.textContent).toContain('These filters match 60,000 functions; an export holds at most 50,000.');
      expect(downloads).toEqual([]);
    });
  });
});

function readText(blob: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(reader.result as string);
    reader.onerror = () => reject(reader.error);
    reader.readAsText(blob);
  });
}
