import { TestBed } from '@angular/core/testing';

import { PathChecklist } from './path-checklist';

describe('PathChecklist', () => {
  let checklist: PathChecklist;

  beforeEach(() => {
    localStorage.clear();
    checklist = TestBed.inject(PathChecklist);
  });

  it('should keep ticked paths per snapshot and function', () => {
    checklist.save('s-1', 'f-1', new Set([3, 0]));
    checklist.save('s-2', 'f-1', new Set([1]));

    expect([...checklist.load('s-1', 'f-1')]).toEqual([0, 3]);
    expect([...checklist.load('s-2', 'f-1')]).toEqual([1]);
    expect(checklist.load('s-1', 'f-2').size).toBe(0);
  });

  it('should forget a function whose paths are all unticked', () => {
    checklist.save('s-1', 'f-1', new Set([2]));
    checklist.save('s-1', 'f-1', new Set());

    expect(localStorage.length).toBe(0);
  });

  it('should start empty when the stored text is not a list of indexes', () => {
    localStorage.setItem('seamline.flow.tested.s-1.f-1', '{not json');
    expect(checklist.load('s-1', 'f-1').size).toBe(0);

    localStorage.setItem('seamline.flow.tested.s-1.f-1', '[1,"x",2.5,4]');
    expect([...checklist.load('s-1', 'f-1')]).toEqual([1, 4]);
  });
});
