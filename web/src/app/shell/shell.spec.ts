import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { firstValueFrom } from 'rxjs';

import { SessionStore } from '../auth/session-store';
import { errorBody, meResponse } from '../testing/api-fixtures';
import { nextMacrotask } from '../testing/next-macrotask';
import { Shell } from './shell';

@Component({ template: '<p>screen content</p>' })
class StubScreen {}

describe('Shell', () => {
  let harness: RouterTestingHarness;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'sign-in', component: StubScreen },
          { path: '', component: Shell, children: [{ path: 'overview', component: StubScreen }] },
        ]),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const loaded = firstValueFrom(TestBed.inject(SessionStore).load());
    http.expectOne('/api/me').flush(meResponse('architect'));
    await loaded;

    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/overview');
    page = harness.fixture.nativeElement as HTMLElement;
  });

  afterEach(() => http.verify());

  function signOutButton(): HTMLButtonElement {
    const button = Array.from(page.querySelectorAll('button')).find((b) => b.textContent?.includes('Sign out'));
    if (!button) {
      throw new Error('No "Sign out" button');
    }
    return button;
  }

  it('should show the product, the workspace and who is signed in with which role', () => {
    const toolbar = page.querySelector('mat-toolbar')?.textContent ?? '';

    expect(toolbar).toContain('Seamline');
    expect(toolbar).toContain('Otterbay Parcel Co.');
    expect(page.querySelector('.person-name')?.textContent).toBe('Ada Lovelace');
    expect(page.querySelector('.role')?.textContent).toBe(', role architect');
    expect(page.querySelector('.person')?.getAttribute('title')).toBe('ada@otterbay.example');
  });

  it('should offer the Overview in a labelled navigation, marked as the current page', () => {
    const nav = page.querySelector('nav[aria-label="Screens"]');
    const links = Array.from(nav?.querySelectorAll('a[href]') ?? []);

    expect(links.map((link) => link.textContent?.trim())).toEqual(['dashboardOverview']);
    expect(links[0].getAttribute('href')).toBe('/overview');
    expect(links[0].getAttribute('aria-current')).toBe('page');
  });

  it('should show snapshot screens as disabled entries while no snapshot is in view', () => {
    const disabled = Array.from(page.querySelectorAll('nav[aria-label="Screens"] a[aria-disabled="true"]'));

    expect(disabled.length).toBeGreaterThan(0);
    expect(disabled.every((entry) => !entry.hasAttribute('href'))).toBe(true);
    expect(disabled[0].getAttribute('title')).toMatch(/^Open a ready snapshot from the Overview/);
  });

  it('should render the routed screen inside the main landmark', () => {
    expect(page.querySelector('main')?.textContent).toContain('screen content');
  });

  it('should sign out on the server, then go to /sign-in', async () => {
    signOutButton().click();
    await harness.fixture.whenStable();
    expect(signOutButton().disabled).toBe(true);

    http.expectOne({ method: 'POST', url: '/api/auth/logout' }).flush(null, { status: 204, statusText: 'No Content' });
    await nextMacrotask();

    expect(TestBed.inject(Router).url).toBe('/sign-in');
    expect(TestBed.inject(SessionStore).isSignedIn()).toBe(false);
  });

  it('should stay and say so when signing out fails', async () => {
    signOutButton().click();
    http
      .expectOne('/api/auth/logout')
      .flush(errorBody('internal', 'Session store unavailable.'), { status: 500, statusText: 'Error' });
    await harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/overview');
    expect(document.body.textContent).toContain('Could not sign out. Session store unavailable.');
    expect(signOutButton().disabled).toBe(false);
  });
});
