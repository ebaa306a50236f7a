import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import type { SeverityBand } from './functions-types';
import { SeverityBandLabel } from './severity-band';

@Component({
  imports: [SeverityBandLabel],
  template: `<sl-severity-band [band]="band()" />`,
})
class Host {
  readonly band = signal<SeverityBand>('calm');
}

describe('SeverityBandLabel', () => {
  it.each([
    ['calm', 1, 'V(G) 1–10'],
    ['busy', 2, 'V(G) 11–20'],
    ['tangled', 3, 'V(G) 21–50'],
    ['knotted', 4, 'V(G) above 50'],
  ] as const)('should write %s with %i filled steps and its range', async (band, filled, range) => {
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.band.set(band);
    await fixture.whenStable();
    const label = (fixture.nativeElement as HTMLElement).querySelector('sl-severity-band') as HTMLElement;

    expect(label.textContent?.trim()).toBe(band);
    expect(label.classList).toContain(`band-${band}`);
    expect(label.getAttribute('title')).toBe(range);
    expect(label.querySelectorAll('.step.filled')).toHaveLength(filled);
    expect(label.querySelector('.steps')?.getAttribute('aria-hidden')).toBe('true');
  });
});
