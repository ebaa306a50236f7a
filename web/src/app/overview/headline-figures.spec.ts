import { codebase, snapshot } from '../testing/api-fixtures';
import { formatBytes, headlineFigures, isUnfinished, latestReady, phaseLabel } from './headline-figures';

describe('latestReady', () => {
  it('should pick the newest ready snapshot, passing over running and failed ones', () => {
    const found = latestReady(
      codebase('dispatch', [
        snapshot({ id: 'running', status: 'running', totals: null }),
        snapshot({ id: 'failed', status: 'failed', totals: null }),
        snapshot({ id: 'ready-new' }),
        snapshot({ id: 'ready-old' }),
      ]),
    );
    expect(found?.id).toBe('ready-new');
  });

  it('should give null when no snapshot is ready', () => {
    expect(latestReady(codebase('tracking', [snapshot({ status: 'queued', totals: null })]))).toBeNull();
    expect(latestReady(codebase('empty', []))).toBeNull();
  });
});

describe('headlineFigures', () => {
  it('should show that ΣV − Σπ is P when switches count per case', () => {
    const figures = headlineFigures(
      snapshot({
        totals: { functions: 618, cyclomatic: 1322, decisions: 704, overLimit: 15, modularity: 0.547 },
        settings: { limit: 15, switch: 'cases' },
      }),
    );
    expect(figures).toEqual({
      functions: 618,
      cyclomatic: 1322,
      decisions: 704,
      difference: 618,
      differenceIsP: true,
      overLimit: 15,
      limit: 15,
      modularity: 0.547,
      switchCountedAsOne: false,
    });
  });

  it('should say so when the settings break the identity, and default the limit to 10', () => {
    const figures = headlineFigures(
      snapshot({ totals: { functions: 10, cyclomatic: 25, decisions: 20 }, settings: { switch: 'one' } }),
    );
    expect(figures).toMatchObject({ difference: 5, differenceIsP: false, limit: 10, switchCountedAsOne: true });
    expect(figures?.overLimit).toBeNull();
    expect(figures?.modularity).toBeNull();
  });

  it('should give null without totals', () => {
    expect(headlineFigures(snapshot({ status: 'running', totals: null }))).toBeNull();
  });
});

describe('isUnfinished and phaseLabel', () => {
  it('should treat queued and running as unfinished', () => {
    expect(['queued', 'running', 'ready', 'failed'].map((status) => isUnfinished(snapshot({ status: status as never })))).toEqual([
      true,
      true,
      false,
      false,
    ]);
  });

  it('should put known phases into words and pass unknown ones through', () => {
    expect(phaseLabel('extract')).toBe('Unpacking the zip');
    expect(phaseLabel('calls')).toBe('Resolving calls and the module map');
    expect(phaseLabel('weigh')).toBe('weigh');
    expect(phaseLabel(null)).toBe('Working');
  });
});

describe('formatBytes', () => {
  it.each([
    [0, '0 bytes'],
    [1, '1 byte'],
    [17, '17 bytes'],
    [86317, '84 KB'],
    [5 * 1024 * 1024 + 200_000, '5.2 MB'],
    [200 * 1024 * 1024, '200 MB'],
  ])('should write %d as %s', (bytes, text) => {
    expect(formatBytes(bytes)).toBe(text);
  });
});
