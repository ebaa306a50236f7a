import { HttpErrorResponse, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';

import { errorBody, meResponse, UNAUTHENTICATED } from '../testing/api-fixtures';
import { SessionStore } from './session-store';

describe('SessionStore', () => {
  let store: SessionStore;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    store = TestBed.inject(SessionStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  describe('load', () => {
    it('should keep the person, workspace and role from GET /api/me', async () => {
      const loaded = firstValueFrom(store.load());
      http.expectOne({ method: 'GET', url: '/api/me' }).flush(meResponse('reviewer'));

      expect(await loaded).toEqual(meResponse('reviewer'));
      expect(store.isSignedIn()).toBe(true);
      expect(store.user()?.displayName).toBe('Ada Lovelace');
      expect(store.workspace()?.name).toBe('Otterbay Parcel Co.');
      expect(store.role()).toBe('reviewer');
    });

    it('should answer null and forget a known session on 401', async () => {
      const first = firstValueFrom(store.load());
      http.expectOne('/api/me').flush(meResponse());
      await first;

      const second = firstValueFrom(store.load());
      http.expectOne('/api/me').flush(errorBody('unauthenticated', 'Sign in to continue.'), UNAUTHENTICATED);

      expect(await second).toBeNull();
      expect(store.isSignedIn()).toBe(false);
      expect(store.role()).toBeNull();
    });

    it('should pass other errors on', async () => {
      const loaded = firstValueFrom(store.load());
      http.expectOne('/api/me').flush(errorBody('internal', 'Database down.'), { status: 500, statusText: 'Error' });

      await expect(loaded).rejects.toBeInstanceOf(HttpErrorResponse);
      await expect(loaded).rejects.toMatchObject({ status: 500 });
    });
  });

  describe('ensureLoaded', () => {
    it('should ask the server only while no session is known', async () => {
      const first = firstValueFrom(store.ensureLoaded());
      http.expectOne('/api/me').flush(meResponse());
      await first;

      expect(await firstValueFrom(store.ensureLoaded())).toEqual(meResponse());
      http.expectNone('/api/me');
    });
  });

  describe('signOut', () => {
    it('should POST /api/auth/logout and then forget the session', async () => {
      const loaded = firstValueFrom(store.load());
      http.expectOne('/api/me').flush(meResponse());
      await loaded;

      const signedOut = firstValueFrom(store.signOut(), { defaultValue: undefined });
      const request = http.expectOne({ method: 'POST', url: '/api/auth/logout' });
      expect(store.isSignedIn()).toBe(true);
      request.flush(null, { status: 204, statusText: 'No Content' });
      await signedOut;

      expect(store.isSignedIn()).toBe(false);
    });
  });
});
