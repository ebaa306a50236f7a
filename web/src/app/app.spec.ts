import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatIconRegistry } from '@angular/material/icon';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { appConfig } from './app.config';
import { errorBody, meResponse, UNAUTHENTICATED } from './testing/api-fixtures';
import { nextMacrotask } from './testing/next-macrotask';

describe('App (configuration and routes)', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [...appConfig.providers, provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  /** Opens `url` as a fresh page load would, with a session. */
  async function openSignedIn(url: string): Promise<RouterTestingHarness> {
    const harness = await RouterTestingHarness.create();
    const navigation = harness.navigateByUrl(url);
    await nextMacrotask();
    const probe = http.expectOne('/api/me');
    probe.flush(meResponse('viewer'));
    await navigation;
    // Lazy screens load asynchronously; let them render.
    await nextMacrotask();
    await harness.fixture.whenStable();
    return harness;
  }

  it('should render icons with the locally shipped Material Symbols Outlined font', () => {
    expect(TestBed.inject(MatIconRegistry).getDefaultFontSetClass()).toEqual(['material-symbols-outlined']);
  });

  it('should keep a deep link to /overview for a signed-in person', async () => {
    const harness = await openSignedIn('/overview');

    expect(TestBed.inject(Router).url).toBe('/overview');
    expect(harness.routeNativeElement?.querySelector('main h1')?.textContent).toBe('Overview');
    http.expectOne('/api/codebases');
  });

  it('should open the Overview from the root path', async () => {
    await openSignedIn('/');

    expect(TestBed.inject(Router).url).toBe('/overview');
    http.expectOne('/api/codebases');
  });

  it('should send a deep link without a session to /sign-in', async () => {
    const harness = await RouterTestingHarness.create();
    const navigation = harness.navigateByUrl('/overview');
    await nextMacrotask();
    http.expectOne('/api/me').flush(errorBody('unauthenticated', 'Sign in to continue.'), UNAUTHENTICATED);
    await nextMacrotask();
    // The redirect's own guard checks the session once more before the sign-in page shows.
    http.expectOne('/api/me').flush(errorBody('unauthenticated', 'Sign in to continue.'), UNAUTHENTICATED);
    await navigation;

    expect(TestBed.inject(Router).url).toBe('/sign-in');
  });
});
