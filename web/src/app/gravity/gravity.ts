import { DatePipe, DecimalPipe } from '@angular/common';
import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  inject,
  Injector,
  input,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import type { Snapshot } from '../api-types';
import { SnapshotFiguresApi } from '../overview/snapshot-figures-api';
import { snapshotScreenPath } from '../snapshot/current-snapshot';
import { GravityApi } from './gravity-api';
import { GravitySparkline } from './gravity-sparkline';
import type { GravityModule, ModuleLevel } from './gravity-types';
import { MODULE_LEVELS } from './gravity-types';
import {
  levelFrom,
  levelNoun,
  MAX_SHOWN,
  PAGE_SIZE,
  RankingProblem,
  rankingProblem,
  reasonSentence,
  shownFrom,
} from './gravity-view';

/** What the screen is showing. */
type GravityState =
  | { kind: 'loading'; request: RankingRequest; previous: GravityModule[]; previousHasMore: boolean }
  | { kind: 'problem'; request: RankingRequest; problem: RankingProblem }
  | { kind: 'loaded'; request: RankingRequest; modules: GravityModule[]; hasMore: boolean };

/** One ask for the ranking. */
interface RankingRequest {
  snapshotId: string;
  level: ModuleLevel;
  shown: number;
  attempt: number;
}

/**
 * Gravity screen: a snapshot's god-module ranking at one level, each module with its score, the
 * reasons behind it in words, its key figures, its trend across earlier snapshots and links to
 * its functions and to its place on the Atlas. Level and length live in the URL.
 */
@Component({
  selector: 'sl-gravity',
  imports: [
    DatePipe,
    DecimalPipe,
    GravitySparkline,
    MatButtonModule,
    MatButtonToggleModule,
    MatIconModule,
    MatProgressBarModule,
    RouterLink,
  ],
  templateUrl: './gravity.html',
  styleUrl: './gravity.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Gravity {
  private readonly api = inject(GravityApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  private readonly snapshots = inject(SnapshotFiguresApi);

  /** Route parameter: the snapshot in view. */
  readonly snapshotId = input.required<string>();
  /** Query parameter: `file`, `folder` (default) or `package`. */
  readonly level = input<string | undefined>();
  /** Query parameter: how many modules to show (20 by default). */
  readonly limit = input<string | undefined>();

  /** The snapshot in view (commit, branch, date) for the subtitle; null until known or if it cannot be read. */
  protected readonly snapshot = toSignal(
    toObservable(this.snapshotId).pipe(
      switchMap((id) =>
        this.snapshots.snapshot(id).pipe(
          startWith<Snapshot | null>(null),
          // The subtitle is a courtesy: the ranking request reports any real problem.
          catchError(() => of(null)),
        ),
      ),
    ),
    { initialValue: null },
  );
  /** The levels offered by the switch. */
  protected readonly levels = MODULE_LEVELS;
  /** The level in view. */
  protected readonly activeLevel = computed(() => levelFrom(this.level()));
  /** How many modules are asked for. */
  protected readonly shown = computed(() => shownFrom(this.limit()));
  /** Bumped by Retry to ask again. */
  private readonly attempt = signal(0);

  /** Loading, a problem, or the ranking. */
  protected readonly state = signal<GravityState | null>(null);
  /** Whether a request is on its way. */
  protected readonly isLoading = computed(() => {
    const state = this.state();
    return state === null || state.kind === 'loading';
  });
  /** The modules to list: the loaded ones, or while more load, the ones already shown. */
  protected readonly modules = computed(() => {
    const state = this.state();
    if (state?.kind === 'loaded') return state.modules;
    if (state?.kind === 'loading') return state.previous;
    return [];
  });
  /** Why nothing can be listed, if so. */
  protected readonly problem = computed(() => {
    const state = this.state();
    return state?.kind === 'problem' ? state.problem : null;
  });
  /** Whether the server holds more modules than are shown. */
  protected readonly hasMore = computed(() => {
    const state = this.state();
    if (state?.kind === 'loaded') return state.hasMore;
    return state?.kind === 'loading' && state.previousHasMore;
  });
  /** Whether the ranking loaded and is empty. */
  protected readonly isEmpty = computed(() => {
    const state = this.state();
    return state?.kind === 'loaded' && state.modules.length === 0;
  });
  /** "folders", "files" or "packages". */
  protected readonly noun = computed(() => levelNoun(this.activeLevel()));
  /** Link to the Functions screen (the module goes in its query). */
  protected readonly functionsPath = computed(() => snapshotScreenPath(this.snapshotId(), 'functions'));
  /** Link to the Atlas (the module to focus and the level go in its query). */
  protected readonly atlasPath = computed(() => snapshotScreenPath(this.snapshotId(), 'atlas'));

  /** How many modules "Show more" adds. */
  protected readonly pageSize = PAGE_SIZE;
  /** A reason as a sentence. */
  protected readonly sentence = reasonSentence;

  constructor() {
    const request = computed<RankingRequest>(() => ({
      snapshotId: this.snapshotId(),
      level: this.activeLevel(),
      shown: this.shown(),
      attempt: this.attempt(),
    }));
    toObservable(request)
      .pipe(
        switchMap((req) =>
          this.api.ranking(req.snapshotId, req.level, Math.min(req.shown + 1, MAX_SHOWN + 1)).pipe(
            map((ranking): GravityState => ({
              kind: 'loaded',
              request: req,
              modules: ranking.modules.slice(0, req.shown),
              hasMore: ranking.modules.length > req.shown,
            })),
            catchError((error: unknown) => of<GravityState>({ kind: 'problem', request: req, problem: rankingProblem(error) })),
            startWith<GravityState>({ kind: 'loading', request: req, ...this.kept(req) }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((state) => {
        const before = this.modules().length;
        this.state.set(state);
        if (state.kind === 'loaded' && state.request.shown > PAGE_SIZE && state.modules.length > before && before > 0) {
          this.focusModule(before);
        }
      });
  }

  /** Shows another level (starting again from the top of its ranking). */
  protected chooseLevel(level: ModuleLevel): void {
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: { level, limit: null },
      queryParamsHandling: 'merge',
    });
  }

  /** Shows the next PAGE_SIZE modules. */
  protected showMore(): void {
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: { limit: Math.min(this.shown() + PAGE_SIZE, MAX_SHOWN) },
      queryParamsHandling: 'merge',
    });
  }

  /** Asks for the ranking again. */
  protected retry(): void {
    this.attempt.update((n) => n + 1);
  }

  /** Query of the Functions link for one module. */
  protected functionsQuery(module: GravityModule): Record<string, string> {
    return { module: module.id };
  }

  /** Query of the Atlas link for one module. */
  protected atlasQuery(module: GravityModule): Record<string, string> {
    return { focus: module.id, level: this.activeLevel() };
  }

  /** The modules worth keeping on screen while a longer list of the same level loads. */
  private kept(next: RankingRequest): { previous: GravityModule[]; previousHasMore: boolean } {
    const state = this.state();
    const same =
      state?.kind === 'loaded' && state.request.snapshotId === next.snapshotId && state.request.level === next.level;
    return same ? { previous: state.modules, previousHasMore: state.hasMore } : { previous: [], previousHasMore: false };
  }

  /** Moves keyboard focus to the module at `index` (the first one "Show more" added). */
  private focusModule(index: number): void {
    afterNextRender(
      () => this.host.nativeElement.querySelectorAll<HTMLElement>('.module')[index]?.focus(),
      { injector: this.injector },
    );
  }
}
