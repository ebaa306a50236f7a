import { HttpErrorResponse } from '@angular/common/http';

import { errorBody } from '../testing/api-fixtures';
import { levelFrom, levelNoun, MAX_SHOWN, PAGE_SIZE, rankingProblem, reasonSentence, shownFrom } from './gravity-view';

describe('gravity view helpers', () => {
  it('should read the level from the URL, folder when missing or unknown', () => {
    expect(levelFrom('file')).toBe('file');
    expect(levelFrom('package')).toBe('package');
    expect(levelFrom(undefined)).toBe('folder');
    expect(levelFrom('galaxy')).toBe('folder');
  });

  it('should read how many modules to show, 20 by default and never more than the server allows', () => {
    expect(shownFrom(undefined)).toBe(PAGE_SIZE);
    expect(shownFrom('40')).toBe(40);
    expect(shownFrom('0')).toBe(PAGE_SIZE);
    expect(shownFrom('many')).toBe(PAGE_SIZE);
    expect(shownFrom('100000')).toBe(MAX_SHOWN);
  });

  it('should write a reason as a sentence', () => {
    expect(reasonSentence('called from 3 of 3 other clusters')).toBe('Called from 3 of 3 other clusters.');
    expect(reasonSentence('ΣV 303, 15× the median module')).toBe('ΣV 303, 15× the median module.');
    expect(reasonSentence('Already a sentence.')).toBe('Already a sentence.');
  });

  it('should name a level in the plural', () => {
    expect(levelNoun('folder')).toBe('folders');
    expect(levelNoun('file', 1)).toBe('file');
  });

  it('should tell a snapshot without a ranking from a failure worth retrying', () => {
    const noMap = new HttpErrorResponse({
      status: 409,
      error: errorBody('no_module_map', 'This snapshot was made without the call graph.'),
    });
    expect(rankingProblem(noMap)).toEqual({ kind: 'unavailable', message: 'This snapshot was made without the call graph.' });
    expect(rankingProblem(new HttpErrorResponse({ status: 503 }))).toEqual({
      kind: 'failed',
      message: 'The server answered with status 503. Please try again.',
    });
  });
});
