import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, TestRequest } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { errorBody, snapshot } from '../testing/api-fixtures';
import { Gravity } from './gravity';
import { gravityModule, trend } from './gravity-fixtures';
import type { GravityModule, ModuleLevel } from './gravity-types';

@Component({ template: 'other screen' })
class OtherScreen {}

const SNAPSHOT = '077e89c3-bbbc-4e76-94da-7b2df6d979f2';
const SCREEN = `/snapshots/${SNAPSHOT}/gravity`;

describe('Gravity', () => {
  let harness: RouterTestingHarness;
  let http: HttpTestingController;
  let router: Router;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter(
          [
            { path: 'snapshots/:snapshotId/gravity', component: Gravity },
            { path: 'snapshots/:snapshotId/functions', component: OtherScreen },
            { path: 'snapshots/:snapshotId/atlas', component: OtherScreen },
          ],
          withComponentInputBinding(),
        ),
      ],
    });
    harness = await RouterTestingHarness.create();
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
  });

  afterEach(() => http.verify());

  /** Opens the screen and answers the subtitle's snapshot request. */
  async function open(url: string): Promise<void> {
    await harness.navigateByUrl(url);
    http.expectOne({ method: 'GET', url: `/api/snapshots/${SNAPSHOT}` }).flush({ snapshot: snapshot({ id: SNAPSHOT, commit: 'v3.14.0' }) });
    await harness.fixture.whenStable();
  }

  function page(): HTMLElement {
    return harness.routeNativeElement as HTMLElement;
  }

  function expectRanking(level: ModuleLevel, limit: number): TestRequest {
    return http.expectOne(
      (req) =>
        req.url === `/api/snapshots/${SNAPSHOT}/gravity` &&
        req.params.get('level') === level &&
        req.params.get('limit') === String(limit),
    );
  }

  async function answer(request: TestRequest, modules: GravityModule[]): Promise<void> {
    request.flush({ level: request.request.params.get('level'), modules });
    await harness.fixture.whenStable();
  }

  function modules(count: number, from = 1): GravityModule[] {
    return Array.from({ length: count }, (_, i) =>
      gravityModule({ id: `folder:src/m${from + i}`, path: `src/m${from + i}`, gravityRank: from + i, gravity: 90 - i }),
    );
  }

  function items(): HTMLElement[] {
    return Array.from(page().querySelectorAll<HTMLElement>('li.module'));
  }

  it('should ask for the top 20 folders and show progress meanwhile', async () => {
    await open(SCREEN);

    expect(page().querySelector('h1')?.textContent).toBe('Gravity');
    // Local time: the hour depends on the machine's time zone.
    expect(page().querySelector('.snapshot')?.textContent?.replace(/\s+/g, ' ').trim()).toMatch(
      /^Snapshot v3\.14\.0 on main, 2[89] Nov 2026, \d\d:\d\d$/,
    );
    expect(page().querySelector('mat-progress-bar')).not.toBeNull();
    expect(page().querySelector('.intro')?.textContent).toContain('not a verdict');
    // One more than shown, to know whether there are more.
    await answer(expectRanking('folder', 21), []);
    expect(page().querySelector('mat-progress-bar')).toBeNull();
  });

  it('should show each module with rank, score, reasons as sentences, figures and links', async () => {
    await open(SCREEN);
    await answer(expectRanking('folder', 21), [
      gravityModule({ reasons: ['called from 3 of 3 other clusters', 'only 45 % of its call weight stays in its cluster'] }),
      gravityModule({ id: 'package:packages/dispatch', path: 'packages/dispatch', name: '@otterbay/dispatch', gravityRank: 2, gravity: 53.4, instability: null }),
    ]);

    const [first, second] = items();
    expect(first.querySelector('h2')?.textContent?.replace(/\s+/g, ' ').trim()).toBe('Rank 1: src/dispatch-core');
    expect(first.querySelector('.score-value')?.textContent?.trim()).toBe('79.5 out of 100');
    expect((first.querySelector('.fill') as HTMLElement).style.width).toBe('79.5%');
    expect(Array.from(first.querySelectorAll('.reasons li')).map((li) => li.textContent)).toEqual([
      'Called from 3 of 3 other clusters.',
      'Only 45 % of its call weight stays in its cluster.',
    ]);
    const figures = Array.from(first.querySelectorAll('.figures > div')).map(
      (d) => `${d.querySelector('dt')?.textContent?.trim()} ${d.querySelector('dd')?.textContent?.trim()}`,
    );
    expect(figures).toEqual(['P 99', 'ΣV 303', 'Largest V(G) 41', 'Over the limit 5', 'Fan-in 33', 'Fan-out 120', 'I 0.47']);
    expect(second.querySelector('.package-name')?.textContent).toBe('@otterbay/dispatch');
    expect(second.querySelector('.figures > div:last-child dd')?.textContent).toBe('—');

    const links = Array.from(first.querySelectorAll('a')).map((a) => {
      const tree = router.parseUrl(a.getAttribute('href') ?? '');
      return { text: a.textContent?.replace(/\s+/g, ' ').trim(), path: tree.root.children['primary'].toString(), query: tree.queryParams };
    });
    expect(links).toEqual([
      {
        text: 'functions Functions in this module (src/dispatch-core)',
        path: `snapshots/${SNAPSHOT}/functions`,
        query: { module: 'folder:src/dispatch-core' },
      },
      {
        text: 'hub On the Atlas (src/dispatch-core)',
        path: `snapshots/${SNAPSHOT}/atlas`,
        query: { focus: 'folder:src/dispatch-core', level: 'folder' },
      },
    ]);
    expect(page().querySelector('.count')?.textContent?.trim()).toBe('All 2 folders by gravity');
    expect(page().querySelector('.more')).toBeNull();
  });

  it('should draw a sparkline for a module with earlier snapshots and call a module without them new', async () => {
    await open(SCREEN);
    await answer(expectRanking('folder', 21), [
      gravityModule({ trend: trend([70.1, 75], 79.5) }),
      gravityModule({ id: 'folder:src/shared', path: 'src/shared', gravityRank: 2 }),
      gravityModule({ id: 'folder:src/planner', path: 'src/planner', gravityRank: 3, trend: trend([null, null], 50.2) }),
    ]);

    const [withTrend, single, fresh] = items();
    const svg = withTrend.querySelector('svg[role="img"]');
    expect(svg?.getAttribute('aria-label')).toBe('Gravity rose from 70.1 to 79.5 over 3 snapshots');
    expect(svg?.querySelectorAll('circle').length).toBe(3);
    expect(withTrend.querySelector('.change')?.textContent).toBe('+9.4');
    expect(single.querySelector('svg')).toBeNull();
    expect(single.querySelector('sl-gravity-sparkline')?.textContent?.trim()).toBe('');
    expect(fresh.querySelector('svg')).toBeNull();
    expect(fresh.querySelector('sl-gravity-sparkline')?.textContent?.trim()).toBe('new: not in the 2 earlier snapshots');
  });

  it('should switch level through the URL and ask again from the top', async () => {
    await open(`${SCREEN}?limit=40`);
    await answer(expectRanking('folder', 41), modules(3));

    const toggles = Array.from(page().querySelectorAll<HTMLButtonElement>('mat-button-toggle button'));
    expect(toggles.map((b) => b.textContent?.trim())).toEqual(['file', 'folder', 'package']);
    expect(toggles.map((b) => b.getAttribute('aria-checked'))).toEqual(['false', 'true', 'false']);
    toggles[0].click();
    await harness.fixture.whenStable();

    expect(router.url).toBe(`${SCREEN}?level=file`);
    await answer(expectRanking('file', 21), [gravityModule({ id: 'file:src/a.ts', path: 'src/a.ts' })]);
    expect(items().map((li) => li.querySelector('.sl-mono')?.textContent)).toEqual(['src/a.ts']);
    const atlas = items()[0].querySelectorAll('a')[1].getAttribute('href');
    expect(atlas).toContain('level=file');
  });

  it('should read the level from the URL (a reload keeps it)', async () => {
    await open(`${SCREEN}?level=package`);

    await answer(expectRanking('package', 21), []);
    expect(page().querySelector('[role="status"]')?.textContent).toContain('no package level: no package was found below the codebase');
  });

  it('should show 20 more modules on "Show more", keeping the list and moving focus to the first new one', async () => {
    await open(SCREEN);
    await answer(expectRanking('folder', 21), modules(21));

    expect(items().length).toBe(20);
    expect(page().querySelector('.count')?.textContent?.trim()).toBe('Top 20 folders by gravity');
    const more = page().querySelector<HTMLButtonElement>('button.more');
    expect(more?.textContent).toContain('Show 20 more folders');
    more?.click();
    await harness.fixture.whenStable();

    expect(router.url).toBe(`${SCREEN}?limit=40`);
    const request = expectRanking('folder', 41);
    expect(items().length).toBe(20);
    expect(page().querySelector<HTMLButtonElement>('button.more')?.disabled).toBe(true);
    await answer(request, modules(30));
    expect(items().length).toBe(30);
    expect(page().querySelector('button.more')).toBeNull();
    await harness.fixture.whenStable();
    expect(document.activeElement).toBe(items()[20]);
  });

  it('should show the server message for a snapshot without the module map', async () => {
    await open(SCREEN);
    const message = 'This snapshot was made without the call graph (`seamline scan --no-calls`), so it has no modules, clusters or gravity.';
    expectRanking('folder', 21).flush(errorBody('no_module_map', message), { status: 409, statusText: 'Conflict' });
    await harness.fixture.whenStable();

    expect(page().querySelector('[role="status"] p')?.textContent?.trim()).toBe(message);
    expect(page().querySelector('[role="alert"]')).toBeNull();
    expect(items()).toEqual([]);
  });

  it('should offer Retry after a failure and ask again', async () => {
    await open(SCREEN);
    expectRanking('folder', 21).flush(null, { status: 502, statusText: 'Bad Gateway' });
    await harness.fixture.whenStable();

    const alert = page().querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('Could not load the gravity ranking. The server answered with status 502.');
    alert?.querySelector('button')?.click();
    await harness.fixture.whenStable();

    expect(page().querySelector('mat-progress-bar')).not.toBeNull();
    await answer(expectRanking('folder', 21), modules(1));
    expect(items().length).toBe(1);
    expect(page().querySelector('[role="alert"]')).toBeNull();
  });
});
