import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  ElementRef,
  inject,
  input,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatAutocompleteModule, type MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, Router } from '@angular/router';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import { buildAtlasModel, heaviestLinks, neighbourhood, seedPositions, type AtlasModel } from './atlas-graph';
import { ATLAS_RENDERER, isLargeMap, layoutBudgetMs, type AtlasRenderer } from './atlas-renderer';
import { afterNextPaint, markAtlas } from './atlas-timing';
import type { AtlasView } from './atlas-view';
import { moduleLabel, MODULE_LEVELS, parseLevel, type ModuleLevel, type ModuleNode } from './module-graph';
import { ModuleGraphApi } from './module-graph-api';
import { matchModules, suggestModules } from './module-search';
import { ModuleDetails, type ModuleDetailsState } from './module-details';
import { ModuleList } from './module-list';
import { applyPositions, capturePositions, POSITION_STORE, positionKey } from './position-cache';

/** What the screen is showing. */
type AtlasState =
  | { kind: 'loading' }
  | { kind: 'failed'; message: string }
  | { kind: 'loaded'; model: AtlasModel };

/** Where the map's positions came from, for the status line. */
type LayoutState = 'idle' | 'running' | 'settled' | 'saved';

/** How many suggestions the search field offers. */
const SUGGESTIONS = 12;

/**
 * Atlas screen: the module map of one snapshot (WebGL), coloured by cluster, sized by ΣV, with
 * search, a module list beside it, a side panel for the selected module, filters and PNG export.
 * The URL keeps the level (`?level=`) and the selected module (`?focus=`).
 */
