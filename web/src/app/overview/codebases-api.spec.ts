import { HttpBackend, HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { codebase, snapshot } from '../testing/api-fixtures';
import { CodebasesApi, UPLOAD_BACKEND, UploadEvent } from './codebases-api';

describe('CodebasesApi', () => {
  let api: CodebasesApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: UPLOAD_BACKEND, useFactory: () => TestBed.inject(HttpBackend) },
      ],
    });
    api = TestBed.inject(CodebasesApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should list the codebases from the items of the answer', () => {
    let names: string[] = [];
    api.list().subscribe((items) => (names = items.map((c) => c.name)));
    http.expectOne('/api/codebases').flush({ items: [codebase('otterbay-dispatch', [])] });
    expect(names).toEqual(['otterbay-dispatch']);
  });

  it('should create a codebase and give it an empty snapshot list', () => {
    let created: unknown;
    api.create('otterbay-tracking').subscribe((value) => (created = value));
    const req = http.expectOne({ method: 'POST', url: '/api/codebases' });
    expect(req.request.body).toEqual({ name: 'otterbay-tracking' });
    req.flush({ codebase: { id: 'cb-9', name: 'otterbay-tracking', description: '', createdAt: '2026-12-01T00:00:00Z' } });
    expect(created).toEqual({ id: 'cb-9', name: 'otterbay-tracking', description: '', createdAt: '2026-12-01T00:00:00Z', snapshots: [] });
  });

  it('should report bytes sent, then the queued snapshot, and leave out empty labels', () => {
    const events: UploadEvent[] = [];
    api.upload('cb 1', new Blob(['zip']), { commit: '', branch: 'main' }).subscribe((event) => events.push(event));

    const req = http.expectOne({ method: 'POST', url: '/api/codebases/cb%201/snapshots' });
    const form = req.request.body as FormData;
    expect(form.has('commit')).toBe(false);
    expect(form.get('branch')).toBe('main');
    expect((form.get('file') as File).name).toBe('upload.zip');
    req.event({ type: HttpEventType.Sent });
    req.event({ type: HttpEventType.UploadProgress, loaded: 3 });
    req.flush({ snapshot: snapshot({ id: 's-5', status: 'queued', totals: null }), links: {} }, { status: 202, statusText: 'Accepted' });

    expect(events.map((e) => (e.kind === 'sending' ? `sending ${e.loaded}/${e.total}` : `queued ${e.snapshot.id}`))).toEqual([
      'sending 3/null',
      'queued s-5',
    ]);
  });
});
