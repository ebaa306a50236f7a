import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import { SessionStore } from '../auth/session-store';
import { CurrentSnapshot } from '../snapshot/current-snapshot';
import { NAV_ITEMS, navLinks, visibleNavItems } from './nav-items';

/** Width from which the navigation stays open beside the content. */
const WIDE_LAYOUT = '(min-width: 1280px)';

/** Frame of every signed-in screen: toolbar, side navigation and the routed screen. */
@Component({
  selector: 'sl-shell',
  imports: [
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatSidenavModule,
    MatToolbarModule,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);

  /** Whether the window is wide enough to keep the navigation open. */
  protected readonly isWide = toSignal(
    inject(BreakpointObserver)
      .observe(WIDE_LAYOUT)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  /** The signed-in person. */
  protected readonly user = this.session.user;
  /** The workspace of the session. */
  protected readonly workspace = this.session.workspace;
  /** The person's role. */
  protected readonly role = this.session.role;
  /** Navigation entries the person's role may open. */
  protected readonly navItems = computed(() => navLinks(visibleNavItems(NAV_ITEMS, this.role()), this.currentSnapshot.id()));
  private readonly currentSnapshot = inject(CurrentSnapshot);
  /** Whether a sign-out request is on its way. */
  protected readonly isSigningOut = signal(false);

  /** Ends the session on the server and returns to the sign-in page. */
  protected signOut(): void {
    this.isSigningOut.set(true);
    this.session.signOut().subscribe({
      next: () => void this.router.navigateByUrl('/sign-in'),
      error: (error: unknown) => {
        this.isSigningOut.set(false);
        this.snackBar.open(`Could not sign out. ${apiErrorMessage(error)}`, 'Dismiss');
      },
    });
  }
}