@Component({
  selector: 'sl-atlas',
  imports: [
    DecimalPipe,
    MatAutocompleteModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    ModuleDetails,
    ModuleList,
  ],
  templateUrl: './atlas.html',
  styleUrl: './atlas.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Atlas {
  private readonly api = inject(ModuleGraphApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly createRenderer = inject(ATLAS_RENDERER);
  private readonly positions = inject(POSITION_STORE);

  /** The snapshot (route parameter). */
  readonly snapshotId = input.required<string>();
  /** The module level (query parameter; folder when absent or unknown). */
  readonly level = input<string | undefined>();
  /** The selected module's id (query parameter). */
  readonly focus = input<string | undefined>();

  protected readonly levels = MODULE_LEVELS;
  protected readonly currentLevel = computed<ModuleLevel>(() => parseLevel(this.level()));
  /** Loading, failed or loaded. */
  protected readonly state = signal<AtlasState>({ kind: 'loading' });
  protected readonly failure = computed(() => {
    const state = this.state();
    return state.kind === 'failed' ? state.message : null;
  });
  protected readonly model = computed(() => {
    const state = this.state();
    return state.kind === 'loaded' ? state.model : null;
  });

  /** The search text (filters the list, feeds the suggestions). */
  protected readonly query = signal('');
  /** Modules with a smaller ΣV are hidden. */
  protected readonly minCyclomatic = signal(0);
  /** Links lighter than this are hidden. */
  protected readonly minWeight = signal(0);
  /** Where the layout stands. */
  protected readonly layoutState = signal<LayoutState>('idle');
  /** A large map's links are drawn only once its layout stops. */
  protected readonly linksWaitForLayout = computed(() => {
    const graph = this.model()?.graph;
    return graph !== undefined && isLargeMap(graph);
  });
  /** Whether a PNG is being made. */
  protected readonly exporting = signal(false);
  /** A problem with export or layout, shown under the toolbar; null when none. */
  protected readonly notice = signal<string | null>(null);

  /** The selected module, when it exists at this level. */
  protected readonly selected = computed<ModuleNode | null>(() => {
    const id = this.focus();
    return (id && this.model()?.byId.get(id)) || null;
  });
  protected readonly selectedId = computed(() => this.selected()?.id ?? null);
  /** All figures of the selected module, fetched when it is selected (the map carries a few). */
  protected readonly selectedDetails = signal<ModuleDetailsState>({ kind: 'loading' });
  /** The modules in the list: search and ΣV filter applied. */
  protected readonly listed = computed(() =>
    matchModules(this.model()?.modules ?? [], this.query(), this.minCyclomatic(), this.selectedId()),
  );
  protected readonly suggestions = computed(() => suggestModules(this.listed(), this.query(), SUGGESTIONS));
  protected readonly incoming = computed(() => this.links('in'));
  protected readonly outgoing = computed(() => this.links('out'));
  protected readonly colourOfModule = computed(() => {
    const graph = this.model()?.graph;
    return (id: string): string => (graph?.hasNode(id) ? graph.getNodeAttribute(id, 'color') : 'transparent');
  });
  /** Modules and links left visible by the filters (for the status line). */
  protected readonly visibleCounts = computed(() => {
    const model = this.model();
    if (!model) return { modules: 0, links: 0 };
    const minCyclomatic = this.minCyclomatic();
    const minWeight = this.minWeight();
    let modules = 0;
    model.graph.forEachNode((_id, a) => void (a.cyclomatic >= minCyclomatic && modules++));
    let links = 0;
    if (minCyclomatic <= 0 && minWeight <= 0) links = model.graph.size;
    else
      model.graph.forEachEdge((_e, a, _s, _t, sa, ta) => {
        if (a.weight >= minWeight && sa.cyclomatic >= minCyclomatic && ta.cyclomatic >= minCyclomatic) links++;
      });
    return { modules, links };
  });

  private readonly view = computed<AtlasView>(() => {
    const selected = this.selectedId();
    const graph = this.model()?.graph;
    return {
      selected,
      neighbours: graph ? neighbourhood(graph, selected) : new Set(),
      minCyclomatic: this.minCyclomatic(),
      minWeight: this.minWeight(),
    };
  });
  private readonly mapHost = viewChild<ElementRef<HTMLElement>>('map');
  /** The renderer of the map on screen, once drawn. */
  private readonly renderer = signal<AtlasRenderer | null>(null);
  /** Bumped by Retry to load the same map again. */
  private readonly attempt = signal(0);

  constructor() {
    const request = computed(() => ({ id: this.snapshotId(), level: this.currentLevel(), attempt: this.attempt() }));
    toObservable(request)
      .pipe(
        switchMap(({ id, level }) =>
          this.api.get(id, level).pipe(
            map((graph): AtlasState => {
              markAtlas('data');
              return { kind: 'loaded', model: buildAtlasModel(graph) };
            }),
            catchError((error: unknown) => of<AtlasState>({ kind: 'failed', message: apiErrorMessage(error) })),
            startWith<AtlasState>({ kind: 'loading' }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((state) => this.state.set(state));

    const selection = computed(() => ({ snapshotId: this.snapshotId(), moduleId: this.selectedId() }));
    toObservable(selection)
      .pipe(
        switchMap(({ snapshotId, moduleId }) =>
          moduleId === null
            ? of<ModuleDetailsState>({ kind: 'loading' })
            : this.api.module(snapshotId, moduleId).pipe(
                map((module): ModuleDetailsState => ({ kind: 'loaded', module })),
                catchError((error: unknown) => of<ModuleDetailsState>({ kind: 'failed', message: apiErrorMessage(error) })),
                startWith<ModuleDetailsState>({ kind: 'loading' }),
              ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((state) => this.selectedDetails.set(state));

    // Draws the map once its model and its container exist; a new level or snapshot redraws.
    effect((onCleanup) => {
      const host = this.mapHost()?.nativeElement;
      const model = this.model();
      if (!host || !model || model.graph.order === 0) return;
      const drawing = { cancelled: false, renderer: null as AtlasRenderer | null };
      onCleanup(() => {
        drawing.cancelled = true;
        drawing.renderer?.destroy();
        this.renderer.set(null);
      });
      untracked(() => void this.draw(host, model, drawing));
    });

    effect(() => {
      const view = this.view();
      this.renderer()?.setView(view);
    });
  }

  /** Loads the map again (Retry). */
  protected retry(): void {
    this.attempt.update((n) => n + 1);
  }

  /** Shows another level; the selection belongs to the old level and is dropped. */
  protected switchLevel(level: ModuleLevel): void {
    this.query.set('');
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: { level, focus: null },
      queryParamsHandling: 'merge',
    });
  }

  /** Selects a module (null: none); `moveCamera` brings it into view. */
  protected select(id: string | null, moveCamera = false): void {
    if (id !== null && moveCamera) this.renderer()?.focusNode(id);
    if (id === this.selectedId()) return;
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: { focus: id },
      queryParamsHandling: 'merge',
      replaceUrl: true,
    });
  }

  protected onSearchInput(event: Event): void {
    this.query.set((event.target as HTMLInputElement).value);
  }

  protected onSuggestionChosen(event: MatAutocompleteSelectedEvent): void {
    this.query.set('');
    this.select(event.option.value as string, true);
  }

  /** Search field text for a chosen option (cleared: the list shows everything again). */
  protected readonly displayNothing = (): string => '';

  protected onFilterInput(which: 'cyclomatic' | 'weight', event: Event): void {
    const value = Math.max(0, Math.floor(Number((event.target as HTMLInputElement).value) || 0));
    (which === 'cyclomatic' ? this.minCyclomatic : this.minWeight).set(value);
  }

  /** Runs the layout again from where the nodes are now and keeps the result. */
  protected relayout(): void {
    const renderer = this.renderer();
    const model = this.model();
    if (renderer && model) void this.layOut(renderer, model, { cancelled: false });
  }

  protected stopLayout(): void {
    this.renderer()?.stopLayout();
  }

  /** Saves the map as it is on screen (camera, selection, filters) as a PNG file. */
  protected async exportPng(): Promise<void> {
    const renderer = this.renderer();
    if (!renderer || this.exporting()) return;
    this.exporting.set(true);
    this.notice.set(null);
    try {
      const blob = await renderer.exportPng();
      downloadBlob(blob, `atlas-${this.currentLevel()}.png`);
    } catch {
      this.notice.set('The map could not be exported as an image. Please try again.');
    } finally {
      this.exporting.set(false);
    }
  }

  protected readonly labelOf = moduleLabel;

  private links(direction: 'in' | 'out') {
    const model = this.model();
    const id = this.selectedId();
    return model && id ? heaviestLinks(model.graph, id, direction, 6) : [];
  }

  /** Places the nodes (saved positions, else seeded and laid out) and draws them. */
  private async draw(host: HTMLElement, model: AtlasModel, drawing: { cancelled: boolean; renderer: AtlasRenderer | null }) {
    const key = positionKey(this.snapshotId(), this.currentLevel());
    // A store that cannot be read only means laying out again.
    const saved = await this.positions.get(key).catch(() => null);
    if (drawing.cancelled) return;
    const complete = saved !== null && applyPositions(model.graph, saved);
    if (!complete) seedPositions(model);
    let renderer: AtlasRenderer;
    try {
      renderer = await this.createRenderer(
        host,
        model.graph,
        { nodeClicked: (id) => this.select(id), stageClicked: () => this.select(null) },
        { layoutFollows: !complete },
      );
    } catch {
      if (!drawing.cancelled) {
        this.notice.set('The map cannot be drawn in this browser (it needs WebGL). The module list still works.');
      }
      return;
    }
    if (drawing.cancelled) {
      renderer.destroy();
      return;
    }
    drawing.renderer = renderer;
    renderer.setView(this.view());
    this.renderer.set(renderer);
    const selected = this.selectedId();
    if (selected) renderer.focusNode(selected);
    this.layoutState.set(complete ? 'saved' : 'idle');
    // The map is on screen before the layout worker starts competing for the processor.
    await afterNextPaint();
    markAtlas('first-frame');
    if (!complete && !drawing.cancelled) await this.layOut(renderer, model, drawing);
  }

  private async layOut(renderer: AtlasRenderer, model: AtlasModel, drawing: { cancelled: boolean }) {
    this.layoutState.set('running');
    markAtlas('layout-start');
    await renderer.runLayout(layoutBudgetMs(model.graph.order));
    markAtlas('layout-end');
    if (drawing.cancelled || this.renderer() !== renderer) return;
    this.layoutState.set('settled');
    const key = positionKey(this.snapshotId(), this.currentLevel());
    // Not saving only means the next visit lays the map out again.
    await this.positions.put(key, capturePositions(model.graph)).catch(() => undefined);
  }
}

/** Hands a file to the browser's download. */
function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const anchor = document.createElement('a');
  anchor.href = url;
  anchor.download = fileName;
  anchor.click();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
