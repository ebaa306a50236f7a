import { DOCUMENT } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import { PageNavigator } from './page-navigator';

describe('PageNavigator', () => {
  it('should load the URL through the document location', () => {
    const assign = jest.fn();
    TestBed.configureTestingModule({
      providers: [{ provide: DOCUMENT, useValue: { location: { assign } } }],
    });

    TestBed.inject(PageNavigator).assign('/api/auth/login');

    expect(assign).toHaveBeenCalledWith('/api/auth/login');
  });
});
