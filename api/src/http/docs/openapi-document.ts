import * as fs from 'node:fs';
import * as path from 'node:path';
import { parse } from 'yaml';

/** The project's own name in its root package.json; the walk up stops at that folder. */
const PROJECT_NAME = 'seamline';

/**
 * The repository root, found by walking up from `from` to the folder whose package.json is
 * Seamline's — so the same code finds it from api/src and from the compiled dist/…/api/src.
 */
export function findProjectRoot(from: string = __dirname): string {
  for (let dir = path.resolve(from); ; dir = path.dirname(dir)) {
    const manifest = path.join(dir, 'package.json');
    if (fs.existsSync(manifest) && readName(manifest) === PROJECT_NAME) return dir;
    if (path.dirname(dir) === dir) throw new Error(`No package.json named "${PROJECT_NAME}" above ${from}; cannot find docs/openapi.yaml.`);
  }
}

function readName(manifest: string): unknown {
  try {
    return (JSON.parse(fs.readFileSync(manifest, 'utf8')) as { name?: unknown }).name;
  } catch {
    return undefined;
  }
}

/** Where the API's OpenAPI document is kept. */
export function openApiFile(): string {
  return path.join(findProjectRoot(), 'docs', 'openapi.yaml');
}

/** The OpenAPI document as parsed JSON text. */
export interface OpenApiDocument {
  json: string;
  document: Record<string, unknown>;
}

const loaded = new Map<string, OpenApiDocument>();

/** Reads and parses the YAML once per process and file (every app a test builds shares it). */
export function loadOpenApiDocument(file: string = openApiFile()): OpenApiDocument {
  let doc = loaded.get(file);
  if (!doc) {
    const document = parse(fs.readFileSync(file, 'utf8')) as Record<string, unknown>;
    if (typeof document?.['openapi'] !== 'string') throw new Error(`${file} is not an OpenAPI document (no "openapi" version).`);
    doc = { json: JSON.stringify(document), document };
    loaded.set(file, doc);
  }
  return doc;
}
