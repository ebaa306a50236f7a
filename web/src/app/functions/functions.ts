import { DecimalPipe, PercentPipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  linkedSignal,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatAutocompleteModule, type MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatChipsModule, type MatChipListboxChange } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import {
  catchError,
  combineLatest,
  debounceTime,
  distinctUntilChanged,
  forkJoin,
  map,
  of,
  startWith,
  Subject,
  switchMap,
  tap,
} from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import { clusterLabel, moduleGroups, moduleIdLabel, moduleLabel } from './filter-options';
import { DEFAULT_QUERY, hasFilter, PAGE_SIZES, paramsFromQuery, queryFromParams, sameQuery, startOrder } from './function-query';
import { FunctionsApi, type SnapshotWithCoverage } from './functions-api';
import { coveragePercent } from './functions-csv';
import { FunctionsCsvExport } from './functions-csv-export';
import {
  type ClusterSummary,
  type FunctionPage,
  type FunctionQuery,
  type FunctionRow,
  type ModuleOption,
  SEVERITY_BANDS,
  type SeverityBand,
  type SortColumn,
} from './functions-types';
import { BAND_RANGES, SeverityBandLabel } from './severity-band';

/** What the table is showing. */
type PageState =
  | { kind: 'loading' }
  | { kind: 'failed'; message: string; notReady: boolean }
  | { kind: 'loaded'; page: FunctionPage; query: FunctionQuery };

/** The module and cluster choices of the filters. */
type FilterChoices =
  | { kind: 'loading' }
  | { kind: 'unavailable'; message: string }
  | { kind: 'loaded'; modules: ModuleOption[]; clusters: ClusterSummary[] };

/** Columns before the optional coverage columns. */
const LEADING_COLUMNS = ['name', 'file', 'cyclomatic', 'essential', 'decisions', 'loc'];
/** Columns shown only when the snapshot has coverage. */
const COVERAGE_COLUMNS = ['coverage', 'crap'];
/** How long typing may pause before the search is sent. */
const SEARCH_DEBOUNCE_MS = 300;

/**
 * Functions screen: every function of a snapshot in a table sorted, filtered and paged by the
 * server. The URL's query parameters hold the place, so reloads and shared links keep it.
 */
