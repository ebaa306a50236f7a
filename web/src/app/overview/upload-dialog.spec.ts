import { HttpBackend, HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import { EMPTY } from 'rxjs';

import { codebase, errorBody, snapshot } from '../testing/api-fixtures';
import { UPLOAD_BACKEND } from './codebases-api';
import { EVENT_SOURCE_FACTORY } from './snapshot-progress';
import { UploadDialog, UploadDialogData } from './upload-dialog';
import { FakeEventSource } from '../testing/fake-event-source';

describe('UploadDialog', () => {
  let fixture: ComponentFixture<UploadDialog>;
  let http: HttpTestingController;
  let sources: FakeEventSource[];
  let close: jest.Mock;
  const zip = new File(['PK\u0003\u0004 invented'], 'otterbay-before.zip', { type: 'application/zip' });

  beforeEach(async () => {
    sources = [];
    close = jest.fn();
    const data: UploadDialogData = {
      codebases: [codebase('otterbay-dispatch', [], 'cb-1'), codebase('otterbay-billing', [], 'cb-2')],
    };
    TestBed.configureTestingModule({
      imports: [UploadDialog],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: UPLOAD_BACKEND, useFactory: () => TestBed.inject(HttpBackend) },
        { provide: MAT_DIALOG_DATA, useValue: data },
        { provide: MatDialogRef, useValue: { close, beforeClosed: () => EMPTY } },
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
    document.cookie = 'XSRF-TOKEN=tok-123';
    fixture = TestBed.createComponent(UploadDialog);
    await fixture.whenStable();
  });

  afterEach(() => {
    http.verify();
    document.cookie = 'XSRF-TOKEN=; expires=Thu, 01 Jan 1970 00:00:00 GMT';
  });

  function host(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }

  function text(): string {
    return (host().textContent ?? '').replace(/\s+/g, ' ');
  }

  async function chooseFile(file: File): Promise<void> {
    const input = host().querySelector<HTMLInputElement>('input[type="file"]')!;
    Object.defineProperty(input, 'files', { configurable: true, value: { 0: file, length: 1, item: () => file } });
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  async function fill(label: RegExp, value: string): Promise<void> {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const inputs = await loader.getAllHarnesses(MatInputHarness);
    for (const input of inputs) {
      const id = await input.getId();
      const labelText = host().querySelector(`label[for="${id}"]`)?.textContent ?? '';
      if (label.test(labelText)) {
        await input.setValue(value);
        return;
      }
    }
    throw new Error(`no field labelled ${label}`);
  }

  async function submit(): Promise<void> {
    host().querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  }

  function expectUpload(codebaseId: string): TestRequest {
    return http.expectOne({ method: 'POST', url: `/api/codebases/${codebaseId}/snapshots` });
  }

  it('should send the zip with commit and branch, show the bytes sent, then follow the analysis to ready', async () => {
    await chooseFile(zip);
    expect(text()).toContain('otterbay-before.zip');
    await fill(/Commit/, 'v3.14.0');
    await fill(/Branch/, 'main');
    await submit();

    const req = expectUpload('cb-1');
    const body = req.request.body as FormData;
    expect(body.get('file')).toBeInstanceOf(File);
    expect((body.get('file') as File).name).toBe('otterbay-before.zip');
    expect(body.get('commit')).toBe('v3.14.0');
    expect(body.get('branch')).toBe('main');
    expect(req.request.headers.get('X-XSRF-TOKEN')).toBe('tok-123');
    expect(req.request.reportProgress).toBe(true);

    req.event({ type: HttpEventType.UploadProgress, loaded: 500, total: 1000 });
    await fixture.whenStable();
    expect(text()).toContain('Uploading the zip…');
    expect(text()).toContain('50% sent · 500 bytes of 1,000 bytes');

    const queued = snapshot({ id: 's-new', status: 'queued', progress: 0, phase: 'queued', totals: null });
    req.flush({ snapshot: queued, links: { status: '/api/snapshots/s-new', events: '/api/snapshots/s-new/events' } }, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    expect(sources.map((s) => s.url)).toEqual(['/api/snapshots/s-new/events']);
    expect(text()).toContain('Queued: Waiting for a worker');

    sources[0].emit('snapshot', { ...queued, status: 'running', progress: 40, phase: 'analyse' });
    await fixture.whenStable();
    expect(text()).toContain('Analysing: Measuring each function');
    expect(text()).toContain('40%');

    sources[0].emit('snapshot', snapshot({ id: 's-new', totals: { functions: 562, cyclomatic: 1263, decisions: 701 } }));
    await fixture.whenStable();
    expect(text()).toContain('The snapshot is ready.');
    expect(text()).toContain('562 functions, ΣV(G) 1,263.');
    const open = Array.from(host().querySelectorAll('a')).find((a) => a.textContent?.includes('Open functions'));
    expect(open?.getAttribute('href')).toBe('/snapshots/s-new/functions');

    Array.from(host().querySelectorAll('button')).find((b) => b.textContent?.includes('Close'))?.click();
    expect(close).toHaveBeenCalledWith({ changed: true });
  });

  it('should show the server’s refusal of the zip and keep the form for another try', async () => {
    await chooseFile(zip);
    await submit();

    expectUpload('cb-1').flush(
      errorBody('unsafe_entry', 'Refused zip entry "../x.ts": its ".." segments lead outside the zip\'s root.'),
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await fixture.whenStable();

    const alert = host().querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('The upload was refused. Refused zip entry "../x.ts"');
    expect(host().querySelector('button[type="submit"]')).not.toBeNull();
    expect(text()).toContain('otterbay-before.zip');
  });

  it('should show the reason when the analysis fails', async () => {
    await chooseFile(zip);
    await submit();
    expectUpload('cb-1').flush(
      { snapshot: snapshot({ id: 's-x', status: 'queued', totals: null }), links: {} },
      { status: 202, statusText: 'Accepted' },
    );
    sources[0].emit('snapshot', snapshot({ id: 's-x', status: 'failed', error: 'No TypeScript or JavaScript files in the zip.', totals: null }));
    await fixture.whenStable();

    expect(host().querySelector('[role="alert"]')?.textContent).toContain('No TypeScript or JavaScript files in the zip.');
  });

  it('should create a new codebase first when asked, then upload into it', async () => {
    const select = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness);
    await select.open();
    await select.clickOptions({ text: 'New codebase…' });
    await chooseFile(zip);
    await submit();
    expect(text()).toContain('Give the new codebase a name.');
    http.expectNone('/api/codebases');

    await fill(/Name of the new codebase/, 'otterbay-tracking');
    await submit();
    const create = http.expectOne({ method: 'POST', url: '/api/codebases' });
    expect(create.request.body).toEqual({ name: 'otterbay-tracking' });
    create.flush({ codebase: { id: 'cb-new', name: 'otterbay-tracking', description: '', createdAt: '2026-12-01T00:00:00Z' } }, { status: 201, statusText: 'Created' });

    expectUpload('cb-new').flush(
      errorBody('upload_too_large', 'The upload is larger than 200 MB, the limit, so nothing was kept.'),
      { status: 413, statusText: 'Payload Too Large' },
    );
    await fixture.whenStable();
    expect(text()).toContain('The upload is larger than 200 MB');
    // A second try goes into the codebase just made (the form is drawn anew after sending).
    const again = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness);
    expect(await again.getValueText()).toBe('otterbay-tracking');
    expect(host().querySelector('input[formcontrolname="newName"]')).toBeNull();
    Array.from(host().querySelectorAll('button')).find((b) => b.textContent?.includes('Cancel'))?.click();
    expect(close).toHaveBeenCalledWith({ changed: true });
  });

  it('should ask for a file and a well-formed commit before sending anything', async () => {
    await submit();
    expect(host().querySelector('[role="alert"]')?.textContent).toContain('Choose the zip to upload.');

    await chooseFile(zip);
    await fill(/Commit/, 'not a commit!');
    await submit();
    expect(text()).toContain('Letters, digits, dots, dashes and underscores; at most 64.');
    http.expectNone((req) => req.method === 'POST');

    Array.from(host().querySelectorAll('button')).find((b) => b.textContent?.includes('Cancel'))?.click();
    expect(close).toHaveBeenCalledWith({ changed: false });
  });
});
