import { ScrollingModule, CdkVirtualScrollViewport } from '@angular/cdk/scrolling';
import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, effect, input, output, signal, untracked, viewChild } from '@angular/core';

import { moduleLabel, type ModuleNode } from './module-graph';

/** Height of one row in pixels (the virtual scroll needs a fixed size). */
export const ROW_HEIGHT = 44;

/**
 * The modules beside the map as a keyboard-reachable listbox: arrow keys, Home/End and
 * Page Up/Down move, Enter or Space selects. Only the visible rows are in the page, so 20,000
 * modules scroll smoothly; the active row is announced through aria-activedescendant.
 */
@Component({
  selector: 'sl-module-list',
  imports: [DecimalPipe, ScrollingModule],
  templateUrl: './module-list.html',
  styleUrl: './module-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModuleList {
  /** The modules to list, in order. */
  readonly modules = input.required<readonly ModuleNode[]>();
  /** The selected module's id, or null. */
  readonly selectedId = input<string | null>(null);
  /** The colour of a module's dot (its cluster's). */
  readonly colourOf = input.required<(id: string) => string>();
  /** Accessible name of the list. */
  readonly label = input('Modules');
  /** A module was chosen (click, Enter or Space). */
  readonly chosen = output<string>();

  /** The row the keyboard is on. */
  protected readonly activeIndex = signal(0);
  protected readonly rowHeight = ROW_HEIGHT;
  protected readonly labelOf = moduleLabel;
  protected readonly trackById = (_index: number, module: ModuleNode): string => module.id;
  private readonly viewport = viewChild(CdkVirtualScrollViewport);

  constructor() {
    // The selection made elsewhere (map, search) becomes the active row and scrolls into view.
    effect(() => {
      const selected = this.selectedId();
      const modules = this.modules();
      untracked(() => {
        const index = selected === null ? -1 : modules.findIndex((m) => m.id === selected);
        if (index >= 0) {
          this.activeIndex.set(index);
          this.scrollTo(index);
        } else if (this.activeIndex() >= modules.length) {
          this.activeIndex.set(0);
        }
      });
    });
  }

  /** The DOM id of a row, for aria-activedescendant. */
  protected optionId(index: number): string {
    return `sl-module-option-${index}`;
  }

  protected onKeydown(event: KeyboardEvent): void {
    const count = this.modules().length;
    if (count === 0) return;
    const page = Math.max(1, Math.floor((this.viewport()?.getViewportSize() ?? ROW_HEIGHT * 10) / ROW_HEIGHT) - 1);
    const current = this.activeIndex();
    let next = current;
    switch (event.key) {
      case 'ArrowDown':
        next = current + 1;
        break;
      case 'ArrowUp':
        next = current - 1;
        break;
      case 'PageDown':
        next = current + page;
        break;
      case 'PageUp':
        next = current - page;
        break;
      case 'Home':
        next = 0;
        break;
      case 'End':
        next = count - 1;
        break;
      case 'Enter':
      case ' ':
        event.preventDefault();
        this.chosen.emit(this.modules()[current].id);
        return;
      default:
        return;
    }
    event.preventDefault();
    next = Math.max(0, Math.min(count - 1, next));
    this.activeIndex.set(next);
    this.scrollTo(next);
  }

  protected choose(index: number): void {
    this.activeIndex.set(index);
    this.chosen.emit(this.modules()[index].id);
  }

  private scrollTo(index: number): void {
    const viewport = this.viewport();
    if (!viewport) return;
    const top = index * ROW_HEIGHT;
    const offset = viewport.measureScrollOffset('top');
    const size = viewport.getViewportSize();
    if (top < offset) viewport.scrollToOffset(top);
    else if (top + ROW_HEIGHT > offset + size) viewport.scrollToOffset(top + ROW_HEIGHT - size);
  }
}