@Component({
  selector: 'sl-functions',
  imports: [
    DecimalPipe,
    MatAutocompleteModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatChipsModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    PercentPipe,
    RouterLink,
    SeverityBandLabel,
  ],
  providers: [FunctionsCsvExport],
  templateUrl: './functions.html',
  styleUrl: './functions.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Functions {
  private readonly api = inject(FunctionsApi);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  /** The CSV export of the filtered rows. */
  protected readonly csvExport = inject(FunctionsCsvExport);

  private readonly snapshotId$ = this.route.paramMap.pipe(
    map((params) => params.get('snapshotId') ?? ''),
    distinctUntilChanged(),
  );
  private readonly query$ = this.route.queryParams.pipe(map(queryFromParams), distinctUntilChanged(sameQuery));
  private readonly retry$ = new Subject<void>();
  private readonly searchInput$ = new Subject<string>();
  /** The search text last sent to the URL (so URL changes from elsewhere can be told apart). */
  private submittedSearch = '';

  /** The snapshot in view. */
  protected readonly snapshotId = toSignal(this.snapshotId$, { initialValue: '' });
  /** Filters, sort and page, as the URL says. */
  protected readonly query = toSignal(this.query$, { initialValue: DEFAULT_QUERY });
  /** The snapshot's summary, or null until known (or when it cannot be read). */
  protected readonly snapshot = toSignal(
    this.snapshotId$.pipe(
      switchMap((id) => this.api.snapshot(id).pipe(catchError(() => of(null)))),
    ),
    { initialValue: null as SnapshotWithCoverage | null },
  );
  /** The page request's state. */
  protected readonly state = toSignal(
    combineLatest([this.snapshotId$, this.query$, this.retry$.pipe(startWith(undefined))]).pipe(
      switchMap(([id, query]) =>
        this.api.page(id, query).pipe(
          tap((page) => this.leavePastTheEnd(page, query)),
          map((page): PageState => ({ kind: 'loaded', page, query })),
          catchError((error: unknown) =>
            of<PageState>({
              kind: 'failed',
              message: apiErrorMessage(error),
              notReady: error instanceof HttpErrorResponse && error.status === 409,
            }),
          ),
          startWith<PageState>({ kind: 'loading' }),
        ),
      ),
    ),
    { initialValue: { kind: 'loading' } as PageState },
  );
  /** The module and cluster choices. */
  protected readonly choices = toSignal(
    this.snapshotId$.pipe(
      switchMap((id) =>
        forkJoin({ modules: this.api.modules(id), clusters: this.api.clusters(id) }).pipe(
          map((loaded): FilterChoices => ({ kind: 'loaded', ...loaded })),
          catchError((error: unknown) => of<FilterChoices>({ kind: 'unavailable', message: apiErrorMessage(error) })),
          startWith<FilterChoices>({ kind: 'loading' }),
        ),
      ),
    ),
    { initialValue: { kind: 'loading' } as FilterChoices },
  );

  /** The last page loaded, kept on screen while the next one loads; null after a failure. */
  protected readonly shown = linkedSignal<PageState, FunctionPage | null>({
    source: this.state,
    computation: (state, previous) => {
      if (state.kind === 'loaded') return state.page;
      return state.kind === 'loading' ? (previous?.value ?? null) : null;
    },
  });
  /** Whether a page request is on its way. */
  protected readonly isLoading = computed(() => this.state().kind === 'loading');
  /** Why the last page request failed, or null. */
  protected readonly failure = computed(() => {
    const state = this.state();
    return state.kind === 'failed' ? state : null;
  });
  /** Rows of the page on screen. */
  protected readonly rows = computed(() => this.shown()?.items ?? []);
  /** The limit over which V(G) counts as over the limit. */
  protected readonly limit = computed(() => this.shown()?.limit ?? this.snapshot()?.settings?.limit ?? null);
  /** Whether coverage was imported: the summary says so, or a row carries outcomes. */
  protected readonly hasCoverage = computed(
    () => !!this.snapshot()?.coverage || this.rows().some((row) => row.outcomesTotal !== null),
  );
  /** Table columns, in order. */
  protected readonly columns = computed(() => [
    ...LEADING_COLUMNS,
    ...(this.hasCoverage() ? COVERAGE_COLUMNS : []),
    'band',
  ]);
  /** Whether any filter is set. */
  protected readonly isFiltered = computed(() => hasFilter(this.query()));
  /** Whether the table is empty (after a load). */
  protected readonly isEmpty = computed(() => {
    const state = this.state();
    return state.kind === 'loaded' && state.page.total === 0;
  });

  /** The search box's text. */
  protected readonly searchDraft = signal('');
  /** The module box's text while typing. */
  protected readonly moduleDraft = linkedSignal(() => this.selectedModuleLabel());
  /** The selected module's label, or ''. */
  protected readonly selectedModuleLabel = computed(() => {
    const id = this.query().module;
    if (!id) return '';
    const choices = this.choices();
    const known = choices.kind === 'loaded' ? choices.modules.find((m) => m.id === id) : undefined;
    return known ? moduleLabel(known) : moduleIdLabel(id);
  });
  /** Module suggestions for the typed text (all when it is the selected module's label). */
  protected readonly moduleGroups = computed(() => {
    const choices = this.choices();
    if (choices.kind !== 'loaded') return [];
    const draft = this.moduleDraft();
    return moduleGroups(choices.modules, draft === this.selectedModuleLabel() ? '' : draft);
  });
  /** Cluster choices with their labels. */
  protected readonly clusterOptions = computed(() => {
    const choices = this.choices();
    return choices.kind === 'loaded' ? choices.clusters.map((c) => ({ id: c.id, label: clusterLabel(c) })) : [];
  });
  /** The over-limit toggle's value. */
  protected readonly limitFilter = computed(() => {
    const overLimit = this.query().overLimit;
    return overLimit === undefined ? 'all' : overLimit ? 'over' : 'within';
  });

  protected readonly bands = SEVERITY_BANDS;
  protected readonly bandRanges = BAND_RANGES;
  protected readonly pageSizes = PAGE_SIZES;
  protected readonly coveragePercent = coveragePercent;
  /** Keeps rows stable across pages. */
  protected readonly trackRow = (_index: number, row: FunctionRow): string => row.id;

  constructor() {
    this.query$.pipe(takeUntilDestroyed()).subscribe((query) => {
      // Follow the URL when it changes from elsewhere (reset, back button, a link), not while typing.
      const q = query.q ?? '';
      if (q !== this.submittedSearch) {
        this.submittedSearch = q;
        this.searchDraft.set(q);
      }
    });
    this.searchInput$
      .pipe(
        debounceTime(SEARCH_DEBOUNCE_MS),
        map((text) => text.trim()),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((text) => this.submitSearch(text));
  }

  /** The Flow screen of a function. */
  protected flowLink(row: FunctionRow): string[] {
    return ['/snapshots', this.snapshotId(), 'functions', row.id];
  }

  /** `text` cut after each `separator`, so long names and paths may wrap there (`a.b.c` → `a.`, `b.`, `c`). */
  protected segments(text: string, separator: string): string[] {
    return text.split(separator).map((part, i, all) => (i < all.length - 1 ? part + separator : part));
  }

  /** The search box changed. */
  protected onSearchInput(text: string): void {
    this.searchDraft.set(text);
    this.searchInput$.next(text);
  }

  /** Empties the search box and the search at once. */
  protected clearSearch(): void {
    this.searchDraft.set('');
    this.submitSearch('');
  }

  /** A module was picked from the suggestions. */
  protected onModuleSelected(event: MatAutocompleteSelectedEvent): void {
    this.navigate({ module: String(event.option.value) });
  }

  /** Removes the module filter. */
  protected clearModule(): void {
    this.moduleDraft.set('');
    this.navigate({ module: undefined });
  }

  /** A cluster was chosen (or all). */
  protected onClusterChange(cluster: string): void {
    this.navigate({ cluster: cluster || undefined });
  }

  /** A band chip was (de)selected. */
  protected onBandChange(event: MatChipListboxChange): void {
    const band = event.value as SeverityBand | undefined | null;
    this.navigate({ band: band ?? undefined });
  }

  /** The over-limit toggle changed. */
  protected onLimitFilterChange(value: 'all' | 'over' | 'within'): void {
    this.navigate({ overLimit: value === 'all' ? undefined : value === 'over' });
  }

  /** A column header was clicked. */
  protected onSort(sort: Sort): void {
    const column = sort.active as SortColumn;
    const order = sort.direction || startOrder(column);
    this.navigate({ sort: column, order });
  }

  /** The paginator moved. */
  protected onPage(event: PageEvent): void {
    const pageSizeChanged = event.pageSize !== this.query().pageSize;
    this.navigate({ page: pageSizeChanged ? 1 : event.pageIndex + 1, pageSize: event.pageSize }, false);
  }

  /** Removes every filter, keeping the sort. */
  protected resetFilters(): void {
    const { sort, order, pageSize } = this.query();
    this.searchDraft.set('');
    this.submittedSearch = '';
    this.moduleDraft.set('');
    this.navigate({ q: undefined, module: undefined, cluster: undefined, band: undefined, overLimit: undefined, sort, order, pageSize });
  }

  /** Asks for the page again (after a failure). */
  protected retry(): void {
    this.retry$.next();
  }

  /** Fetches every row of the current filters, in the table's order, and downloads them as CSV. */
  protected exportCsv(): void {
    this.csvExport.start({
      snapshotId: this.snapshotId(),
      query: this.query(),
      withCoverage: this.hasCoverage(),
      total: this.shown()?.total ?? 0,
      fileName: this.exportFileName(),
    });
  }

  /** E.g. `functions-v3.14.0.csv`, or `functions-v3.14.0-filtered.csv` with filters. */
  private exportFileName(): string {
    const snapshot = this.snapshot();
    const name = (snapshot?.commit ?? this.snapshotId().slice(0, 8)).replace(/[^A-Za-z0-9._-]+/g, '_');
    return `functions-${name}${this.isFiltered() ? '-filtered' : ''}.csv`;
  }

  /** A link to a page past the last one (e.g. saved before a filter narrowed) moves to the last page. */
  private leavePastTheEnd(page: FunctionPage, query: FunctionQuery): void {
    if (page.items.length === 0 && page.total > 0 && query.page > 1) {
      this.navigate({ page: Math.ceil(page.total / query.pageSize) }, false, true);
    }
  }

  private submitSearch(text: string): void {
    this.submittedSearch = text;
    this.navigate({ q: text || undefined }, true, true);
  }

  /** Puts a changed query into the URL (back to page 1 unless `resetPage` is false). */
  private navigate(patch: Partial<FunctionQuery>, resetPage = true, replaceUrl = false): void {
    const next: FunctionQuery = { ...this.query(), ...patch };
    if (resetPage) next.page = 1;
    void this.router.navigate([], { relativeTo: this.route, queryParams: paramsFromQuery(next), replaceUrl });
  }
}
