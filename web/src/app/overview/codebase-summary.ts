import { DatePipe, DecimalPipe, SlicePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, map, Observable, of, startWith, switchMap } from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import type { Codebase, Snapshot } from '../api-types';
import { snapshotScreenPath } from '../snapshot/current-snapshot';
import { BandHistogram } from './band-histogram';
import { headlineFigures, latestReady, phaseLabel } from './headline-figures';
import { BandCounts, GravityModule, SnapshotFiguresApi } from './snapshot-figures-api';
import { SnapshotStatusLabel } from './snapshot-status-label';

/** A part of the card that loads on its own. */
export type Loadable<T> = { kind: 'loading' } | { kind: 'failed'; message: string } | { kind: 'loaded'; value: T };

/** The snapshot screens a ready snapshot opens, in the order offered. */
const SNAPSHOT_SCREENS = [
  { screen: 'functions', label: 'Functions', needsModuleMap: false },
  { screen: 'gravity', label: 'Gravity', needsModuleMap: true },
  { screen: 'atlas', label: 'Atlas', needsModuleMap: true },
] as const;

/** One codebase on the Overview: its latest ready snapshot's figures, band histogram, top gravity modules and all its snapshots. */
@Component({
  selector: 'sl-codebase-summary',
  imports: [
    BandHistogram,
    DatePipe,
    DecimalPipe,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTableModule,
    RouterLink,
    SlicePipe,
    SnapshotStatusLabel,
  ],
  templateUrl: './codebase-summary.html',
  styleUrl: './codebase-summary.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CodebaseSummary {
  private readonly figuresApi = inject(SnapshotFiguresApi);

  /** The codebase with its snapshots, newest first. */
  readonly codebase = input.required<Codebase>();

  /** Columns of the snapshot table, in order. */
  protected readonly columns = ['snapshot', 'status', 'commit', 'branch', 'functions', 'cyclomatic', 'decisions', 'open'];
  /** Prefix for element ids inside this card. */
  protected readonly idPrefix = computed(() => `codebase-${this.codebase().id}`);
  /** The newest ready snapshot, whose figures the card shows. */
  protected readonly latest = computed(() => latestReady(this.codebase()));
  /** Its headline figures. */
  protected readonly figures = computed(() => {
    const snapshot = this.latest();
    return snapshot ? headlineFigures(snapshot) : null;
  });
  /** Bumped by "Try again" to load the histogram and gravity once more. */
  private readonly attempt = signal(0);
  // Reloads only when the snapshot changes or on "Try again", not on every update of the list.
  private readonly latestId = computed(() => ({ id: this.latest()?.id ?? null, attempt: this.attempt() }), {
    equal: (a, b) => a.id === b.id && a.attempt === b.attempt,
  });

  /** Functions per band of the latest ready snapshot. */
  protected readonly bands = toSignal(
    toObservable(this.latestId).pipe(
      switchMap(({ id }) => (id ? loadable(this.figuresApi.bandCounts(id)) : of(null))),
    ),
    { initialValue: null as Loadable<BandCounts> | null },
  );
  /** The three modules of highest gravity at folder level (none without a module map). */
  protected readonly gravity = toSignal(
    toObservable(this.latestId).pipe(
      switchMap(({ id }) =>
        id && this.latest()?.hasModuleMap !== false ? loadable(this.figuresApi.topGravity(id, 3)) : of(null),
      ),
    ),
    { initialValue: null as Loadable<GravityModule[]> | null },
  );

  /** Loads the histogram and gravity again after a failure. */
  protected retry(): void {
    this.attempt.update((n) => n + 1);
  }

  /** The screens a ready snapshot can open, with their links. */
  protected screensOf(snapshot: Snapshot): { label: string; link: string }[] {
    return SNAPSHOT_SCREENS.filter((s) => !s.needsModuleMap || snapshot.hasModuleMap !== false).map((s) => ({
      label: s.label,
      link: snapshotScreenPath(snapshot.id, s.screen),
    }));
  }

  /** A short name of the snapshot for labels: its commit, or when it was made. */
  protected snapshotName(snapshot: Snapshot): string {
    return snapshot.commit ? `commit ${snapshot.commit.slice(0, 12)}` : `the snapshot of ${snapshot.createdAt.slice(0, 16).replace('T', ' ')}`;
  }

  /** A module path cut after each `/`, so a long path breaks between folders rather than inside a name. */
  protected pathParts(path: string): string[] {
    return path.split(/(?<=\/)/);
  }

  /** The phase of an unfinished analysis, in words. */
  protected readonly phaseLabel = phaseLabel;
  /** The route of one snapshot screen. */
  protected readonly screenPath = snapshotScreenPath;
  /** Keeps snapshot rows stable across updates. */
  protected readonly trackSnapshot = (_index: number, snapshot: Snapshot): string => snapshot.id;
}

/** Wraps a request as loading, then its value or its failure. */
function loadable<T>(request: Observable<T>): Observable<Loadable<T>> {
  return request.pipe(
    map((value): Loadable<T> => ({ kind: 'loaded', value })),
    catchError((error: unknown) => of<Loadable<T>>({ kind: 'failed', message: apiErrorMessage(error) })),
    startWith<Loadable<T>>({ kind: 'loading' }),
  );
}
