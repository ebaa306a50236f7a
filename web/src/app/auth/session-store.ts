import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { catchError, Observable, of, tap, throwError } from 'rxjs';

import type { MeResponse } from '../api-types';

/** Holds who is signed in (person, workspace, role) as signals, loaded from `GET /api/me`. */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  private readonly http = inject(HttpClient);
  private readonly current = signal<MeResponse | null>(null);

  /** The signed-in session, or null when nobody is signed in (or it is not known yet). */
  readonly session = this.current.asReadonly();
  /** The signed-in person. */
  readonly user = computed(() => this.current()?.user ?? null);
  /** The workspace of the session. */
  readonly workspace = computed(() => this.current()?.workspace ?? null);
  /** The person's role in the workspace. */
  readonly role = computed(() => this.current()?.role ?? null);
  /** Whether a session is known. */
  readonly isSignedIn = computed(() => this.current() !== null);

  /** Asks the server who is signed in: emits the session, or null on 401; other errors pass on. */
  load(): Observable<MeResponse | null> {
    return this.http.get<MeResponse>('/api/me').pipe(
      tap((me) => this.current.set(me)),
      catchError((error: unknown) => {
        if (error instanceof HttpErrorResponse && error.status === 401) {
          this.current.set(null);
          return of(null);
        }
        return throwError(() => error);
      }),
    );
  }

  /** The known session, or the server's answer when none is known yet. */
  ensureLoaded(): Observable<MeResponse | null> {
    const known = this.current();
    return known ? of(known) : this.load();
  }

  /** Ends the session on the server (`POST /api/auth/logout`), then forgets it here. */
  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/logout', null).pipe(tap(() => this.current.set(null)));
  }

  /** Forgets the session without asking the server (it already said the session is gone). */
  clear(): void {
    this.current.set(null);
  }
}
