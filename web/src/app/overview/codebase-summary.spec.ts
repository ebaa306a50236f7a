import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, TestRequest } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { Codebase } from '../api-types';
import { codebase, errorBody, snapshot } from '../testing/api-fixtures';
import { CodebaseSummary } from './codebase-summary';
import type { GravityModule } from './snapshot-figures-api';

/** Test data: the invented Otterbay dispatch codebase. */
function gravityModule(rank: number, path: string, gravity: number): GravityModule {
  return {
    id: `folder:${path}`,
    level: 'folder',
    path,
    name: null,
    functions: 40,
    cyclomatic: 120,
    gravity,
    gravityRank: rank,
    reasons: [`calls into ${4 - rank} of 3 other clusters`, 'ΣV 120'],
  };
}

const READY = snapshot({
  id: 'ready-1',
  commit: 'v4.0.0',
  hasModuleMap: true,
  settings: { limit: 10, switch: 'cases' },
  totals: { functions: 618, cyclomatic: 1322, decisions: 704, overLimit: 15, modularity: 0.5474 },
});

describe('CodebaseSummary', () => {
  let fixture: ComponentFixture<CodebaseSummary>;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function render(value: Codebase): Promise<HTMLElement> {
    fixture = TestBed.createComponent(CodebaseSummary);
    fixture.componentRef.setInput('codebase', value);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  function bandRequests(id: string): TestRequest[] {
    return ['calm', 'busy', 'tangled', 'knotted'].map((band) =>
      http.expectOne(
        (req) =>
          req.url === `/api/snapshots/${id}/functions` &&
          req.params.get('band') === band &&
          req.params.get('pageSize') === '1',
      ),
    );
  }

  function gravityRequest(id: string): TestRequest {
    return http.expectOne(
      (req) =>
        req.url === `/api/snapshots/${id}/gravity` && req.params.get('level') === 'folder' && req.params.get('limit') === '3',
    );
  }

  async function answerAll(id = 'ready-1'): Promise<void> {
    bandRequests(id).forEach((req, i) => req.flush({ items: [], total: [603, 14, 1, 0][i], page: 1, pageSize: 1 }));
    gravityRequest(id).flush({
      level: 'folder',
      modules: [
        gravityModule(1, 'packages/planner/src', 50.2),
        gravityModule(2, 'packages/dispatch/src/dispatch-core', 49.7),
        gravityModule(3, 'packages/dispatch/src/orders', 40.5),
      ],
    });
    await fixture.whenStable();
  }

  function figures(host: HTMLElement): Record<string, string> {
    return Object.fromEntries(
      Array.from(host.querySelectorAll('.figure')).map((figure) => [
        figure.querySelector('dt')?.textContent?.replace(/\s+/g, ' ').trim(),
        figure.querySelector('dd')?.textContent?.trim(),
      ]),
    );
  }

  it('should show the latest ready snapshot’s headline figures with the ΣV − Σπ = P identity and the caution', async () => {
    const host = await render(
      codebase('otterbay-dispatch', [snapshot({ id: 'run', status: 'running', progress: 30, totals: null }), READY]),
    );
    await answerAll();

    expect(host.querySelector('h2')?.textContent?.trim()).toBe('otterbay-dispatch');
    expect(figures(host)).toEqual({
      'Functions P': '618',
      'ΣV(G)': '1,322',
      'Σ decisions π': '704',
      'Functions over the limit (V(G) > 10)': '15',
      'Modularity Q': '0.55',
    });
    expect(host.querySelector('.identity')?.textContent).toContain('ΣV − Σπ = 1,322 − 704 = 618 = P');
    expect(host.querySelector('.caution')?.textContent).toContain('the limit of 10 is a rule of thumb');
  });

  it('should draw the band histogram from four one-row function pages', async () => {
    const host = await render(codebase('otterbay-dispatch', [READY]));
    expect(host.querySelector('mat-progress-bar[aria-label="Loading the V(G) histogram"]')).not.toBeNull();

    await answerAll();

    const rows = Array.from(host.querySelectorAll('sl-band-histogram tbody tr')).map((row) =>
      Array.from(row.querySelectorAll('th, td')).map((cell) => cell.textContent?.trim()),
    );
    expect(rows.map((row) => [row[0], row[2]])).toEqual([
      ['calm', '603'],
      ['busy', '14'],
      ['tangled', '1'],
      ['knotted', '0'],
    ]);
  });

  it('should list the three modules of highest gravity, each with its first reason', async () => {
    const host = await render(codebase('otterbay-dispatch', [READY]));
    await answerAll();

    const items = Array.from(host.querySelectorAll('.gravity li')).map((li) => ({
      path: li.querySelector('.module-path')?.textContent?.trim(),
      gravity: li.querySelector('.module-gravity')?.textContent?.trim(),
      reason: li.querySelector('.module-reason')?.textContent?.trim(),
    }));
    expect(items).toEqual([
      { path: 'packages/planner/src', gravity: 'gravity 50.2', reason: 'calls into 3 of 3 other clusters' },
      { path: 'packages/dispatch/src/dispatch-core', gravity: 'gravity 49.7', reason: 'calls into 2 of 3 other clusters' },
      { path: 'packages/dispatch/src/orders', gravity: 'gravity 40.5', reason: 'calls into 1 of 3 other clusters' },
    ]);
  });

  it('should link each ready snapshot to its screens and show progress or the reason for the others', async () => {
    const host = await render(
      codebase('otterbay-dispatch', [
        snapshot({ id: 'run', status: 'running', progress: 30, phase: 'analyse', totals: null }),
        snapshot({ id: 'bad', status: 'failed', error: 'No TypeScript or JavaScript files in the zip.', totals: null }),
        READY,
      ]),
    );
    await answerAll();

    const rows = Array.from(host.querySelectorAll('tr.mat-mdc-row'));
    expect(rows).toHaveLength(3);
    expect(rows[0].querySelector('.status-cell')?.textContent).toContain('running 30%');
    expect(rows[0].querySelector('.phase')?.textContent?.trim()).toBe('Measuring each function');
    expect(rows[1].querySelector('.reason')?.textContent?.trim()).toBe('No TypeScript or JavaScript files in the zip.');
    expect(rows[0].querySelectorAll('a')).toHaveLength(0);
    const links = Array.from(rows[2].querySelectorAll('a')).map((a) => [a.textContent?.trim(), a.getAttribute('href'), a.getAttribute('aria-label')]);
    expect(links).toEqual([
      ['Functions', '/snapshots/ready-1/functions', 'Functions of commit v4.0.0'],
      ['Gravity', '/snapshots/ready-1/gravity', 'Gravity of commit v4.0.0'],
      ['Atlas', '/snapshots/ready-1/atlas', 'Atlas of commit v4.0.0'],
    ]);
  });

  it('should skip gravity for a snapshot made without the call graph, and say why', async () => {
    const host = await render(
      codebase('otterbay-dispatch', [snapshot({ id: 'flat', hasModuleMap: false, totals: { functions: 5, cyclomatic: 9, decisions: 4 } })]),
    );
    bandRequests('flat').forEach((req) => req.flush({ items: [], total: 1 }));
    http.expectNone((req) => req.url.endsWith('/gravity'));
    await fixture.whenStable();

    expect(host.textContent).toContain('made without the call graph');
    expect(figures(host)['Modularity Q']).toBe('—');
    expect(figures(host)['Functions over the limit (V(G) > 10)']).toBe('—');
    const open = Array.from(host.querySelectorAll('.open-latest a')).map((a) => a.textContent?.trim());
    expect(open).toEqual(['Functions']);
  });

  it('should show a failed panel with the server’s message and load it again on Try again', async () => {
    const host = await render(codebase('otterbay-dispatch', [READY]));
    bandRequests('ready-1')[0].flush(errorBody('internal', 'The database is not reachable.'), {
      status: 503,
      statusText: 'Unavailable',
    });
    gravityRequest('ready-1').flush({ level: 'folder', modules: [] });
    await fixture.whenStable();

    const alert = host.querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('Could not load the histogram. The database is not reachable.');
    expect(host.textContent).toContain('No modules to rank.');

    alert?.querySelector('button')?.click();
    await fixture.whenStable();
    await answerAll();
    expect(host.querySelector('[role="alert"]')).toBeNull();
    expect(host.querySelectorAll('sl-band-histogram tbody tr')).toHaveLength(4);
  });

  it('should not load again when only an unfinished snapshot of the list changes', async () => {
    await render(codebase('otterbay-dispatch', [snapshot({ id: 'run', status: 'running', progress: 10, totals: null }), READY]));
    await answerAll();

    fixture.componentRef.setInput(
      'codebase',
      codebase('otterbay-dispatch', [snapshot({ id: 'run', status: 'running', progress: 70, totals: null }), { ...READY }]),
    );
    await fixture.whenStable();
    http.expectNone((req) => req.url.startsWith('/api/snapshots/'));
  });

  it('should say there is nothing ready yet for a codebase without a ready snapshot', async () => {
    const host = await render(codebase('tracking', [snapshot({ id: 'q', status: 'queued', progress: 0, phase: 'queued', totals: null })]));

    expect(host.querySelector('.no-ready')?.textContent).toContain('No ready snapshot yet');
    expect(host.querySelector('.phase')?.textContent?.trim()).toBe('Waiting for a worker');
    http.expectNone((req) => req.url.startsWith('/api/snapshots/'));
  });

  it('should say so when a codebase has no snapshot at all', async () => {
    const host = await render(codebase('billing', []));

    expect(host.querySelector('table')).toBeNull();
    expect(host.textContent).toContain('No snapshot yet. Upload a zip or push a snapshot from CI.');
  });
});
