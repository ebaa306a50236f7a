import { loadVanGraph, loadVanPaths } from './flow-fixtures';
import type { FunctionCoverageDetail } from './flow-types';
import { edgeCoverage, NO_HIGHLIGHT, pathHighlight, pathOutcomesCovered } from './path-highlight';

function coverage(outcomes: [boolean, boolean][]): FunctionCoverageDetail {
  return { outcomes, outcomesCovered: 0, outcomesTotal: 4, actualComplexity: 1, untestedPaths: 2, crap: 3 };
}

describe('pathHighlight', () => {
  it('should mark nothing without a path', () => {
    expect(pathHighlight(loadVanGraph(), null)).toBe(NO_HIGHLIGHT);
  });

  it('should mark the path’s blocks, edges, source lines and the outcome taken at each decision', () => {
    const highlight = pathHighlight(loadVanGraph(), loadVanPaths()[1]);

    expect([...highlight.blocks]).toEqual([0, 1, 2, 3, 4, 6]);
    expect([...highlight.edges]).toEqual([0, 1, 2, 4, 6]);
    expect([...highlight.lines].sort()).toEqual([2, 3, 4, 5]);
    expect([...(highlight.outcomes.get(0) ?? [])]).toEqual(['true']);
    expect([...(highlight.outcomes.get(1) ?? [])]).toEqual(['false']);
  });

  it('should keep both outcomes of a loop test the path passes twice', () => {
    const highlight = pathHighlight(loadVanGraph(), loadVanPaths()[2]);

    expect([...(highlight.outcomes.get(1) ?? [])].sort()).toEqual(['false', 'true']);
    expect(highlight.blocks.has(5)).toBe(true);
    expect(highlight.blocks.has(3)).toBe(false);
    expect(highlight.lines.has(6)).toBe(true);
    expect(highlight.lines.has(4)).toBe(false);
  });
});

describe('edgeCoverage', () => {
  it('should say for each decision edge whether its outcome was covered', () => {
    expect(edgeCoverage(loadVanGraph(), coverage([[true, false], [false, true]]))).toEqual([
      null, null, true, false, null, false, true, null,
    ]);
  });

  it('should know nothing without coverage', () => {
    expect(edgeCoverage(loadVanGraph(), null).every((c) => c === null)).toBe(true);
  });
});

describe('pathOutcomesCovered', () => {
  it('should count the distinct outcomes a path needs that the report covered', () => {
    const report = coverage([[true, false], [true, true]]);
    const [baseline, thenBranch, loop] = loadVanPaths();

    expect(pathOutcomesCovered(baseline, report)).toEqual({ covered: 1, total: 2 });
    expect(pathOutcomesCovered(thenBranch, report)).toEqual({ covered: 2, total: 2 });
    expect(pathOutcomesCovered(loop, report)).toEqual({ covered: 2, total: 3 });
  });
});
