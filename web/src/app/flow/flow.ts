import { DecimalPipe, PercentPipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
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
  viewChild,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { Router, RouterLink } from '@angular/router';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import { snapshotScreenPath } from '../snapshot/current-snapshot';
import { decisionSummary, outcomeWord } from './decision-wording';
import { FlowApi } from './flow-api';
import { FlowGraph } from './flow-graph';
import { FlowSource } from './flow-source';
import { BAND_RANGES, flowView, pathLabel, type FlowView } from './flow-view';
import type { BasisPath, DecisionKind, Outcome } from './flow-types';
import { PathChecklist } from './path-checklist';
import { NO_HIGHLIGHT, pathHighlight, pathOutcomesCovered } from './path-highlight';

/** What the screen is showing. */
type FlowState =
  | { kind: 'loading' }
  | { kind: 'failed'; status: number; message: string }
  | { kind: 'loaded'; view: FlowView };

/**
 * Flow screen: one function's control-flow graph, V(G) worked out with its numbers, the source
 * with its decisions, the basis paths as a test checklist, ev(G) and coverage when imported.
 */
@Component({
  selector: 'sl-flow',
  imports: [
    DecimalPipe,
    FlowGraph,
    FlowSource,
    MatButtonModule,
    MatCheckboxModule,
    MatIconModule,
    MatProgressBarModule,
    MatRadioModule,
    PercentPipe,
    RouterLink,
  ],
  templateUrl: './flow.html',
  styleUrl: './flow.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Flow {
  private readonly flowApi = inject(FlowApi);
  private readonly checklist = inject(PathChecklist);
  private readonly router = inject(Router);
  private readonly injector = inject(Injector);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  /** Route parameter: the snapshot. */
  readonly snapshotId = input.required<string>();
  /** Route parameter: the function's stable id. */
  readonly functionId = input.required<string>();
  /** Query parameter: the selected basis path, 1-based (kept in the URL so a reload keeps it). */
  readonly path = input<string | undefined>(undefined);

  private readonly reloads = signal(0);
  private readonly request = computed(() => ({ snapshotId: this.snapshotId(), functionId: this.functionId(), reload: this.reloads() }));

  /** Loading, failed or loaded. */
  protected readonly state = signal<FlowState>({ kind: 'loading' });
  /** The loaded view, or null. */
  protected readonly view = computed(() => {
    const state = this.state();
    return state.kind === 'loaded' ? state.view : null;
  });
  /** The failure, or null. */
  protected readonly failure = computed(() => {
    const state = this.state();
    return state.kind === 'failed' ? state : null;
  });
  /** The Functions screen of this snapshot. */
  protected readonly functionsLink = computed(() => snapshotScreenPath(this.snapshotId(), 'functions'));
  /** Paths ticked as tested (this browser only). */
  protected readonly ticked = signal<ReadonlySet<number>>(new Set());
  /** The block chosen on the graph, shown in the source. */
  protected readonly chosenBlock = signal<number | null>(null);

  /** The selected basis path, from the URL. */
  protected readonly selectedPath = computed((): BasisPath | null => {
    const view = this.view();
    const index = Number(this.path()) - 1;
    return view && Number.isInteger(index) ? (view.detail.basisPaths[index] ?? null) : null;
  });
  protected readonly highlight = computed(() => {
    const view = this.view();
    return view ? pathHighlight(view.detail.graph, this.selectedPath()) : NO_HIGHLIGHT;
  });
  /** The last decision the selected path passes: where the graph and source scroll to. */
  private readonly pathFocusDecision = computed(() => {
    const steps = this.selectedPath()?.steps ?? [];
    return steps.length > 0 ? steps[steps.length - 1].decision : null;
  });
  /** The block the graph first scrolls to: the selected path's last decision. */
  protected readonly startBlock = computed(() => {
    const path = this.selectedPath();
    return path ? this.focusBlockOf(path) : null;
  });
  protected readonly focusLine = computed(() => {
    const d = this.pathFocusDecision();
    return d === null ? null : (this.view()?.detail.graph.decisions[d]?.span.line ?? null);
  });
  protected readonly chosenLines = computed(() => {
    const block = this.chosenBlock();
    const span = block === null ? null : this.view()?.detail.graph.blocks[block];
    return span ? { from: span[0], to: span[2] } : null;
  });
  protected readonly bandRange = computed(() => {
    const band = this.view()?.detail.function.band;
    return band ? BAND_RANGES[band] : '';
  });

  protected readonly pathLabel = pathLabel;
  protected readonly decisionSummary = decisionSummary;
  protected readonly outcomeWord = outcomeWord;

  private readonly graph = viewChild(FlowGraph);

  constructor() {
    toObservable(this.request)
      .pipe(
        switchMap(({ snapshotId, functionId }) =>
          this.flowApi.functionDetail(snapshotId, functionId).pipe(
            map((detail): FlowState => ({ kind: 'loaded', view: flowView(detail) })),
            catchError((error: unknown) =>
              of<FlowState>({
                kind: 'failed',
                status: error instanceof HttpErrorResponse ? error.status : 0,
                message: apiErrorMessage(error),
              }),
            ),
            startWith<FlowState>({ kind: 'loading' }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((state) => {
        this.state.set(state);
        if (state.kind === 'loaded') {
          this.chosenBlock.set(null);
          this.ticked.set(this.checklist.load(this.snapshotId(), this.functionId()));
          // A deep link with ?path=N opens with that path in the list in view (the graph scrolls by itself).
          afterNextRender(() => this.revealInList(this.selectedPath()), { injector: this.injector });
        }
      });
  }

  /** Loads the function again (the Retry button). */
  protected retry(): void {
    this.reloads.update((n) => n + 1);
  }

  /** Shows a basis path on the graph and in the source (null: none), keeping it in the URL. */
  protected selectPath(index: number | null): void {
    this.chosenBlock.set(null);
    void this.router.navigate([], {
      queryParams: { path: index === null ? null : index + 1 },
      queryParamsHandling: 'merge',
      replaceUrl: true,
    });
    const path = index === null ? null : this.view()?.detail.basisPaths[index];
    if (path) this.graph()?.revealBlock(this.focusBlockOf(path));
  }

  /** Scrolls the list of paths so the path is in view. */
  private revealInList(path: BasisPath | null): void {
    const list = this.host.nativeElement.querySelector<HTMLElement>('.path-scroll');
    const item = path && list?.querySelector<HTMLElement>(`[data-path="${path.index + 1}"]`);
    if (list && item) list.scrollTop = item.offsetTop;
  }

  /** The block a path is about: its last decision's (the entry for a path without decisions). */
  private focusBlockOf(path: BasisPath): number | null {
    const graph = this.view()?.detail.graph;
    if (!graph) return null;
    const last = path.steps[path.steps.length - 1];
    return last ? graph.decisions[last.decision].block : graph.entry;
  }

  /** Ticks or unticks a path as tested and stores the checklist. */
  protected setTested(index: number, tested: boolean): void {
    const next = new Set(this.ticked());
    if (tested) next.add(index);
    else next.delete(index);
    this.ticked.set(next);
    this.checklist.save(this.snapshotId(), this.functionId(), next);
  }

  /** Shows a block's lines in the source. */
  protected chooseBlock(block: number): void {
    this.chosenBlock.set(this.chosenBlock() === block ? null : block);
  }

  /** Shows a decision's block on the graph and its line in the source. */
  protected chooseDecision(decision: number): void {
    const view = this.view();
    if (!view) return;
    const block = view.detail.graph.decisions[decision].block;
    this.chosenBlock.set(block);
    this.graph()?.revealBlock(block);
  }

  /** The outcome words a path takes at one decision, e.g. "enter, leave". */
  protected outcomeWords(kind: DecisionKind, taken: ReadonlySet<Outcome>): string {
    return (['true', 'false'] as const).filter((o) => taken.has(o)).map((o) => outcomeWord(kind, o)).join(', ');
  }

  protected outcomesCovered(path: BasisPath): { covered: number; total: number } | null {
    const coverage = this.view()?.detail.coverage;
    return coverage ? pathOutcomesCovered(path, coverage) : null;
  }
}
