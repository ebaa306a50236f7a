import type { FunctionKind } from '../model';
import { applyCoverage } from './applyCoverage';
import type { BranchRecord, FileCoverage } from './CoverageReport';
import { crap } from './crap';
import { testGraph } from './testGraph';

const file = (lines: Record<number, number>, branches: BranchRecord[] = [], calls?: number, fnLine = 1): FileCoverage => ({
  branches,
  lines: new Map(Object.entries(lines).map(([l, h]) => [Number(l), h])),
  functions: calls === undefined ? [] : [{ name: 'f', line: fnLine, calls }],
});
const rec = (line: number, counts: (number | null)[], type?: string, block = `${line}`): BranchRecord => ({ line, block, counts, ...(type ? { type } : {}) });
const unit = (graph: ReturnType<typeof testGraph>, endLine: number, kind: FunctionKind = 'function') => ({ graph, kind, line: 1, endLine });

// 1 function f(x) {      2   if (x) {      3     a();      4   } else {      5     b();
// 6   }                  7   c();          8 }
const IF_ELSE = testGraph('0>1; 1?2:3 if 2:7-2:8; 2>4; 3>4; 4>5', { 2: 3, 3: 5, 4: 7 });

describe('applyCoverage: if / conditional', () => {
  it.each([
    ['istanbul', 'if'],
    ['lcov', undefined],
  ])('maps [then, else] counts from %s', (_format, type) => {
    const both = applyCoverage(unit(IF_ELSE, 8), file({ 2: 2, 3: 1, 5: 1, 7: 2 }, [rec(2, [1, 1], type)], 2));
    expect(both).toEqual({ outcomesCovered: 2, outcomesTotal: 2, outcomes: [[true, true]], actualComplexity: 2, untestedPaths: 0, crap: 2 });
    const thenOnly = applyCoverage(unit(IF_ELSE, 8), file({ 2: 2, 3: 2, 5: 0, 7: 2 }, [rec(2, [2, 0], type)], 2));
    expect(thenOnly.outcomes).toEqual([[true, false]]);
    expect(thenOnly.actualComplexity).toBe(1);
    expect(thenOnly.untestedPaths).toBe(1);
    expect(thenOnly.crap).toBe(crap(2, 0.5)); // Savoia 2007: 4 × 0.125 + 2
    expect(thenOnly.crap).toBe(2.5);
  });

  it('treats lcov "-" as not run, and a unit that never ran as fully uncovered', () => {
    expect(applyCoverage(unit(IF_ELSE, 8), file({ 2: 1 }, [rec(2, [null, 1])], 1)).outcomes).toEqual([[false, true]]);
    const never = applyCoverage(unit(IF_ELSE, 8), file({ 2: 0, 3: 0, 5: 0, 7: 0 }, [rec(2, [0, 0], 'if')], 0));
    expect(never).toEqual({ outcomesCovered: 0, outcomesTotal: 2, outcomes: [[false, false]], actualComplexity: 0, untestedPaths: 2, crap: 6 });
  });

  it('matches decisions sharing a line in order of appearance', () => {
    // 2   const r = p ? 1 : 2; if (q) { s(); }      3   t();
    const g = testGraph('0>1; 1?2:3 conditional 2:13-2:14; 2>4; 3>4; 4?5:6 if 2:27-2:28; 5>6; 6>7', { 5: 2, 6: 3 });
    const cov = applyCoverage(unit(g, 4), file({ 2: 3, 3: 3 }, [rec(2, [3, 0], 'cond-expr', '0'), rec(2, [0, 3], 'if', '1')], 3));
    expect(cov.outcomes).toEqual([[true, false], [false, true]]);
  });

  it('leaves records of a nested unit to that unit', () => {
    // Lines 3–5 are a nested function; its record on line 4 must not serve our `if` (none is on line 2).
    const g = testGraph('0>1; 1?2:3 if 6:7-6:8; 2>3; 3>4', { 2: 7, 3: 8 });
    const cov = applyCoverage({ ...unit(g, 9), nested: [{ line: 3, endLine: 5 }] }, file({ 6: 1, 7: 0, 8: 1 }, [rec(4, [1, 1], 'if'), rec(6, [0, 1], 'if')], 1));
    expect(cov.outcomes).toEqual([[false, true]]);
  });
});

