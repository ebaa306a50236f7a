import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { of } from 'rxjs';

import type { Codebase, Role } from '../api-types';
import { SessionStore } from '../auth/session-store';
import { codebase, errorBody, meResponse, snapshot } from '../testing/api-fixtures';
import { Overview } from './overview';
import { EVENT_SOURCE_FACTORY } from './snapshot-progress';
import { UploadDialog } from './upload-dialog';
import { FakeEventSource } from '../testing/fake-event-source';

describe('Overview', () => {
  let fixture: ComponentFixture<Overview>;
  let http: HttpTestingController;
  let sources: FakeEventSource[];
  let dialogOpen: jest.Mock;

  async function create(role: Role = 'architect'): Promise<void> {
    sources = [];
    dialogOpen = jest.fn(() => ({ afterClosed: () => of({ changed: true }) }));
    TestBed.configureTestingModule({
      imports: [Overview],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: MatDialog, useValue: { open: dialogOpen } },
        {
          provide: EVENT_SOURCE_FACTORY,
          useValue: (url: string) => {
            const source = new FakeEventSource(url);
            sources.push(source);
            return source;
          },
        },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(SessionStore).ensureLoaded().subscribe();
    http.expectOne('/api/me').flush(meResponse(role));
    fixture = TestBed.createComponent(Overview);
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  function page(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }

  async function answer(items: Codebase[]): Promise<void> {
    http.expectOne({ method: 'GET', url: '/api/codebases' }).flush({ items });
    await fixture.whenStable();
  }

  /** Answers the figure requests of the cards' latest ready snapshots. */
  function answerFigures(): void {
    for (const req of http.match((r) => r.url.endsWith('/functions'))) req.flush({ items: [], total: 1 });
    for (const req of http.match((r) => r.url.endsWith('/gravity'))) req.flush({ level: 'folder', modules: [] });
  }

  function uploadButton(): HTMLButtonElement | null {
    return Array.from(page().querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Upload a zip')) ?? null;
  }

  it('should show a progress bar while the codebases load', async () => {
    await create();
    expect(page().querySelector('mat-progress-bar')).not.toBeNull();
    expect(page().querySelector('h1')?.textContent).toBe('Overview');
    http.expectOne('/api/codebases');
  });

  it('should show one card per codebase', async () => {
    await create();
    await answer([codebase('dispatch-monolith', [snapshot({ id: 's-1' })]), codebase('billing', [])]);
    answerFigures();
    await fixture.whenStable();

    const names = Array.from(page().querySelectorAll('sl-codebase-summary h2')).map((h) => h.textContent?.trim());
    expect(names).toEqual(['dispatch-monolith', 'billing']);
    expect(page().querySelector('[aria-label="Loading codebases"]')).toBeNull();
  });

  it('should explain how to get started when there are no codebases', async () => {
    await create();
    await answer([]);

    expect(page().querySelector('sl-codebase-summary')).toBeNull();
    expect(page().querySelector('[role="status"]')?.textContent).toContain(
      'No codebases yet. Upload a zip or push a snapshot from CI to see your first analysis here.',
    );
  });

  it('should show the error and load again on Retry', async () => {
    await create();
    http
      .expectOne('/api/codebases')
      .flush(errorBody('internal', 'The database is not reachable.'), { status: 503, statusText: 'Unavailable' });
    await fixture.whenStable();

    const alert = page().querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('The database is not reachable.');
    alert?.querySelector('button')?.click();
    await fixture.whenStable();
    expect(page().querySelector('mat-progress-bar')).not.toBeNull();

    await answer([codebase('dispatch-monolith', [])]);
    expect(page().querySelector('[role="alert"]')).toBeNull();
    expect(page().querySelectorAll('sl-codebase-summary')).toHaveLength(1);
  });

  it.each(['owner', 'architect'] as const)('should let an %s open the upload dialog, then load the list again', async (role) => {
    await create(role);
    const items = [codebase('dispatch-monolith', [])];
    await answer(items);

    uploadButton()?.click();
    expect(dialogOpen).toHaveBeenCalledWith(UploadDialog, expect.objectContaining({ data: { codebases: items } }));
    await answer(items);
  });

  it.each(['reviewer', 'viewer'] as const)('should offer no upload to a %s', async (role) => {
    await create(role);
    await answer([]);

    expect(uploadButton()).toBeNull();
  });

  it('should follow an unfinished snapshot live, then load again for its figures once ready', async () => {
    await create();
    await answer([codebase('dispatch-monolith', [snapshot({ id: 'run', status: 'queued', progress: 0, totals: null })])]);

    expect(sources.map((s) => s.url)).toEqual(['/api/snapshots/run/events']);
    sources[0].emit('snapshot', snapshot({ id: 'run', status: 'running', progress: 55, phase: 'calls', totals: null }));
    await fixture.whenStable();
    expect(page().querySelector('sl-snapshot-status-label')?.textContent).toContain('running 55%');
    expect(page().querySelector('.phase')?.textContent?.trim()).toBe('Resolving calls and the module map');

    sources[0].emit('snapshot', snapshot({ id: 'run', status: 'ready' }));
    expect(sources[0].closed).toBe(true);
    await answer([codebase('dispatch-monolith', [snapshot({ id: 'run' })])]);
    answerFigures();
    await fixture.whenStable();
    expect(page().querySelector('sl-snapshot-status-label')?.textContent).toContain('ready');
    expect(sources).toHaveLength(1);
  });

  it('should stream at most two unfinished snapshots and poll the others, keeping the browser’s connections free', async () => {
    await create();
    const queued = (id: string) => snapshot({ id, status: 'queued', progress: 0, totals: null });
    await answer([codebase('dispatch-monolith', [queued('a'), queued('b')]), codebase('billing', [queued('c')])]);

    expect(sources.map((s) => s.url)).toEqual(['/api/snapshots/a/events', '/api/snapshots/b/events']);
    http.expectOne('/api/snapshots/c').flush({ snapshot: snapshot({ id: 'c', status: 'running', progress: 12, totals: null }) });
    await fixture.whenStable();
    const labels = Array.from(page().querySelectorAll('sl-snapshot-status-label > span')).map((l) => l.textContent?.trim());
    expect(labels).toEqual(['queued', 'queued', 'running 12%']);
    fixture.destroy();
    expect(sources.every((s) => s.closed)).toBe(true);
  });
});
