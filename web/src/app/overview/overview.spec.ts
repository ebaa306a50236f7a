import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';

import type { Codebase } from '../api-types';
import { codebase, errorBody, snapshot } from '../testing/api-fixtures';
import { Overview } from './overview';

describe('Overview', () => {
  let fixture: ComponentFixture<Overview>;
  let http: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [Overview],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Overview);
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  function page(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }

  async function answer(items: Codebase[]): Promise<void> {
    http.expectOne({ method: 'GET', url: '/api/codebases' }).flush({ items });
    await fixture.whenStable();
  }

  function cellTexts(): string[][] {
    return Array.from(page().querySelectorAll('tr.mat-mdc-row')).map((row) =>
      Array.from(row.querySelectorAll('td')).map((cell) => cell.textContent?.trim() ?? ''),
    );
  }

  it('should show a progress bar while the codebases load', () => {
    expect(page().querySelector('mat-progress-bar')).not.toBeNull();
    expect(page().querySelector('h1')?.textContent).toBe('Overview');
    http.expectOne('/api/codebases');
  });

  it('should list each snapshot with its status, commit, branch and totals', async () => {
    await answer([
      codebase('dispatch-monolith', [
        snapshot({ id: 's-2', status: 'running', progress: 42, totals: null, commit: 'f00dfeed1234', branch: 'split/billing' }),
        snapshot({ id: 's-1' }),
      ]),
    ]);

    expect(page().querySelector('mat-progress-bar')).toBeNull();
    const headers = Array.from(page().querySelectorAll('th')).map((th) => th.textContent?.trim());
    expect(headers).toEqual(['Codebase', 'Snapshot', 'Status', 'Commit', 'Branch', 'Functions', 'ΣV(G)', 'Decisions']);
    const [running, ready] = cellTexts();
    expect(running[0]).toBe('dispatch-monolith');
    expect(running[1]).toContain('28 Nov 2026');
    expect(running.slice(3)).toEqual(['f00dfee', 'split/billing', '—', '—', '—']);
    expect(ready.slice(3)).toEqual(['abc1234', 'main', '412', '1,290', '878']);
    // The state is written out, not only coloured.
    const states = Array.from(page().querySelectorAll('sl-snapshot-status-label > span'));
    expect(states.map((label) => label.textContent?.trim())).toEqual(['running 42%', 'ready']);
  });

  it('should say when a codebase has no snapshot yet', async () => {
    await answer([codebase('tracking', [])]);

    expect(cellTexts()[0].slice(0, 3)).toEqual(['tracking', 'No snapshot yet', '—']);
  });

  it('should explain how to get started when there are no codebases', async () => {
    await answer([]);

    expect(page().querySelector('table')).toBeNull();
    expect(page().querySelector('[role="status"]')?.textContent).toContain(
      'No codebases yet. Upload a zip or push a snapshot from CI to see your first analysis here.',
    );
  });

  it('should show the error and load again on Retry', async () => {
    http
      .expectOne('/api/codebases')
      .flush(errorBody('internal', 'The database is not reachable.'), { status: 503, statusText: 'Unavailable' });
    await fixture.whenStable();

    const alert = page().querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('The database is not reachable.');
    const retry = alert?.querySelector('button');
    expect(retry?.textContent).toContain('Retry');

    retry?.click();
    await fixture.whenStable();
    expect(page().querySelector('mat-progress-bar')).not.toBeNull();

    await answer([codebase('dispatch-monolith', [snapshot()])]);
    expect(page().querySelector('[role="alert"]')).toBeNull();
    expect(cellTexts()).toHaveLength(1);
  });
});
