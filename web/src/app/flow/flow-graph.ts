import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';

import type { DrawnBlock, DrawnEdge, FlowLayout } from './flow-layout';
import { NO_HIGHLIGHT, type PathHighlight } from './path-highlight';

/** Smallest and largest zoom factor. */
const MIN_ZOOM = 0.2;
const MAX_ZOOM = 2;
const ZOOM_STEP = 1.25;
/** The first view never zooms out further than this (11 px text stays readable). */
const READABLE_ZOOM = 0.75;

/**
 * The control-flow graph as SVG: blocks in layers from entry to exit, decision edges with their
 * outcome words, the selected basis path and the covered outcomes marked. Zoom with the buttons
 * (or + and −), pan by dragging or scrolling; every block takes keyboard focus.
 */
@Component({
  selector: 'sl-flow-graph',
  imports: [MatButtonModule, MatIconModule, MatTooltipModule],
  templateUrl: './flow-graph.html',
  styleUrl: './flow-graph.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(keydown)': 'zoomByKey($event)' },
})
export class FlowGraph {
  /** The laid-out graph. */
  readonly layout = input.required<FlowLayout>();
  /** The selected basis path's blocks and edges. */
  readonly highlight = input<PathHighlight>(NO_HIGHLIGHT);
  /** Per edge: whether the coverage report counted its outcome (null: not an outcome, or no coverage). */
  readonly edgeCoverage = input<readonly (boolean | null)[]>([]);
  /** The block chosen to be shown in the source, if any. */
  readonly chosenBlock = input<number | null>(null);
  /** A block to scroll into view when the graph is first drawn (e.g. a deep-linked path's), if any. */
  readonly startBlock = input<number | null>(null);
  /** A block was clicked or activated with the keyboard. */
  readonly blockChosen = output<number>();

  /** Current zoom factor. */
  protected readonly zoom = signal(1);
  /** Zoom as a percentage, for the label. */
  protected readonly zoomPercent = computed(() => Math.round(this.zoom() * 100));
  /** Drawn size of the SVG in CSS pixels. */
  protected readonly drawnWidth = computed(() => Math.max(1, Math.round(this.layout().width * this.zoom())));
  protected readonly drawnHeight = computed(() => Math.max(1, Math.round(this.layout().height * this.zoom())));
  /** Whether any edge carries coverage (shows the legend). */
  protected readonly hasCoverage = computed(() => this.edgeCoverage().some((c) => c !== null));

  private readonly viewport = viewChild.required<ElementRef<HTMLElement>>('viewport');
  private drag: { x: number; y: number; left: number; top: number } | null = null;

  constructor() {
    afterNextRender(() => {
      this.fitReadable();
      const start = this.startBlock();
      if (start !== null) this.revealBlock(start);
    });
  }

  /** Zooms so the graph's width fits the panel (never above 100 %). */
  protected fitWidth(): void {
    const available = this.viewport().nativeElement.clientWidth - 8;
    const width = this.layout().width;
    if (available > 0 && width > 0) this.setZoom(Math.min(1, available / width));
  }

  /** The first view: the width fitted, but never so small that the text cannot be read. */
  private fitReadable(): void {
    this.fitWidth();
    if (this.zoom() < READABLE_ZOOM) {
      this.setZoom(READABLE_ZOOM);
      const el = this.viewport().nativeElement;
      const entry = this.layout().blocks.find((b) => b.kind === 'entry');
      if (entry) el.scrollLeft = Math.max(0, entry.x * READABLE_ZOOM - el.clientWidth / 2);
    }
  }

  /** Zooms so the whole graph fits the panel. */
  protected fitAll(): void {
    const el = this.viewport().nativeElement;
    const { width, height } = this.layout();
    if (el.clientWidth > 0 && width > 0 && height > 0) {
      this.setZoom(Math.min(1, (el.clientWidth - 8) / width, (el.clientHeight - 8) / height));
    }
  }

  protected zoomIn(): void {
    this.setZoom(this.zoom() * ZOOM_STEP);
  }

  protected zoomOut(): void {
    this.setZoom(this.zoom() / ZOOM_STEP);
  }

  protected zoomByKey(event: KeyboardEvent): void {
    if (event.key === '+' || event.key === '=') this.zoomIn();
    else if (event.key === '-' || event.key === '−') this.zoomOut();
    else return;
    event.preventDefault();
  }

  protected setZoom(value: number): void {
    this.zoom.set(Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, value)));
  }

  protected startPan(event: PointerEvent): void {
    // Blocks take clicks; panning starts on the background only.
    if (event.button !== 0 || (event.target as Element).closest('.block')) return;
    const el = this.viewport().nativeElement;
    this.drag = { x: event.clientX, y: event.clientY, left: el.scrollLeft, top: el.scrollTop };
    el.setPointerCapture?.(event.pointerId);
  }

  protected pan(event: PointerEvent): void {
    if (!this.drag) return;
    const el = this.viewport().nativeElement;
    el.scrollLeft = this.drag.left - (event.clientX - this.drag.x);
    el.scrollTop = this.drag.top - (event.clientY - this.drag.y);
  }

  protected endPan(): void {
    this.drag = null;
  }

  /** Scrolls the panel so the block is in view (used when a path is chosen). */
  revealBlock(id: number | null): void {
    if (id === null) return;
    const block = this.layout().blocks[id];
    if (!block) return;
    const el = this.viewport().nativeElement;
    const z = this.zoom();
    el.scrollTop = Math.max(0, block.y * z - el.clientHeight / 3);
    el.scrollLeft = Math.max(0, block.x * z - el.clientWidth / 2);
  }

  protected choose(block: DrawnBlock, event?: Event): void {
    event?.preventDefault();
    this.blockChosen.emit(block.id);
  }

  protected edgeClasses(edge: DrawnEdge): Record<string, boolean> {
    const covered = this.edgeCoverage()[edge.index] ?? null;
    return {
      edge: true,
      'on-path': this.highlight().edges.has(edge.index),
      covered: covered === true,
      'not-covered': covered === false,
    };
  }

  protected edgeAriaLabel(edge: DrawnEdge): string {
    const covered = this.edgeCoverage()[edge.index] ?? null;
    const coverage = covered === null ? '' : covered ? ', covered by tests' : ', not covered by tests';
    return `Edge from block ${edge.from} to block ${edge.to}${edge.label ? `, ${edge.label}` : ''}${coverage}`;
  }
}
