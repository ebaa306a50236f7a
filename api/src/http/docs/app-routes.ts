import type { Express } from 'express';

/** What the router package (Express 5) keeps per layer, as far as the walk needs it. */
interface RouterLayer {
  route?: { path: unknown; methods: Record<string, boolean | undefined> };
  /** The path given to `use` (router ≥ 2.2). */
  rawPath?: unknown;
  handle?: { stack?: RouterLayer[] };
}

/**
 * Every route the app answers under /api, as `METHOD /api/path/{param}` (OpenAPI's spelling),
 * read from the app's router stack. A route or mount the walk cannot read (a RegExp or array
 * path, `all`) throws, so a route never drops out of the comparison unseen.
 */
export function apiRoutesOf(app: Express): string[] {
  const router = (app as unknown as { router?: { stack?: RouterLayer[] } }).router;
  if (!Array.isArray(router?.stack)) throw new Error('The app has no router stack to walk.');
  const found: string[] = [];
  collect(router.stack, '', found);
  return [...new Set(found.filter((r) => /^[A-Z]+ \/api(\/|$)/.test(r)))].sort();
}

function collect(stack: RouterLayer[], prefix: string, found: string[]): void {
  for (const layer of stack) {
    if (layer.route) {
      const { path, methods } = layer.route;
      if (typeof path !== 'string') throw new Error(`A route under ${prefix || '/'} has a path that is not a string.`);
      for (const [method, on] of Object.entries(methods)) {
        if (!on) continue;
        if (method === '_all') throw new Error(`${prefix}${path} answers every method; list its methods instead.`);
        found.push(`${method.toUpperCase()} ${toOpenApiPath(prefix + path)}`);
      }
    } else if (Array.isArray(layer.handle?.stack)) {
      if (typeof layer.rawPath !== 'string') throw new Error(`A router is mounted under ${prefix || '/'} on a path that is not a string.`);
      collect(layer.handle.stack, prefix + (layer.rawPath === '/' ? '' : layer.rawPath), found);
    }
  }
}

/** `/api/snapshots/:id/` → `/api/snapshots/{id}`. */
export function toOpenApiPath(expressPath: string): string {
  return expressPath.replace(/:(\w+)/g, '{$1}').replace(/\/+$/, '') || '/';
}
