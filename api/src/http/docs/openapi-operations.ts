/** One operation of the OpenAPI document, with the x- extensions Seamline adds. */
export interface DocumentedOperation {
  method: string;
  path: string;
  /** `METHOD /path`, as apiRoutesOf spells routes. */
  key: string;
  operation: {
    operationId?: string;
    security?: Record<string, string[]>[];
    'x-action'?: string;
    'x-roles'?: string[];
    'x-api-token'?: boolean;
    'x-events'?: Record<string, unknown>;
  };
}

const METHODS = ['get', 'put', 'post', 'delete', 'options', 'head', 'patch', 'trace'];

/** Every operation under `paths`, in document order. */
export function operationsOf(document: Record<string, unknown>): DocumentedOperation[] {
  const paths = (document['paths'] ?? {}) as Record<string, Record<string, unknown>>;
  return Object.entries(paths).flatMap(([path, item]) =>
    Object.entries(item)
      .filter(([method]) => METHODS.includes(method))
      .map(([method, operation]) => ({ method, path, key: `${method.toUpperCase()} ${path}`, operation: operation as DocumentedOperation['operation'] })),
  );
}

/** Whether anyone may call the operation without signing in. */
export function isPublic(op: DocumentedOperation): boolean {
  return Array.isArray(op.operation.security) && op.operation.security.length === 0;
}
