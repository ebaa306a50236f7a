import { analyzeSource } from './analyzeSource';
import { DEFAULT_SETTINGS } from './model';

describe('analyzeSource on deeply nested code', () => {
  const N = 30000;
  const chain = Array.from({ length: N }, (_, i) => `v${i}`).join(' && ');

  it('measures a field whose initializer is one left-deep chain of 30,000 terms without overflowing the stack', () => {
    // The parser leaves parents unlinked; findUnits links them, and must iterate like the parser does.
    const { functions } = analyzeSource('deep.ts', `class Rules {\n  ready = ${chain};\n}\n`, DEFAULT_SETTINGS);
    const field = functions.find((f) => f.kind === 'field-initializer');
    expect(field?.qualifiedName).toBe('Rules.ready');
    expect(field?.decisions).toBe(N - 1);
    expect(field?.cyclomaticStrict).toBe(N);
  });

  it('measures top-level code of the same depth', () => {
    const { functions } = analyzeSource('deep.ts', `export const ready = ${chain};\n`, DEFAULT_SETTINGS);
    expect(functions[0].decisions).toBe(N - 1);
  });
});
