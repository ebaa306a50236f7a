import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { errorBody } from '../testing/api-fixtures';
import { nextMacrotask } from '../testing/next-macrotask';
import { Flow } from './flow';
import { loadVanDetail, loadVanRow } from './flow-fixtures';
import type { FunctionDetail } from './flow-types';

const URL = '/api/snapshots/s-1/functions/f-1';

describe('Flow', () => {
  let harness: RouterTestingHarness;
  let http: HttpTestingController;

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter(
          [
            { path: 'snapshots/:snapshotId/functions/:functionId', component: Flow },
            { path: 'snapshots/:snapshotId/functions', children: [] },
          ],
          withComponentInputBinding(),
        ),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => http.verify());

  function page(): HTMLElement {
    return harness.routeNativeElement as HTMLElement;
  }

  async function open(detail: FunctionDetail, url = '/snapshots/s-1/functions/f-1'): Promise<void> {
    await harness.navigateByUrl(url);
    http.expectOne({ method: 'GET', url: URL }).flush(detail);
    await settle();
  }

  async function settle(): Promise<void> {
    await harness.fixture.whenStable();
    await nextMacrotask();
    harness.detectChanges();
  }

  function text(selector: string): string {
    return page().querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  describe('while loading and on errors', () => {
    it('should show a progress bar while the function loads', async () => {
      await harness.navigateByUrl('/snapshots/s-1/functions/f-1');

      expect(page().querySelector('mat-progress-bar')).not.toBeNull();
      http.expectOne(URL);
    });

    it('should say when the function is not in the snapshot and link to Functions', async () => {
      await harness.navigateByUrl('/snapshots/s-1/functions/f-1');
      http.expectOne(URL).flush(errorBody('not_found', 'No such function in this snapshot.'), { status: 404, statusText: 'Not Found' });
      await settle();

      expect(text('[role="alert"]')).toBe('error No such function in this snapshot. It may have moved or been removed since; find it in the Functions table. Open Functions');
      expect(page().querySelector('[role="alert"] a')?.getAttribute('href')).toBe('/snapshots/s-1/functions');
    });

    it('should say when the snapshot is not ready and load again on Retry', async () => {
      await harness.navigateByUrl('/snapshots/s-1/functions/f-1');
      http
        .expectOne(URL)
        .flush(errorBody('snapshot_not_ready', 'This snapshot is running (40 %); its results appear when it is ready.'), {
          status: 409,
          statusText: 'Conflict',
        });
      await settle();
      expect(text('[role="alert"]')).toContain('This snapshot has no results yet. This snapshot is running (40 %)');

      page().querySelector<HTMLButtonElement>('[role="alert"] button')?.click();
      await settle();
      http.expectOne(URL).flush(loadVanDetail());
      await settle();
      expect(page().querySelector('[role="alert"]')).toBeNull();
      expect(text('h1')).toBe('loadVan');
    });
  });

  describe('with a loaded function', () => {
    it('should work V(G) out with the function’s own numbers, beside the caution', async () => {
      await open(loadVanDetail());

      expect(text('[data-testid="formula-graph"]')).toBe('V(G) = E − N + 2P = 8 − 7 + 2×1 = 3');
      expect(text('[data-testid="formula-decisions"]')).toBe('decisions + 1 = 2 + 1 = 3');
      expect(page().textContent).toContain('V(G) is a guide, not a verdict. The limit of 10 is a rule of thumb');
      expect(page().textContent).not.toContain('Reported under this snapshot');
      expect(text('.band')).toBe('V(G) 3 · calm (1–10)');
    });

    it('should show the reported V(G) when a switch is counted as one', async () => {
      const detail = loadVanDetail();
      detail.formula = { ...detail.formula, reported: 2 };
      await open(detail);

      expect(page().textContent).toContain('a switch counted as one decision): V(G) = 2');
    });

    it('should draw every block and edge, with outcome words and focusable, labelled blocks', async () => {
      await open(loadVanDetail());

      const blocks = page().querySelectorAll('svg g[data-block]');
      expect(blocks).toHaveLength(7);
      expect(page().querySelectorAll('svg path[data-edge]')).toHaveLength(8);
      expect(Array.from(page().querySelectorAll('.edge-label')).map((t) => t.textContent?.trim())).toEqual([
        'true', 'false', 'enter', 'leave',
      ]);
      const decision = page().querySelector('g[data-block="2"]');
      expect(decision?.getAttribute('tabindex')).toBe('0');
      expect(decision?.getAttribute('aria-label')).toBe('Decision 1, if on line 3: ready');
    });

    it('should mark decisions in the source with their kind and condition', async () => {
      await open(loadVanDetail());

      const marks = Array.from(page().querySelectorAll('mark.decision'));
      expect(marks.map((m) => m.textContent)).toEqual(['ready', 'queue']);
      expect(marks[1].getAttribute('title')).toBe('line 5: while loop — queue');
      expect(Array.from(page().querySelectorAll('.line .number')).map((n) => n.textContent)).toEqual(['2', '3', '4', '5', '6', '7', '8']);
    });

    it('should say so when the snapshot holds no source, and list the decisions by line', async () => {
      await open(loadVanDetail({ source: null }));

      expect(page().querySelector('sl-flow-source')).toBeNull();
      expect(page().textContent).toContain('This snapshot does not hold the function\'s source');
      expect(Array.from(page().querySelectorAll('.decision-table li')).map((li) => li.textContent?.trim())).toEqual([
        'line 3: if — ready',
        'line 5: while loop — queue',
      ]);
    });

    it('should say a structured function has ev(G) = 1, and name what keeps it higher otherwise', async () => {
      await open(loadVanDetail());
      expect(page().textContent).toContain('Structured: ev(G) = 1');

      await harness.navigateByUrl('/snapshots/s-1/functions/f-2');
      http
        .expectOne('/api/snapshots/s-1/functions/f-2')
        .flush(loadVanDetail({ function: loadVanRow({ essential: 3 }), essential: { value: 3, irreducibleDecisions: [1] } }));
      await settle();
      expect(page().textContent).toContain('ev(G) = 3');
      expect(Array.from(page().querySelectorAll('.decision-list li')).map((li) => li.textContent?.trim())).toEqual([
        'line 5: while loop — queue',
      ]);
    });
  });

  describe('basis paths', () => {
    it('should list each path with its description lines', async () => {
      await open(loadVanDetail());

      const paths = Array.from(page().querySelectorAll('.path'));
      expect(paths).toHaveLength(3);
      expect(paths[0].querySelector('mat-radio-button')?.textContent?.trim()).toBe('Path 1 (baseline)');
      expect(Array.from(paths[2].querySelectorAll('.steps li')).map((li) => li.textContent)).toEqual([
        'line 3: if (ready) → false',
        'line 5: while (queue) → enter loop',
        'line 5: while (queue) → leave loop',
      ]);
    });

    it('should highlight the chosen path on the graph and in the source, and keep it in the URL', async () => {
      await open(loadVanDetail());
      expect(page().querySelectorAll('.on-path')).toHaveLength(0);

      page().querySelectorAll<HTMLInputElement>('mat-radio-button input')[1].click();
      await settle();

      expect(TestBed.inject(Router).url).toBe('/snapshots/s-1/functions/f-1?path=2');
      const onPath = Array.from(page().querySelectorAll('g.block.on-path')).map((g) => g.getAttribute('data-block'));
      expect(onPath).toEqual(['0', '1', '2', '3', '4', '6']);
      const edges = Array.from(page().querySelectorAll('path.edge.on-path')).map((p) => p.getAttribute('data-edge'));
      expect(edges).toEqual(['0', '1', '2', '4', '6']);
      expect(Array.from(page().querySelectorAll('.line.on-path')).map((l) => l.getAttribute('data-line'))).toEqual(['2', '3', '4', '5']);
      expect(Array.from(page().querySelectorAll('.taken')).map((t) => t.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
        'selected path takes → true',
        'selected path takes → leave',
      ]);
      expect(page().querySelector('.path.selected')?.getAttribute('data-path')).toBe('2');
    });

    it('should open with the path named in the URL', async () => {
      await open(loadVanDetail(), '/snapshots/s-1/functions/f-1?path=3');

      expect(page().querySelector('.path.selected')?.getAttribute('data-path')).toBe('3');
      expect(page().querySelector('g.block.on-path[data-block="5"]')).not.toBeNull();
    });

    it('should keep ticked paths in this browser, per snapshot and function', async () => {
      await open(loadVanDetail());

      page().querySelectorAll<HTMLInputElement>('mat-checkbox input')[2].click();
      await settle();

      expect(text('.paths .panel-head .muted')).toBe('1 of 3 tested');
      expect(localStorage.getItem('seamline.flow.tested.s-1.f-1')).toBe('[2]');
    });
  });

  describe('with coverage', () => {
    const covered = (): FunctionDetail =>
      loadVanDetail({
        coverage: { outcomes: [[true, false], [true, true]], outcomesCovered: 3, outcomesTotal: 4, actualComplexity: 2, untestedPaths: 1, crap: 3.02 },
      });

    it('should show covered outcomes, AC, untested paths and CRAP', async () => {
      await open(covered());

      const terms = Array.from(page().querySelectorAll('.facts dt')).map((dt) => dt.textContent?.trim());
      const values = Array.from(page().querySelectorAll('.facts dd')).map((dd) => dd.textContent?.replace(/\s+/g, ' ').trim());
      expect(terms).toEqual(['Outcomes covered', 'AC', 'Untested paths', 'CRAP']);
      expect(values).toEqual(['3 of 4 (75%)', '2', 'V − AC = 3 − 2 = 1', '3']);
    });

    it('should mark covered and uncovered outcomes on the edges and in the source', async () => {
      await open(covered());

      expect(page().querySelectorAll('path.edge.covered')).toHaveLength(3);
      expect(Array.from(page().querySelectorAll('path.edge.not-covered')).map((p) => p.getAttribute('data-edge'))).toEqual(['3']);
      const marks = Array.from(page().querySelectorAll('.outcome')).map((o) => o.getAttribute('title'));
      expect(marks).toEqual(['true: covered by tests', 'false: not covered', 'enter: covered by tests', 'leave: covered by tests']);
      expect(Array.from(page().querySelectorAll('.path-coverage')).map((c) => c.textContent?.trim())).toEqual([
        '1/2 covered', '2/2 covered', '2/3 covered',
      ]);
    });

    it('should say when no coverage was imported', async () => {
      await open(loadVanDetail());

      expect(page().textContent).toContain('No coverage report was imported for this snapshot.');
      expect(page().querySelectorAll('path.edge.covered, path.edge.not-covered')).toHaveLength(0);
    });
  });
});
