import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { errorBody, meResponse, UNAUTHENTICATED } from '../testing/api-fixtures';
import { nextMacrotask } from '../testing/next-macrotask';
import { redirectSignedIn } from './redirect-signed-in';

@Component({ template: 'stub page' })
class StubPage {}

describe('redirectSignedIn', () => {
  let harness: RouterTestingHarness;
  let http: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'sign-in', component: StubPage, canActivate: [redirectSignedIn] },
          { path: 'overview', component: StubPage },
        ]),
      ],
    });
    harness = await RouterTestingHarness.create();
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function openSignIn(status: number): Promise<string> {
    const navigation = harness.navigateByUrl('/sign-in');
    await nextMacrotask();
    const probe = http.expectOne('/api/me');
    if (status === 200) {
      probe.flush(meResponse());
    } else {
      probe.flush(errorBody('x', 'No.'), status === 401 ? UNAUTHENTICATED : { status, statusText: 'Error' });
    }
    await navigation;
    return TestBed.inject(Router).url;
  }

  it('should send people who are signed in to the Overview', async () => {
    expect(await openSignIn(200)).toBe('/overview');
  });

  it('should show the sign-in page without a session', async () => {
    expect(await openSignIn(401)).toBe('/sign-in');
  });

  it('should still show the sign-in page when the server fails', async () => {
    expect(await openSignIn(500)).toBe('/sign-in');
  });
});
