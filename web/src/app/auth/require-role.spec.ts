import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { errorBody, meResponse, UNAUTHENTICATED } from '../testing/api-fixtures';
import { nextMacrotask } from '../testing/next-macrotask';
import { requireRole } from './require-role';
import { requireSession } from './require-session';

@Component({ template: 'stub page' })
class StubPage {}

describe('requireRole and requireSession', () => {
  let harness: RouterTestingHarness;
  let http: HttpTestingController;
  let router: Router;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'sign-in', component: StubPage },
          { path: 'overview', component: StubPage },
          { path: 'private', component: StubPage, canActivate: [requireSession] },
          { path: 'planning', component: StubPage, canActivate: [requireRole('owner', 'architect')] },
        ]),
      ],
    });
    harness = await RouterTestingHarness.create();
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
  });

  afterEach(() => http.verify());

  /** Starts a navigation, answers the session probe with `answer`, and waits for the result. */
  async function navigateAnswering(url: string, answer: (probe: ReturnType<HttpTestingController['expectOne']>) => void) {
    const navigation = harness.navigateByUrl(url);
    await nextMacrotask();
    answer(http.expectOne('/api/me'));
    await navigation;
    return router.url;
  }

  it('should send people without a session (401) to /sign-in', async () => {
    const url = await navigateAnswering('/private', (probe) =>
      probe.flush(errorBody('unauthenticated', 'Sign in to continue.'), UNAUTHENTICATED),
    );
    expect(url).toBe('/sign-in');
  });

  it('should let any signed-in role in when only a session is required', async () => {
    const url = await navigateAnswering('/private', (probe) => probe.flush(meResponse('viewer')));
    expect(url).toBe('/private');
  });

  it('should let a listed role in', async () => {
    const url = await navigateAnswering('/planning', (probe) => probe.flush(meResponse('architect')));
    expect(url).toBe('/planning');
  });

  it('should send a role that is not listed to the Overview', async () => {
    const url = await navigateAnswering('/planning', (probe) => probe.flush(meResponse('reviewer')));
    expect(url).toBe('/overview');
  });

  it('should go to /sign-in with the reason when the session check fails otherwise', async () => {
    const url = await navigateAnswering('/private', (probe) =>
      probe.flush(errorBody('internal', 'Database unavailable.'), { status: 503, statusText: 'Unavailable' }),
    );
    expect(url).toBe('/sign-in?error=Database%20unavailable.');
  });

  it('should not ask the server again once the session is known', async () => {
    await navigateAnswering('/private', (probe) => probe.flush(meResponse('owner')));

    await harness.navigateByUrl('/planning');
    http.expectNone('/api/me');
    expect(router.url).toBe('/planning');
  });
});
