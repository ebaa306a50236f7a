import { LOAD_VAN_SOURCE, loadVanGraph } from './flow-fixtures';
import type { CompactDecision } from './flow-types';
import { firstColumnOf, sourceLines } from './source-lines';

function decision(line: number, column: number, endLine: number, endColumn: number, text: string): CompactDecision {
  return { kind: 'and', block: 1, span: { line, column, endLine, endColumn }, text };
}

describe('sourceLines', () => {
  it('should number the lines from the function’s first line and cut out each decision span', () => {
    const lines = sourceLines(LOAD_VAN_SOURCE, 2, 1, loadVanGraph().decisions);

    expect(lines.map((l) => l.number)).toEqual([2, 3, 4, 5, 6, 7, 8]);
    expect(lines[0].segments).toEqual([{ text: LOAD_VAN_SOURCE.split('\n')[0], decisions: [], endingDecisions: [] }]);
    expect(lines[1].segments).toEqual([
      { text: '  if (', decisions: [], endingDecisions: [] },
      { text: 'ready', decisions: [0], endingDecisions: [0] },
      { text: ') {', decisions: [], endingDecisions: [] },
    ]);
    expect(lines[3].segments.map((s) => s.text)).toEqual(['  while (', 'queue', ') {']);
    expect(lines[3].segments[1].decisions).toEqual([1]);
  });

  it('should keep every character of the source', () => {
    const lines = sourceLines(LOAD_VAN_SOURCE, 2, 1, loadVanGraph().decisions);

    expect(lines.map((l) => l.segments.map((s) => s.text).join('')).join('\n')).toBe(LOAD_VAN_SOURCE);
  });

  it('should shift spans on the first line when the source starts after column 1', () => {
    // `source` starts at the arrow's first character, column 17 of line 10.
    const source = '(o) => o.paid && o.packed';
    const lines = sourceLines(source, 10, 17, [decision(10, 24, 10, 30, 'o.paid')]);

    expect(lines[0].segments.map((s) => s.text)).toEqual(['(o) => ', 'o.paid', ' && o.packed']);
  });

  it('should mark a span across lines on each line it covers, ending on the last', () => {
    const source = ['if (', '  a &&', '  b', ') {}'].join('\n');
    const lines = sourceLines(source, 1, 1, [decision(1, 5, 3, 4, 'a && b')]);

    expect(lines[0].segments).toEqual([{ text: 'if (', decisions: [], endingDecisions: [] }]);
    expect(lines[1].segments).toEqual([{ text: '  a &&', decisions: [0], endingDecisions: [] }]);
    expect(lines[2].segments).toEqual([{ text: '  b', decisions: [0], endingDecisions: [0] }]);
    expect(lines[3].segments).toEqual([{ text: ') {}', decisions: [], endingDecisions: [] }]);
  });

  it('should nest an operand’s span inside its condition’s span, outermost first', () => {
    const source = 'if (a && b) go();';
    const outer = { ...decision(1, 5, 1, 11, 'a && b'), kind: 'if' as const };
    const inner = decision(1, 5, 1, 6, 'a');
    const lines = sourceLines(source, 1, 1, [inner, outer]);

    expect(lines[0].segments).toEqual([
      { text: 'if (', decisions: [], endingDecisions: [] },
      { text: 'a', decisions: [1, 0], endingDecisions: [0] },
      { text: ' && b', decisions: [1], endingDecisions: [1] },
      { text: ') go();', decisions: [], endingDecisions: [] },
    ]);
  });
});

describe('firstColumnOf', () => {
  it('should find the first line’s column from a decision on that line', () => {
    expect(firstColumnOf('(o) => o.paid && o.packed', 10, [decision(10, 24, 10, 30, 'o.paid')])).toBe(17);
  });

  it('should assume column 1 without a decision on the first line', () => {
    expect(firstColumnOf(LOAD_VAN_SOURCE, 2, loadVanGraph().decisions)).toBe(1);
  });
});
