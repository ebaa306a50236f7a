/**
 * Control-flow graph of a function unit
 * =====================================
 * Builds the graph of basic blocks for one unit: a function-like node (declaration, expression,
 * arrow with block or expression body, method, constructor, accessor), a class static block, a
 * class field (its initializer is the body) or a source file (its top-level code).
 *
 * The graph has one entry and one exit block; every decision is a block with exactly two
 * labelled out-edges and every other non-exit block has exactly one out-edge. Dead code is kept
 * (built with its own blocks, flowing on normally) and constant conditions are not folded, so
 * E − N + 2 = decisions + 1 for every unit, which `countDecisions` checks independently on the
 * syntax tree. See the construct files for each shape: buildCondition (short-circuit operators),
 * buildValue (operators in expressions, `?.`), buildPatterns (defaults), buildLoops,
 * buildSwitch, buildTry (catch as a decision, finally built once) and unitBoundaries (which
 * code belongs to which unit; class decorators, `extends` and computed names belong to the code
 * that defines the class).
 *
 * [Reference]: McCabe 1976, IEEE TSE SE-2(4) (program control graph, v = e − n + 2p);
 * Watson & McCabe, NIST SP 500-235 §2, §4 (binary decisions: v = π + 1).
 */
import type { ts } from '../compiler';
import type { CountingSettings } from '../model/CountingSettings';
import type { FlowGraph } from '../model/FlowGraph';
import { buildParameters } from './buildPatterns';
import { FlowBuilder } from './FlowBuilder';
import { unitParts } from './unitBoundaries';

/** The control-flow graph of one unit under the counting settings; throws FlowGraphError for a node that is no unit. */
export function buildFlowGraph(unit: ts.Node, sourceFile: ts.SourceFile, settings: CountingSettings): FlowGraph {
  const parts = unitParts(unit);
  const b = new FlowBuilder(sourceFile, settings);
  buildParameters(b, parts.parameters);
  if (parts.statements) {
    b.statements(parts.statements);
  } else if (parts.expression) {
    b.value(parts.expression);
    b.w.emitNode(parts.expression);
  }
  return b.finish();
}
