import { TestBed } from '@angular/core/testing';

import type { Snapshot } from '../api-types';
import { snapshot } from '../testing/api-fixtures';
import { SnapshotStatusLabel } from './snapshot-status-label';

describe('SnapshotStatusLabel', () => {
  async function render(value: Snapshot): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(SnapshotStatusLabel);
    fixture.componentRef.setInput('snapshot', value);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it.each([
    ['queued', 'schedule', 'queued'],
    ['ready', 'check_circle', 'ready'],
    ['failed', 'error', 'failed'],
  ] as const)('should show %s with an icon and the word', async (status, icon, word) => {
    const label = await render(snapshot({ status }));

    expect(label.querySelector('mat-icon')?.textContent?.trim()).toBe(icon);
    expect(label.querySelector('span')?.textContent?.trim()).toBe(word);
    expect(label.classList).toContain(`status-${status}`);
  });

  it('should add the progress while running', async () => {
    const label = await render(snapshot({ status: 'running', progress: 41.6 }));

    expect(label.querySelector('span')?.textContent?.trim()).toBe('running 42%');
  });

  it('should offer the failure reason as a tooltip title', async () => {
    const label = await render(snapshot({ status: 'failed', error: 'tsconfig.json not found' }));

    expect(label.getAttribute('title')).toBe('tsconfig.json not found');
  });
});
