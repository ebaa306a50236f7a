import { computed, inject, Injectable } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ActivatedRouteSnapshot, NavigationEnd, Router } from '@angular/router';
import { filter, map, startWith } from 'rxjs';

/**
 * Which snapshot the exploring screens look at: the `snapshotId` of the current route
 * (`/snapshots/:snapshotId/…`), so deep links and reloads keep the place. Navigation builds its
 * links from it; screens read their id from their own route.
 */
@Injectable({ providedIn: 'root' })
export class CurrentSnapshot {
  private readonly router = inject(Router);

  /** The snapshot id in the URL, or null on screens that are not about one snapshot. */
  readonly id = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      startWith(null),
      map(() => snapshotIdOf(this.router.routerState.snapshot.root)),
    ),
    { initialValue: null },
  );

  /** Whether a snapshot is in view. */
  readonly hasSnapshot = computed(() => this.id() !== null);
}

/** The deepest `snapshotId` route parameter, if any. */
export function snapshotIdOf(route: ActivatedRouteSnapshot): string | null {
  let found: string | null = null;
  for (let r: ActivatedRouteSnapshot | null = route; r; r = r.firstChild) {
    found = r.paramMap.get('snapshotId') ?? found;
  }
  return found;
}

/** The route of one screen of a snapshot, e.g. `/snapshots/<id>/functions`. */
export function snapshotScreenPath(snapshotId: string, screen: string): string {
  return `/snapshots/${encodeURIComponent(snapshotId)}/${screen}`;
}
