import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { GravityApi } from './gravity-api';
import { gravityModule } from './gravity-fixtures';
import type { GravityRanking } from './gravity-types';

describe('GravityApi', () => {
  let api: GravityApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(GravityApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should ask for one level of the ranking with a limit', () => {
    let received: GravityRanking | undefined;
    api.ranking('snap/1', 'file', 21).subscribe((ranking) => (received = ranking));

    const request = http.expectOne((req) => req.url === '/api/snapshots/snap%2F1/gravity');
    expect(request.request.method).toBe('GET');
    expect(request.request.params.get('level')).toBe('file');
    expect(request.request.params.get('limit')).toBe('21');
    const body: GravityRanking = { level: 'file', modules: [gravityModule()] };
    request.flush(body);
    expect(received).toEqual(body);
  });
});
