import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { PageNavigator } from '../page-navigator';
import { SignIn, SSO_LOGIN_URL } from './sign-in';

describe('SignIn', () => {
  let assign: jest.Mock;

  beforeEach(() => {
    assign = jest.fn();
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'sign-in', component: SignIn }], withComponentInputBinding()),
        { provide: PageNavigator, useValue: { assign } },
      ],
    });
  });

  /** Opens `url` through the router, as the app does, and returns the rendered page. */
  async function open(url: string): Promise<HTMLElement> {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url, SignIn);
    harness.detectChanges();
    return harness.routeNativeElement as HTMLElement;
  }

  function ssoButton(page: HTMLElement): HTMLButtonElement {
    const button = Array.from(page.querySelectorAll('button')).find((b) => b.textContent?.includes('Sign in with SSO'));
    if (!button) {
      throw new Error('No "Sign in with SSO" button');
    }
    return button;
  }

  it('should name the product and offer exactly one button', async () => {
    const page = await open('/sign-in');

    expect(page.querySelector('h1')?.textContent).toContain('Seamline');
    expect(page.querySelectorAll('button')).toHaveLength(1);
    expect(page.querySelector('[role="alert"]')).toBeNull();
  });

  it('should hand the whole page over to the SSO login', async () => {
    const page = await open('/sign-in');

    ssoButton(page).click();

    expect(assign).toHaveBeenCalledTimes(1);
    expect(assign).toHaveBeenCalledWith('/api/auth/login');
    expect(SSO_LOGIN_URL).toBe('/api/auth/login');
  });

  it('should show the message from ?error= in an alert', async () => {
    const page = await open('/sign-in?error=Your%20account%20is%20not%20in%20this%20workspace.');

    const alert = page.querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('Your account is not in this workspace.');
  });
});
