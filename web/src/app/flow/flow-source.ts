import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  ElementRef,
  input,
  untracked,
  viewChild,
} from '@angular/core';

import { decisionSummary, outcomeWord } from './decision-wording';
import type { CompactDecision, FunctionCoverageDetail, Outcome } from './flow-types';
import { NO_HIGHLIGHT, type PathHighlight } from './path-highlight';
import type { SourceLine, SourceSegment } from './source-lines';

/** A mark drawn after a decision's span: the outcome a path takes, or what coverage counted. */
interface DecisionBadge {
  decision: number;
  /** Outcome words the selected path takes here. */
  taken: string[];
  /** [true, false] outcome words with whether each was covered, or null without coverage. */
  covered: { word: string; isCovered: boolean }[] | null;
}

/**
 * The function's source with line numbers: decision spans marked (kind and condition in the
 * tooltip), the selected path's lines and outcomes, and covered outcomes when coverage exists.
 */
@Component({
  selector: 'sl-flow-source',
  templateUrl: './flow-source.html',
  styleUrl: './flow-source.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlowSource {
  /** The source split into lines and decision runs. */
  readonly lines = input.required<SourceLine[]>();
  /** The graph's decisions, by index. */
  readonly decisions = input.required<readonly CompactDecision[]>();
  /** The selected basis path. */
  readonly highlight = input<PathHighlight>(NO_HIGHLIGHT);
  /** Coverage per decision, or null. */
  readonly coverage = input<FunctionCoverageDetail | null>(null);
  /** Lines of the block chosen on the graph, if any. */
  readonly chosenLines = input<{ from: number; to: number } | null>(null);
  /** A line to bring into view when the selected path changes (e.g. its last decision). */
  readonly focusLine = input<number | null>(null);

  private readonly scroller = viewChild.required<ElementRef<HTMLElement>>('scroller');

  /** Tooltip text per decision. */
  protected readonly titles = computed(() => this.decisions().map((d) => decisionSummary(d)));

  constructor() {
    // Bring the chosen block, or else the line the selected path is about, into view.
    effect(() => {
      const target = this.chosenLines()?.from ?? this.focusLine();
      if (target !== null) untracked(() => this.scrollToLine(target));
    });
  }

  protected isChosen(line: number): boolean {
    const chosen = this.chosenLines();
    return chosen !== null && line >= chosen.from && line <= chosen.to;
  }

  protected segmentTitle(segment: SourceSegment): string | null {
    if (segment.decisions.length === 0) return null;
    const titles = this.titles();
    return segment.decisions.map((d) => titles[d]).join('\n');
  }

  protected badges(segment: SourceSegment): DecisionBadge[] {
    const coverage = this.coverage();
    return segment.endingDecisions.map((decision) => {
      const kind = this.decisions()[decision].kind;
      const outcomes = this.highlight().outcomes.get(decision);
      const taken = (['true', 'false'] as Outcome[]).filter((o) => outcomes?.has(o)).map((o) => outcomeWord(kind, o));
      const both = coverage?.outcomes[decision];
      const covered = both
        ? [
            { word: outcomeWord(kind, 'true'), isCovered: both[0] },
            { word: outcomeWord(kind, 'false'), isCovered: both[1] },
          ]
        : null;
      return { decision, taken, covered };
    });
  }

  private scrollToLine(line: number): void {
    const scroller = this.scroller().nativeElement;
    const row = scroller.querySelector<HTMLElement>(`[data-line="${line}"]`);
    if (row) scroller.scrollTop = Math.max(0, row.offsetTop - scroller.clientHeight / 4);
  }
}
