import { HttpClient, HttpErrorResponse, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import { errorBody, meResponse, UNAUTHENTICATED } from '../testing/api-fixtures';
import { SessionStore } from './session-store';
import { unauthorizedInterceptor } from './unauthorized-interceptor';

describe('unauthorizedInterceptor', () => {
  let client: HttpClient;
  let http: HttpTestingController;
  let session: SessionStore;
  let navigateByUrl: jest.SpyInstance;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([unauthorizedInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
      ],
    });
    client = TestBed.inject(HttpClient);
    http = TestBed.inject(HttpTestingController);
    session = TestBed.inject(SessionStore);
    navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);

    const loaded = firstValueFrom(session.load());
    http.expectOne('/api/me').flush(meResponse());
    await loaded;
  });

  afterEach(() => http.verify());

  /** Sends GET `url`, answers it with `status`, and returns the error the caller saw. */
  async function failedGet(url: string, status: number): Promise<unknown> {
    const response = firstValueFrom(client.get(url));
    const init = status === 401 ? UNAUTHENTICATED : { status, statusText: 'Error' };
    http.expectOne(url).flush(errorBody('x', 'Failed.'), init);
    return response.then(
      () => 'no error',
      (error: unknown) => error,
    );
  }

  it('should forget the session and go to /sign-in when an API call answers 401', async () => {
    const error = await failedGet('/api/codebases', 401);

    expect(error).toBeInstanceOf(HttpErrorResponse);
    expect(session.isSignedIn()).toBe(false);
    expect(navigateByUrl).toHaveBeenCalledWith('/sign-in');
  });

  it('should leave the 401 of the session probe to the guards', async () => {
    await failedGet('/api/me', 401);

    expect(navigateByUrl).not.toHaveBeenCalled();
  });

  it('should not act on other errors', async () => {
    const error = await failedGet('/api/codebases', 500);

    expect(error).toMatchObject({ status: 500 });
    expect(session.isSignedIn()).toBe(true);
    expect(navigateByUrl).not.toHaveBeenCalled();
  });

  it('should ignore 401s from outside the API', async () => {
    await failedGet('/assets/private.json', 401);

    expect(session.isSignedIn()).toBe(true);
    expect(navigateByUrl).not.toHaveBeenCalled();
  });
});
