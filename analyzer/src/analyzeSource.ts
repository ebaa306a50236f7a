/**
 * Analysing one source file
 * =========================
 * Parses one file's text and measures every unit in it: its control-flow graph, V(G) from the
 * graph cross-checked against the decisions counted on the syntax tree, ev(G), lines, name, id
 * and fingerprint. Pure: text in, plain records out; nothing of the code is executed.
 */
import { ts } from './compiler';
import { buildFlowGraph } from './cfg/buildFlowGraph';
import { toCompactGraph } from './cfg/compactGraph';
import { countDecisions } from './decisions/countDecisions';
import { essentialComplexity } from './essential/essentialComplexity';
import { cyclomaticOf, reportedCyclomatic } from './metrics/cyclomatic';
import type { CountingSettings, FunctionRecord } from './model';
import { CodeLines } from './units/codeLines';
import { findUnits } from './units/findUnits';
import { fingerprintOf } from './units/fingerprint';
import { unitId } from './units/unitId';
import { unitSpan } from './units/unitSpan';

/** The file does not parse; the scan reports it and goes on with the others. */
export class SourceSyntaxError extends Error {
  constructor(
    readonly file: string,
    readonly line: number,
    readonly column: number,
    reason: string,
  ) {
    super(`${file}:${line}:${column}: ${reason}`);
    this.name = 'SourceSyntaxError';
  }
}

/** V(G) from the graph disagrees with the syntax count: a bug in the analyzer, never in the user's code. */
export class MetricMismatchError extends Error {
  constructor(file: string, unit: string, graphV: number, decisions: number) {
    super(`analyzer: ${file} ${unit}: the graph gives V(G) = ${graphV} but ${decisions} decisions were counted (expected ${decisions + 1})`);
    this.name = 'MetricMismatchError';
  }
}

export interface AnalyzeOptions {
  /** Include each unit's source text in its record. */
  embedSource?: boolean;
}

/** What one file gives: its units' records and its lines of code. */
export interface SourceAnalysis {
  functions: FunctionRecord[];
  /** Lines holding code in the whole file. */
  loc: number;
}

/** Measures every unit of one file; `file` is the posix path relative to the scanned root. */
export function analyzeSource(file: string, text: string, settings: CountingSettings, options: AnalyzeOptions = {}): SourceAnalysis {
  // JSDoc says nothing about control flow; not parsing it saves a third of the parse on documented code.
  const parseOptions = { languageVersion: ts.ScriptTarget.Latest, jsDocParsingMode: ts.JSDocParsingMode.ParseNone };
  // Parents are linked by findUnits' walk, more cheaply than by the parser's own pass.
  const sourceFile = ts.createSourceFile(file, text, parseOptions, false, scriptKindOf(file));
  const syntaxError = firstSyntaxError(sourceFile);
  if (syntaxError) throw new SourceSyntaxError(file, syntaxError.line, syntaxError.column, syntaxError.message);

  const units = findUnits(sourceFile, (field) => countDecisions(field, sourceFile, settings).total > 0);
  const codeLines = new CodeLines(sourceFile);
  const ordinals = new Map<string, number>();
  const lastLine = sourceFile.getLineStarts().length;

  const functions = units.map((unit) => {
    const graph = buildFlowGraph(unit.node, sourceFile, settings);
    const decisions = countDecisions(unit.node, sourceFile, settings);
    const measured = cyclomaticOf(graph);
    if (measured.strict !== decisions.total + 1) throw new MetricMismatchError(file, unit.qualifiedName, measured.strict, decisions.total);
    const span = unitSpan(unit.node, sourceFile);
    const ordinal = ordinals.get(unit.stableName) ?? 0;
    ordinals.set(unit.stableName, ordinal + 1);
    const record: FunctionRecord = {
      id: unitId(file, unit.stableName, ordinal),
      name: unit.name,
      qualifiedName: unit.qualifiedName,
      kind: unit.kind,
      file,
      line: span.line,
      endLine: span.endLine,
      // Top-level code owns only the lines no function or class member holds.
      loc: ts.isSourceFile(unit.node) ? 0 : codeLines.count(span.line, span.endLine),
      cyclomatic: reportedCyclomatic(measured.strict, decisions.casesPerSwitch, settings),
      cyclomaticStrict: measured.strict,
      decisions: decisions.total,
      nodes: measured.nodes,
      edges: measured.edges,
      // A graph with at most one decision is always an if or a loop, which reduces (NIST SP 500-235 §10.2).
      essential: decisions.total <= 1 ? 1 : essentialComplexity(graph).essential,
      fingerprint: fingerprintOf(unit.nodes),
      unresolvedCalls: 0,
      externalCalls: 0,
      graph: toCompactGraph(graph),
    };
    if (options.embedSource) record.source = text.slice(span.start, ts.isSourceFile(unit.node) ? text.length : unit.node.end);
    return record;
  });
  const loc = codeLines.count(1, lastLine);
  functions[0].loc = loc - codeLines.countUnion(functions.slice(1).map((f) => [f.line, f.endLine]));
  return { functions, loc };
}

/** Script kind from the file extension (JS files parse as JavaScript, TSX/JSX with JSX). */
export function scriptKindOf(file: string): ts.ScriptKind {
  if (/\.tsx$/i.test(file)) return ts.ScriptKind.TSX;
  if (/\.jsx$/i.test(file)) return ts.ScriptKind.JSX;
  if (/\.[cm]?js$/i.test(file)) return ts.ScriptKind.JS;
  return ts.ScriptKind.TS;
}

function firstSyntaxError(sourceFile: ts.SourceFile): { line: number; column: number; message: string } | undefined {
  // The parser keeps its diagnostics on the node; reading them avoids building a Program.
  const diagnostics = (sourceFile as unknown as { parseDiagnostics?: ts.Diagnostic[] }).parseDiagnostics ?? [];
  const first = diagnostics[0];
  if (!first) return undefined;
  const { line, character } = sourceFile.getLineAndCharacterOfPosition(first.start ?? 0);
  return { line: line + 1, column: character + 1, message: ts.flattenDiagnosticMessageText(first.messageText, ' ') };
}
