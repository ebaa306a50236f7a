import type { Params } from '@angular/router';

import {
  type FunctionFilter,
  type FunctionQuery,
  SEVERITY_BANDS,
  type SeverityBand,
  SORTABLE_COLUMNS,
  type SortColumn,
  type SortOrder,
} from './functions-types';

/** What the screen asks for when the URL says nothing: the most complex functions first. */
export const DEFAULT_QUERY: FunctionQuery = { sort: 'cyclomatic', order: 'desc', page: 1, pageSize: 50 };

/** Page sizes offered under the table. */
export const PAGE_SIZES = [25, 50, 100, 200] as const;

/** The largest page the server sends. */
export const MAX_PAGE_SIZE = 500;

/**
 * The query the URL's query parameters describe. Unknown or malformed values fall back to the
 * defaults, so an edited or stale link still opens the screen instead of failing validation.
 */
export function queryFromParams(params: Params): FunctionQuery {
  const query: FunctionQuery = { ...DEFAULT_QUERY };
  const text = single(params['q'])?.trim();
  if (text) query.q = text.slice(0, 200);
  const module = single(params['module']);
  if (module && /^(file|folder|package):./.test(module)) query.module = module;
  const cluster = single(params['cluster']);
  if (cluster) query.cluster = cluster.slice(0, 64);
  const band = single(params['band']);
  if (isBand(band)) query.band = band;
  const overLimit = single(params['overLimit']);
  if (overLimit === 'true' || overLimit === 'false') query.overLimit = overLimit === 'true';
  const sort = single(params['sort']);
  if (isSortColumn(sort)) query.sort = sort;
  const order = single(params['order']);
  if (order === 'asc' || order === 'desc') query.order = order;
  query.page = positiveInt(single(params['page']), 1_000_000) ?? DEFAULT_QUERY.page;
  query.pageSize = positiveInt(single(params['pageSize']), MAX_PAGE_SIZE) ?? DEFAULT_QUERY.pageSize;
  return query;
}

/** The URL query parameters of a query; defaults are left out so links stay short. */
export function paramsFromQuery(query: FunctionQuery): Params {
  const params: Params = {};
  if (query.q) params['q'] = query.q;
  if (query.module) params['module'] = query.module;
  if (query.cluster) params['cluster'] = query.cluster;
  if (query.band) params['band'] = query.band;
  if (query.overLimit !== undefined) params['overLimit'] = String(query.overLimit);
  if (query.sort !== DEFAULT_QUERY.sort || query.order !== DEFAULT_QUERY.order) {
    params['sort'] = query.sort;
    params['order'] = query.order;
  }
  if (query.page !== DEFAULT_QUERY.page) params['page'] = String(query.page);
  if (query.pageSize !== DEFAULT_QUERY.pageSize) params['pageSize'] = String(query.pageSize);
  return params;
}

/** The API's query string parameters for a query (every value a string). */
export function apiParamsFromQuery(query: FunctionQuery): Record<string, string> {
  return {
    ...filterParams(query),
    sort: query.sort,
    order: query.order,
    page: String(query.page),
    pageSize: String(query.pageSize),
  };
}

/** Only the filters of a query, as API parameters. */
export function filterParams(filter: FunctionFilter): Record<string, string> {
  const params: Record<string, string> = {};
  if (filter.q) params['q'] = filter.q;
  if (filter.module) params['module'] = filter.module;
  if (filter.cluster) params['cluster'] = filter.cluster;
  if (filter.band) params['band'] = filter.band;
  if (filter.overLimit !== undefined) params['overLimit'] = String(filter.overLimit);
  return params;
}

/** Whether any filter is set. */
export function hasFilter(filter: FunctionFilter): boolean {
  return Object.keys(filterParams(filter)).length > 0;
}

/** Whether two queries ask for the same thing. */
export function sameQuery(a: FunctionQuery, b: FunctionQuery): boolean {
  const left = apiParamsFromQuery(a);
  const right = apiParamsFromQuery(b);
  const keys = new Set([...Object.keys(left), ...Object.keys(right)]);
  return [...keys].every((key) => left[key] === right[key]);
}

function single(value: unknown): string | undefined {
  const first: unknown = Array.isArray(value) ? value[0] : value;
  return typeof first === 'string' ? first : undefined;
}

function positiveInt(value: string | undefined, max: number): number | undefined {
  if (!value || !/^\d+$/.test(value)) return undefined;
  const n = Number(value);
  return n >= 1 && n <= max ? n : undefined;
}

function isBand(value: string | undefined): value is SeverityBand {
  return (SEVERITY_BANDS as readonly string[]).includes(value ?? '');
}

function isSortColumn(value: string | undefined): value is SortColumn {
  return (SORTABLE_COLUMNS as readonly string[]).includes(value ?? '');
}

/** Sort order a column starts with when first chosen: numbers high first, names A–Z. */
export function startOrder(column: SortColumn): SortOrder {
  return column === 'name' || column === 'file' || column === 'line' ? 'asc' : 'desc';
}
