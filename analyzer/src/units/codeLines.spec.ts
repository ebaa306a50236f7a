import { ts } from 'ts-morph';
import { CodeLines } from './codeLines';

function codeLines(code: string) {
  return new CodeLines(ts.createSourceFile('a.ts', code, ts.ScriptTarget.Latest, true));
}

describe('CodeLines', () => {
  it('should count lines holding code and skip comments and blank lines', () => {
    const lines = codeLines(['// header', '', 'function f() {', '  /* note */', '  return 1; // one', '}', ''].join('\n'));
    expect(lines.count(1, 7)).toBe(3);
    expect(lines.count(3, 3)).toBe(1);
    expect(lines.count(4, 4)).toBe(0);
  });

  it('should count every line of a multi-line template as code', () => {
    expect(codeLines('const t = `a\n\nb`;').count(1, 3)).toBe(3);
  });

  it('should count overlapping ranges once', () => {
    const lines = codeLines('a();\nb();\nc();\nd();');
    expect(lines.countUnion([[1, 3], [2, 2], [4, 4]])).toBe(4);
    expect(lines.countUnion([])).toBe(0);
  });
});

describe('CodeLines on tricky lexical cases', () => {
  it('should not take comment markers inside strings, templates or regular expressions for comments', () => {
    const lines = codeLines(['const url = "http://x"; // c', "const re = /\\/\\/*/g;", 'const t = `a /* b', '', '${ "}" } c */`;', '/* real', 'comment */', 'end();'].join('\n'));
    expect([1, 2, 3, 4, 5, 6, 7, 8].map((l) => lines.count(l, l))).toEqual([1, 1, 1, 1, 1, 0, 0, 1]);
  });

  it('should divide after an operand rather than start a regular expression', () => {
    const lines = codeLines(['const half = total / 2; // one', '// two', 'next();'].join('\n'));
    expect([1, 2, 3].map((l) => lines.count(l, l))).toEqual([1, 0, 1]);
  });

  it('should keep counting lines after a line continued with a backslash, in strings and templates, with either line ending', () => {
    for (const eol of ['\n', '\r\n']) {
      const lines = codeLines(['const s = "one \\', 'two";', 'const t = `three \\', 'four`;', '// five', 'six();'].join(eol));
      expect([1, 2, 3, 4, 5, 6].map((l) => lines.count(l, l))).toEqual([1, 1, 1, 1, 0, 1]);
    }
  });
});

