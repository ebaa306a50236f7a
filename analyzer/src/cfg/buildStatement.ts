/**
 * Statements
 * ==========
 * One small builder per statement kind; loops, `switch` and `try` have their own files.
 * A simple statement adds its source to the open code block (after the branches of any `&&`,
 * `?:`… inside it are built, so the block that completes the statement holds its span).
 * `break`, `continue`, `return` and `throw` end the flow: what follows is dead code, still built.
 * Function declarations, type-only and ambient statements hold no runtime code. A namespace body
 * runs in place. `else if` chains are walked with a loop.
 */
import { ts } from '../compiler';
import type { FlowBuilder } from './FlowBuilder';
import { buildDoWhile, buildFor, buildForInOf, buildWhile } from './buildLoops';
import { buildDeclarations } from './buildPatterns';
import { buildSwitch } from './buildSwitch';
import { buildTry } from './buildTry';
import { forEachClassPart, isTypeOrAmbient } from './unitBoundaries';

const K = ts.SyntaxKind;

export function buildStatement(b: FlowBuilder, node: ts.Statement): void {
  if (isTypeOrAmbient(node)) return;
  switch (node.kind) {
    case K.Block:
      b.statements((node as ts.Block).statements);
      return;
    case K.EmptyStatement:
    case K.FunctionDeclaration:
      return;
    case K.VariableStatement:
      buildDeclarations(b, (node as ts.VariableStatement).declarationList);
      b.w.emitNode(node);
      return;
    case K.ExpressionStatement:
      b.value((node as ts.ExpressionStatement).expression);
      b.w.emitNode(node);
      return;
    case K.IfStatement:
      buildIf(b, node as ts.IfStatement);
      return;
    case K.LabeledStatement:
      buildLabeled(b, node as ts.LabeledStatement);
      return;
    case K.DoStatement:
    case K.WhileStatement:
    case K.ForStatement:
    case K.ForInStatement:
    case K.ForOfStatement:
      buildLoop(b, node as ts.IterationStatement, []);
      return;
    case K.SwitchStatement:
      buildSwitch(b, node as ts.SwitchStatement);
      return;
    case K.TryStatement:
      buildTry(b, node as ts.TryStatement);
      return;
    case K.BreakStatement:
      b.w.emitNode(node);
      b.jump(b.breakTarget((node as ts.BreakStatement).label?.text));
      return;
    case K.ContinueStatement:
      b.w.emitNode(node);
      b.jump(b.continueTarget((node as ts.ContinueStatement).label?.text));
      return;
    case K.ReturnStatement: {
      const expression = (node as ts.ReturnStatement).expression;
      if (expression) b.value(expression);
      b.w.emitNode(node);
      b.jump(b.exitTarget);
      return;
    }
    case K.ThrowStatement:
      b.value((node as ts.ThrowStatement).expression);
      b.w.emitNode(node);
      b.jump(b.throwTarget());
      return;
    case K.WithStatement:
      b.value((node as ts.WithStatement).expression);
      b.w.emitNode((node as ts.WithStatement).expression);
      b.statement((node as ts.WithStatement).statement);
      return;
    case K.ClassDeclaration:
      forEachClassPart(node as ts.ClassDeclaration, b.visitValue);
      b.w.emitNode(node);
      return;
    case K.ModuleDeclaration:
      buildNamespace(b, node as ts.ModuleDeclaration);
      return;
    default:
      b.value(node);
      b.w.emitNode(node);
  }
}

function buildIf(b: FlowBuilder, first: ts.IfStatement): void {
  const done: number[] = [];
  let node = first;
  for (;;) {
    const d = b.decision('if', node.expression);
    const whenTrue: number[] = [];
    const whenFalse: number[] = [];
    b.condition(node.expression, whenTrue, whenFalse, d);
    b.w.merge(whenTrue);
    b.statement(node.thenStatement);
    for (const e of b.w.take()) done.push(e);
    b.w.merge(whenFalse);
    const otherwise = node.elseStatement;
    if (otherwise?.kind === K.IfStatement) {
      node = otherwise as ts.IfStatement;
      continue;
    }
    if (otherwise) b.statement(otherwise);
    b.w.merge(done);
    return;
  }
}

function buildLabeled(b: FlowBuilder, node: ts.LabeledStatement): void {
  const labels: string[] = [];
  let body: ts.Statement = node;
  while (body.kind === K.LabeledStatement) {
    labels.push((body as ts.LabeledStatement).label.text);
    body = (body as ts.LabeledStatement).statement;
  }
  if (ts.isIterationStatement(body, false)) {
    buildLoop(b, body, labels);
    return;
  }
  const breakTarget = b.newTarget();
  b.pushScope({ kind: 'label', labels, breakTarget });
  b.statement(body);
  b.popScope();
  b.w.merge(breakTarget.edges);
}

function buildLoop(b: FlowBuilder, node: ts.IterationStatement, labels: readonly string[]): void {
  switch (node.kind) {
    case K.WhileStatement:
      return buildWhile(b, node as ts.WhileStatement, labels);
    case K.DoStatement:
      return buildDoWhile(b, node as ts.DoStatement, labels);
    case K.ForStatement:
      return buildFor(b, node as ts.ForStatement, labels);
    default:
      return buildForInOf(b, node as ts.ForInStatement | ts.ForOfStatement, labels);
  }
}

/** `namespace A.B { … }`: the body runs in place (it is not a unit of its own). */
function buildNamespace(b: FlowBuilder, node: ts.ModuleDeclaration): void {
  let body = node.body;
  while (body && body.kind === K.ModuleDeclaration) body = (body as ts.ModuleDeclaration).body;
  if (body && body.kind === K.ModuleBlock) b.statements((body as ts.ModuleBlock).statements);
}