describe('applyCoverage: short-circuit operators', () => {
  // 2   if (a && b && c) { d(); }      3   e();
  // The graph tests a, then b, then c (the if's own test), as the builder lays out conditions.
  const AND3 = testGraph('0>1; 1?2:5 and 2:7-2:8; 2?3:5 and 2:7-2:13; 3?4:5 if 2:7-2:18; 4>5; 5>6', { 4: 2, 5: 3 });

  it.each([
    ['istanbul', 'if', 'binary-expr'],
    ['lcov', undefined, undefined],
  ])('reads one count per operand (%s)', (_format, ifType, exprType) => {
    // a evaluated 3×, b 2× (a false once), c 1× (b false once); the if: then 1, else 2.
    const cov = applyCoverage(unit(AND3, 4), file({ 2: 3, 3: 3 }, [rec(2, [1, 2], ifType, '0'), rec(2, [3, 2, 1], exprType, '1')], 3));
    expect(cov.outcomes).toEqual([[true, true], [true, true], [true, true]]);
    expect(cov.actualComplexity).toBe(4);
  });

  it('sees which operand never short-circuited', () => {
    // a false once; b never false (each time b ran, c ran too).
    const cov = applyCoverage(unit(AND3, 4), file({ 2: 2, 3: 2 }, [rec(2, [1, 1], 'if', '0'), rec(2, [2, 1, 1], 'binary-expr', '1')], 2));
    expect(cov.outcomes).toEqual([[true, true], [true, false], [true, true]]);
    expect(cov.outcomesCovered).toBe(5);
    expect(cov.actualComplexity).toBe(3);
    expect(cov.untestedPaths).toBe(1);
  });

  it('continues on false for || and on true for ?? (true = left is null or undefined)', () => {
    // 2   return a || b;   with a truthy every time: b never evaluated.
    const or = testGraph('0>1; 1?2:3 or 2:10-2:11; 3>2; 2>4', { 2: 2, 3: 2 });
    expect(applyCoverage(unit(or, 3), file({ 2: 4 }, [rec(2, [4, 0], 'binary-expr')], 4)).outcomes).toEqual([[true, false]]);
    const nullish = testGraph('0>1; 1?2:3 nullish 2:10-2:11; 3>2; 2>4', { 2: 2, 3: 2 });
    // a nullish every time: b ran each time.
    expect(applyCoverage(unit(nullish, 3), file({ 2: 4 }, [rec(2, [4, 4], 'binary-expr')], 4)).outcomes).toEqual([[true, false]]);
  });

  it('reads a ?? chain as tests of the whole left side', () => {
    // 2   return a ?? b ?? c;   a: 4 evaluations, b: 1 (a nullish once), c: 0.
    // The second ?? tests (a ?? b): 4 times, never nullish; the first tests a: nullish once.
    const g = testGraph('0>1; 1?2:3 nullish 2:10-2:11; 2>3; 3?4:5 nullish 2:10-2:16; 4>5; 5>6', { 2: 2, 4: 2, 5: 2 });
    const cov = applyCoverage(unit(g, 3), file({ 2: 4 }, [rec(2, [4, 1, 0], 'binary-expr')], 4));
    expect(cov.outcomes).toEqual([[true, true], [false, true]]);
  });

  it('tests && over a parenthesised ?? on the value of the ??', () => {
    // 2   return (a ?? b) && c;   a: 3, b: 3 (always nullish), c: 2 → the && was falsy once.
    const g = testGraph('0>1; 1?2:3 nullish 2:11-2:12; 2>3; 3?4:5 and 2:10-2:18; 4>5; 5>6', { 2: 2, 4: 2, 5: 2 });
    const cov = applyCoverage(unit(g, 3), file({ 2: 3 }, [rec(2, [3, 3, 2], 'binary-expr')], 3));
    expect(cov.outcomes).toEqual([[true, false], [true, true]]);
  });

  it('leaves a logical assignment on its own line uncovered (no branch record; its line mixes both outcomes)', () => {
    // 2   x ||= y();
    const g = testGraph('0>1; 1?2:3 or-assign 2:3-2:4; 3>2; 2>4', { 2: 2, 3: 2 });
    expect(applyCoverage(unit(g, 3), file({ 2: 5 }, [], 5)).outcomes).toEqual([[false, false]]);
  });
});

describe('applyCoverage: switch', () => {
  // 2 switch (d) {   3 case 0: return 'a';   4 case 6: return 'b';   5 default: return 'c';   6 }
  const SWITCH = testGraph('0>1; 1?2:3 case 3:10-3:11 #0; 2>6; 3?4:5 case 4:10-4:11 #0; 4>6; 5>6', { 2: 3, 4: 4, 5: 5 });

  it('matches one count per clause, the default included', () => {
    const cov = applyCoverage(unit(SWITCH, 6), file({ 2: 2, 3: 0, 4: 1, 5: 1 }, [rec(2, [0, 1, 1], 'switch')], 2));
    expect(cov.outcomes).toEqual([[false, true], [true, true]]);
    expect(cov.actualComplexity).toBe(2);
    expect(cov.untestedPaths).toBe(1);
  });

  it('finds a default in the middle from Istanbul clause places', () => {
    // 3 case 0:   4 default:   5 case 6:   — our cases sit on lines 3 and 5.
    const g = testGraph('0>1; 1?2:3 case 3:10-3:11 #0; 2>6; 3?4:5 case 5:10-5:11 #0; 4>6; 5>6', { 2: 3, 4: 5, 5: 4 });
    const record: BranchRecord = { ...rec(2, [1, 0, 0], 'switch'), locations: [{ line: 3, column: 5 }, { line: 4, column: 5 }, { line: 5, column: 5 }] };
    expect(applyCoverage(unit(g, 6), file({ 2: 1 }, [record], 1)).outcomes).toEqual([[true, false], [false, false]]);
  });

  it('counts "no case matched" from the switch line when there is no default', () => {
    const g = testGraph('0>1; 1?2:3 case 3:10-3:11 #0; 2>5; 3?4:5 case 4:10-4:11 #0; 4>5', { 2: 3, 4: 4 });
    // The switch ran 3×, case 0 once, case 6 never: twice nothing matched.
    expect(applyCoverage(unit(g, 6), file({ 2: 3 }, [rec(2, [1, 0])], 3)).outcomes).toEqual([[true, true], [false, true]]);
  });
});

