import { ComponentFixture, TestBed } from '@angular/core/testing';

import { ModuleList } from './module-list';
import { moduleRecord } from './module-graph.fixtures';

describe('ModuleList', () => {
  let fixture: ComponentFixture<ModuleList>;
  let chosen: string[];
  const modules = ['src/dispatch-core', 'src/routing', 'src/billing', 'src/shared'].map((p) => moduleRecord(p));

  beforeAll(() => {
    // jsdom does not scroll.
    Element.prototype.scrollTo ??= function scrollTo() {};
  });

  beforeEach(async () => {
    fixture = TestBed.createComponent(ModuleList);
    fixture.componentRef.setInput('modules', modules);
    fixture.componentRef.setInput('colourOf', () => '#332288');
    fixture.componentRef.setInput('label', 'Modules, largest ΣV first');
    chosen = [];
    fixture.componentInstance.chosen.subscribe((id) => chosen.push(id));
    await fixture.whenStable();
  });

  function listbox(): HTMLElement {
    return (fixture.nativeElement as HTMLElement).querySelector('[role="listbox"]') as HTMLElement;
  }

  async function press(key: string): Promise<void> {
    listbox().dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true }));
    await fixture.whenStable();
  }

  it('should be one focusable, labelled listbox pointing at its active row', () => {
    expect(listbox().tabIndex).toBe(0);
    expect(listbox().getAttribute('aria-label')).toBe('Modules, largest ΣV first');
    expect(listbox().getAttribute('aria-activedescendant')).toBe('sl-module-option-0');
  });

  it('should move with the arrow keys, Home and End, and choose with Enter or Space', async () => {
    await press('ArrowDown');
    await press('ArrowDown');
    expect(listbox().getAttribute('aria-activedescendant')).toBe('sl-module-option-2');
    await press('Enter');
    expect(chosen).toEqual(['folder:src/billing']);

    await press('End');
    await press('ArrowDown');
    expect(listbox().getAttribute('aria-activedescendant')).toBe('sl-module-option-3');
    await press(' ');
    await press('Home');
    await press('ArrowUp');
    await press('Enter');
    expect(chosen).toEqual(['folder:src/billing', 'folder:src/shared', 'folder:src/dispatch-core']);
  });

  it('should make a selection made elsewhere the active row', async () => {
    fixture.componentRef.setInput('selectedId', 'folder:src/routing');
    await fixture.whenStable();

    expect(listbox().getAttribute('aria-activedescendant')).toBe('sl-module-option-1');
  });

  it('should say when no module matches', async () => {
    fixture.componentRef.setInput('modules', []);
    await fixture.whenStable();

    expect(listbox().getAttribute('aria-activedescendant')).toBeNull();
    expect(listbox().textContent).toContain('No module matches.');
  });
});
