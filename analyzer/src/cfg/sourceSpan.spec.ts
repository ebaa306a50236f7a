import { collapsedText, MAX_DECISION_TEXT } from './sourceSpan';

describe('collapsedText', () => {
  const whole = (text: string) => collapsedText(text, 0, text.length);

  it('collapses each run of whitespace to one space and drops it at both ends', () => {
    expect(whole('  a &&\n\t  b   ||  c ')).toBe('a && b || c');
    expect(whole('x')).toBe('x');
    expect(whole(' \n ')).toBe('');
  });

  it('reads only the given range', () => {
    expect(collapsedText('if (ready &&  done) {', 4, 18)).toBe('ready && done');
  });

  it('keeps 120 characters whole and cuts anything longer with an ellipsis', () => {
    const exact = 'a'.repeat(MAX_DECISION_TEXT);
    expect(whole(exact)).toBe(exact);
    const long = `${'b'.repeat(100)}   ${'c'.repeat(30)}`;
    const cut = whole(long);
    expect(cut).toHaveLength(MAX_DECISION_TEXT);
    expect(cut).toBe(`${'b'.repeat(100)} ${'c'.repeat(MAX_DECISION_TEXT - 102)}…`);
  });
});