describe('applyCoverage: loops, catch and default values (line hits)', () => {
  // 2 let s = 0;   3 for (const x of xs) {   4   s += x;   5 }   6 return s;
  const FOR_OF = testGraph('0>1; 1>2; 2?3:4 for-of 3:3-3:22; 3>2; 4>5', { 1: 2, 3: 4, 4: 6 });

  it('covers a loop both ways when its body ran and its exit was reached', () => {
    const cov = applyCoverage(unit(FOR_OF, 7), file({ 2: 1, 3: 1, 4: 2, 6: 1 }, [], 1));
    expect(cov.outcomes).toEqual([[true, true]]);
    expect(cov.actualComplexity).toBe(2);
  });

  it('covers only the exit of a loop whose body never ran', () => {
    const cov = applyCoverage(unit(FOR_OF, 7), file({ 2: 1, 3: 1, 4: 0, 6: 1 }, [], 1));
    expect(cov.outcomes).toEqual([[false, true]]);
    expect(cov.crap).toBe(crap(2, 0.5));
  });

  it('counts a loop that ends the function as left whenever it ran', () => {
    // 2 while (busy()) {   3   step();   4 }   (exit right after)
    const g = testGraph('0>1; 1?2:3 while 2:10-2:16; 2>1', { 2: 3 });
    expect(applyCoverage(unit(g, 5), file({ 2: 1, 3: 0 }, [], 1)).outcomes).toEqual([[false, true]]);
    expect(applyCoverage(unit(g, 5), file({ 2: 0, 3: 0 }, [], 1)).outcomes).toEqual([[false, false]]);
  });

  // 2 try {   3   v = parse();   4 } catch {   5   v = -1;   6 }   7 return v;
  // As the builder lays it out: the catch decision comes first, false → the try block, true → the handler.
  const TRY = testGraph('0>1; 1?3:2 catch 4:5-4:11; 2>4; 3>4; 4>5', { 2: 3, 3: 5, 4: 7 });

  it.each([
    [{ 3: 2, 5: 0, 7: 2 }, [false, true]],
    [{ 3: 2, 5: 1, 7: 2 }, [true, true]],
    [{ 3: 2, 5: 2, 7: 2 }, [true, false]],
  ])('covers catch from try-block runs against handler runs: %j', (lines, expected) => {
    expect(applyCoverage(unit(TRY, 8), file(lines, [], 2)).outcomes).toEqual([expected]);
  });

  it('reads a default-arg count against the calls', () => {
    // 1 function f(a = 1) {   2   g(a);   3 }
    const g = testGraph('0>1; 1?2:3 default-value 1:12-1:17; 2>3; 3>4', { 3: 2 });
    expect(applyCoverage(unit(g, 3), file({ 2: 3 }, [rec(1, [1], 'default-arg')], 3)).outcomes).toEqual([[true, true]]);
    expect(applyCoverage(unit(g, 3), file({ 2: 3 }, [rec(1, [3], 'default-arg')], 3)).outcomes).toEqual([[true, false]]);
  });
});

describe('applyCoverage: units without decisions', () => {
  const STRAIGHT = testGraph('0>1; 1>2', { 1: 2 });

  it('counts them fully covered when they ran, uncovered when not', () => {
    expect(applyCoverage(unit(STRAIGHT, 3), file({ 2: 1 }, [], 1))).toEqual({
      outcomesCovered: 0, outcomesTotal: 0, outcomes: [], actualComplexity: 1, untestedPaths: 0, crap: 1,
    });
    expect(applyCoverage(unit(STRAIGHT, 3), file({ 2: 0 }, [], 0)).crap).toBe(crap(1, 0)); // Savoia 2007 / reference-checks §7: comp 1 at 0 % = 2
  });

  it('tells whether top-level code ran from its own lines, not from nested units', () => {
    const cov = applyCoverage({ ...unit(STRAIGHT, 10, 'top-level'), nested: [{ line: 2, endLine: 8 }] }, file({ 5: 3, 9: 0 }, [], 3, 1));
    expect(cov.actualComplexity).toBe(0);
  });
});
