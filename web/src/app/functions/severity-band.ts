import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { SEVERITY_BANDS, type SeverityBand } from './functions-types';

/** The V(G) range of each band, in words. */
export const BAND_RANGES: Record<SeverityBand, string> = {
  calm: 'V(G) 1–10',
  busy: 'V(G) 11–20',
  tangled: 'V(G) 21–50',
  knotted: 'V(G) above 50',
};

/**
 * A V(G) band as a small label: the band's word, a step glyph (one to four filled steps) and a
 * colour from our sequential ramp, whose lightness falls steadily from calm to knotted so it
 * reads the same with any colour vision — and the word and steps carry it without colour.
 */
@Component({
  selector: 'sl-severity-band',
  template: `
    <span class="steps" aria-hidden="true">
      @for (step of steps; track step) {
        <span class="step" [class.filled]="step <= rank()"></span>
      }
    </span>
    <span class="word">{{ band() }}</span>
  `,
  styleUrl: './severity-band.scss',
  host: {
    '[class]': '"band band-" + band()',
    '[attr.title]': 'range()',
  },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeverityBandLabel {
  /** The band shown. */
  readonly band = input.required<SeverityBand>();

  /** Glyph steps, 1 to 4. */
  protected readonly steps = [1, 2, 3, 4];
  /** 1 for calm … 4 for knotted. */
  protected readonly rank = computed(() => SEVERITY_BANDS.indexOf(this.band()) + 1);
  /** The band's V(G) range, as a tooltip. */
  protected readonly range = computed(() => BAND_RANGES[this.band()]);
}
