import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { describeTrend, isNewModule, SPARKLINE_BOX, sparklineGeometry, trendChange } from './gravity-trend';
import type { GravityTrendPoint } from './gravity-types';

/**
 * A module's gravity across earlier snapshots of its codebase as a small line on a fixed 0–100
 * scale, with the change written beside it. A module that no earlier snapshot has is said to be
 * new in words instead; a single snapshot renders nothing.
 */
@Component({
  selector: 'sl-gravity-sparkline',
  template: `
    @if (isNew()) {
      <span class="change">new: not in the {{ earlierCount() === 1 ? 'earlier snapshot' : earlierCount() + ' earlier snapshots' }}</span>
    } @else if (description(); as label) {
      <svg
        role="img"
        [attr.aria-label]="label"
        [attr.viewBox]="'0 0 ' + box.width + ' ' + box.height"
        [attr.width]="box.width"
        [attr.height]="box.height"
      >
        <title>{{ label }}</title>
        <line class="frame" [attr.x1]="0" [attr.x2]="box.width" [attr.y1]="geometry().baseline" [attr.y2]="geometry().baseline" />
        @for (d of geometry().paths; track $index) {
          <path class="line" [attr.d]="d" />
        }
        @for (point of geometry().points; track $index) {
          <circle [class.current]="point.isCurrent" [attr.cx]="point.x" [attr.cy]="point.y" [attr.r]="point.isCurrent ? 2.6 : 1.8" />
        }
      </svg>
      <span class="change" aria-hidden="true">{{ change() }}</span>
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 6px;
    }
    svg {
      display: block;
      overflow: visible;
    }
    .frame {
      stroke: var(--mat-sys-outline-variant);
      stroke-width: 1;
    }
    .line {
      fill: none;
      stroke: var(--mat-sys-primary);
      stroke-width: 1.5;
      stroke-linejoin: round;
    }
    circle {
      fill: var(--mat-sys-primary);
    }
    circle.current {
      fill: var(--mat-sys-tertiary);
    }
    .change {
      font: var(--mat-sys-label-medium);
      font-variant-numeric: tabular-nums;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GravitySparkline {
  /** The module's gravity per snapshot, oldest first, the snapshot in view last. */
  readonly trend = input.required<readonly GravityTrendPoint[]>();

  /** Whether earlier snapshots exist and none has the module. */
  protected readonly isNew = computed(() => isNewModule(this.trend()));
  /** How many earlier snapshots the trend covers. */
  protected readonly earlierCount = computed(() => this.trend().length - 1);
  /** Drawing size. */
  protected readonly box = SPARKLINE_BOX;
  /** The trend in words (the image's accessible name); null hides the sparkline. */
  protected readonly description = computed(() => describeTrend(this.trend()));
  /** Paths and dots. */
  protected readonly geometry = computed(() => sparklineGeometry(this.trend(), this.box));
  /** The short change shown beside the line. */
  protected readonly change = computed(() => trendChange(this.trend()));
}
