import { ESLINT_COMPARABLE_SETTINGS } from '../model/CountingSettings';
import { unitOf } from './fixtures/analyzeSnippet';
import { validateFlowGraph } from './validateFlowGraph';

const N = 5000;
const terms = (op: string): string => Array.from({ length: N }, (_, i) => `v${i}`).join(` ${op} `);

describe('deeply nested input', () => {
  it.each([
    ['&& chain as a value', `function f() { const x = ${terms('&&')}; }`, N - 1],
    ['|| chain as a condition', `function f() { if (${terms('||')}) g(); }`, N],
    ['?? chain', `function f() { return ${terms('??')}; }`, N - 1],
    ['+ chain', `function f() { return ${terms('+')}; }`, 0],
    ['mixed chain', `function f() { return ${terms('+')} && ${terms('||')}; }`, N],
    ['call chain with ?.', `function f() { return a${Array.from({ length: N }, (_, i) => (i % 2 ? `?.m${i}()` : `.m${i}()`)).join('')}; }`, N / 2],
    ['else-if chain', `function f(x) { ${Array.from({ length: 2000 }, (_, i) => `if (x === ${i}) g(${i});`).join(' else ')} }`, 2000],
  ])('should build a %s without overflowing the stack', (_what, code, decisions) => {
    // 5,000 terms parse as one left-deep tree; both walks iterate its left spine.
    const unit = unitOf(code, ESLINT_COMPARABLE_SETTINGS);
    expect(unit.count.total).toBe(decisions);
    expect(unit.strict).toBe(decisions + 1);
    expect(validateFlowGraph(unit.graph)).toEqual([]);
  });
});
