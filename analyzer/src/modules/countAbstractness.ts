/**
 * Abstract types of a file
 * ========================
 * Counts a file's classes (declarations and expressions) and interfaces, and how many of them
 * are abstract: every interface, and every class marked `abstract`. Martin's abstractness A of
 * a module is Σ abstract / Σ total over its files. Type aliases, enums and plain functions
 * count neither way. Walks raw compiler nodes with an explicit stack, skipping type nodes (no
 * class or interface can sit inside one).
 *
 * [Reference]: R. C. Martin, Agile Software Development: Principles, Patterns, and Practices
 * (2002), the Stable Abstractions Principle: A = abstract classes and interfaces / all classes.
 */
import { ts } from '../compiler';

/** Interfaces and abstract classes (`abstract`) among all classes and interfaces (`total`) of a file. */
export function countAbstractness(sourceFile: ts.SourceFile): { abstract: number; total: number } {
  let abstract = 0;
  let total = 0;
  const stack: ts.Node[] = [sourceFile];
  while (stack.length > 0) {
    const node = stack.pop()!;
    if (ts.isTypeNode(node) && !ts.isExpressionWithTypeArguments(node)) continue;
    if (ts.isInterfaceDeclaration(node)) {
      total++;
      abstract++;
      continue; // an interface holds no classes
    }
    if (ts.isClassDeclaration(node) || ts.isClassExpression(node)) {
      total++;
      if (node.modifiers?.some((m) => m.kind === ts.SyntaxKind.AbstractKeyword)) abstract++;
    }
    ts.forEachChild(node, (child) => void stack.push(child));
  }
  return { abstract, total };
}
