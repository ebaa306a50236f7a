import type { CompactDecision } from './flow-types';

/** A run of characters of one source line, with the decisions whose span covers it. */
export interface SourceSegment {
  text: string;
  /** Decisions covering the run, outermost first. */
  decisions: number[];
  /** Decisions whose span ends right after this run (their marks are drawn here). */
  endingDecisions: number[];
}

/** One line of the function's source. */
export interface SourceLine {
  /** 1-based line in the file. */
  number: number;
  segments: SourceSegment[];
}

/**
 * Splits a function's source into numbered lines, cut where decision spans start and end.
 * `source` starts at `startLine`, column `startColumn` (1-based), so spans on that first line
 * are shifted by the columns before the function's first character.
 */
export function sourceLines(
  source: string,
  startLine: number,
  startColumn: number,
  decisions: readonly CompactDecision[],
): SourceLine[] {
  const texts = source.replace(/\r\n?/g, '\n').split('\n');
  const order = decisions
    .map((d, index) => ({ d, index }))
    .sort((a, b) => a.d.span.line - b.d.span.line || a.d.span.column - b.d.span.column || b.d.span.endLine - a.d.span.endLine || b.d.span.endColumn - a.d.span.endColumn);
  return texts.map((text, i) => {
    const number = startLine + i;
    const shift = i === 0 ? startColumn - 1 : 0;
    const ranges = order
      .filter(({ d }) => d.span.line <= number && d.span.endLine >= number)
      .map(({ d, index }) => ({
        index,
        start: d.span.line === number ? clamp(d.span.column - 1 - shift, text.length) : 0,
        end: d.span.endLine === number ? clamp(d.span.endColumn - 1 - shift, text.length) : text.length,
        endsHere: d.span.endLine === number,
      }));
    return { number, segments: cut(text, ranges) };
  });
}

function cut(text: string, ranges: { index: number; start: number; end: number; endsHere: boolean }[]): SourceSegment[] {
  const bounds = new Set([0, text.length]);
  for (const r of ranges) {
    bounds.add(r.start);
    bounds.add(r.end);
  }
  const points = [...bounds].sort((a, b) => a - b);
  const segments: SourceSegment[] = [];
  for (let k = 0; k < points.length - 1; k++) {
    const [from, to] = [points[k], points[k + 1]];
    segments.push({
      text: text.slice(from, to),
      decisions: ranges.filter((r) => r.start <= from && r.end >= to && r.start < r.end).map((r) => r.index),
      endingDecisions: ranges.filter((r) => r.endsHere && r.end === to).map((r) => r.index),
    });
  }
  if (segments.length === 0) {
    // An empty line, or one whose only decision span is empty.
    segments.push({ text, decisions: [], endingDecisions: ranges.filter((r) => r.endsHere).map((r) => r.index) });
  }
  return segments;
}

function clamp(value: number, max: number): number {
  return Math.min(Math.max(value, 0), max);
}

/**
 * The 1-based column of the source's first character on its first line. The API gives the
 * function's line but not its column, so a decision on that line whose text is found there
 * tells the shift; without one, spans on the first line cannot be misplaced, so 1 is safe.
 */
export function firstColumnOf(source: string, startLine: number, decisions: readonly CompactDecision[]): number {
  const firstLine = source.split('\n', 1)[0];
  for (const d of decisions) {
    if (d.span.line !== startLine || d.text === '') continue;
    const probe = d.text.replace(/…$/, '').slice(0, 24);
    const at = firstLine.indexOf(probe);
    if (at >= 0) return Math.max(1, d.span.column - at);
  }
  return 1;
}
