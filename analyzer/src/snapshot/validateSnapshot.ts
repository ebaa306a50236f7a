/**
 * Snapshot schema validation
 * ==========================
 * Checks a parsed value against docs/snapshot.schema.json (JSON Schema draft 2020-12) and
 * returns every problem as a readable `path: problem` pair. The validator is compiled once, on
 * first use. `oneOf` failures of graph blocks and edges are collapsed into one message that names
 * the accepted shapes, because the per-branch messages ajv reports read as contradictions.
 *
 * [Reference]: JSON Schema draft 2020-12 (json-schema.org); ajv 8's `ajv/dist/2020` build.
 */
import Ajv2020 from 'ajv/dist/2020';
import type { ErrorObject, ValidateFunction } from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import snapshotJsonSchema from '../../../docs/snapshot.schema.json';

/** One way a value differs from the snapshot schema: a JSON Pointer and what is wrong there. */
export interface SnapshotProblem {
  /** JSON Pointer into the document (`/functions/3/cyclomatic`); `` for the top level. */
  path: string;
  message: string;
}

/** The snapshot JSON Schema as shipped in docs/ (draft 2020-12). */
export const SNAPSHOT_JSON_SCHEMA: object = snapshotJsonSchema;

let compiled: ValidateFunction | undefined;

function validator(): ValidateFunction {
  if (!compiled) {
    const ajv = new Ajv2020({ allErrors: true, strict: true });
    addFormats(ajv, ['date-time']);
    compiled = ajv.compile(SNAPSHOT_JSON_SCHEMA);
  }
  return compiled;
}

// Shapes whose `oneOf` branches only differ in length; one message reads better than three.
const ONE_OF_SHAPES: [RegExp, string][] = [
  [/\/graph\/blocks\/\d+$/, 'must be null or [line, column, endLine, endColumn] (1-based integers)'],
  [/\/graph\/edges\/\d+$/, 'must be [from, to] or [from, to, decision, outcome] with outcome 0 or 1'],
];

function describe(error: ErrorObject): string {
  const params = error.params as Record<string, unknown>;
  switch (error.keyword) {
    case 'required':
      return `missing required property '${String(params.missingProperty)}'`;
    case 'additionalProperties':
      return `unknown property '${String(params.additionalProperty)}'`;
    case 'enum':
      return `must be one of ${(params.allowedValues as unknown[]).map((v) => JSON.stringify(v)).join(', ')}`;
    case 'not':
      // The schema's only `not`s refuse absolute paths (root, file).
      return 'must not be an absolute path';
    case 'const':
      return `must be ${JSON.stringify(params.allowedValue)}`;
    default:
      return error.message ?? `fails '${error.keyword}'`;
  }
}

function toProblems(errors: ErrorObject[]): SnapshotProblem[] {
  const problems: SnapshotProblem[] = [];
  const seen = new Set<string>();
  for (const error of errors) {
    const { path, message } = collapsedShape(error.instancePath) ?? { path: error.instancePath, message: describe(error) };
    const key = `${path}\u0000${message}`;
    if (!seen.has(key)) {
      seen.add(key);
      problems.push({ path, message });
    }
  }
  return problems;
}

// Every error at or inside a block or edge comes from its `oneOf`: report the shape once.
function collapsedShape(pointer: string): SnapshotProblem | undefined {
  const parent = pointer.slice(0, Math.max(0, pointer.lastIndexOf('/')));
  for (const [pattern, message] of ONE_OF_SHAPES) {
    if (pattern.test(pointer)) return { path: pointer, message };
    if (pattern.test(parent)) return { path: parent, message };
  }
  return undefined;
}

/** Every schema problem of a parsed value; an empty list means it is a valid `seamline/snapshot@1`. */
export function snapshotSchemaProblems(value: unknown): SnapshotProblem[] {
  const validate = validator();
  return validate(value) ? [] : toProblems(validate.errors ?? []);
}
