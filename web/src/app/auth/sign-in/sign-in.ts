import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';

import { PageNavigator } from '../page-navigator';

/** Server route that starts single sign-on (a redirect to the identity provider). */
export const SSO_LOGIN_URL = '/api/auth/login';

/** The public sign-in page: one button that hands over to single sign-on. */
@Component({
  selector: 'sl-sign-in',
  imports: [MatButtonModule, MatCardModule, MatIconModule],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly navigator = inject(PageNavigator);

  /** Message from `?error=` when the server sent the person back after a failed sign-in. */
  readonly error = input<string>();

  /** Whether the page is already on its way to the identity provider. */
  protected readonly isLeaving = signal(false);

  /** Leaves the app for the server's SSO login (a full-page navigation, not a route). */
  protected signInWithSso(): void {
    this.isLeaving.set(true);
    this.navigator.assign(SSO_LOGIN_URL);
  }
}
