import { concat, defer, EMPTY, expand, map, Observable, of, tap } from 'rxjs';

import type { FunctionPage, FunctionRow } from './functions-types';

/** Rows fetched per request while exporting (the server's largest page). */
export const EXPORT_PAGE_SIZE = 500;

/** Most rows one export collects; beyond it the browser would hold too much for a CSV download. */
export const EXPORT_ROW_CAP = 50_000;

/** Where an export stands: pages arriving, or every row collected. */
export type ExportProgress =
  | { kind: 'progress'; fetched: number; total: number }
  | { kind: 'done'; rows: FunctionRow[]; total: number };

/** The export matches more rows than the cap allows. */
export class ExportTooLargeError extends Error {
  constructor(
    /** Rows the filter matches. */
    readonly total: number,
    /** The most one export collects. */
    readonly cap: number,
  ) {
    super(
      `These filters match ${total.toLocaleString('en')} functions; an export holds at most ${cap.toLocaleString('en')}. ` +
        'Narrow the filters (for example by module or band) and export again.',
    );
    this.name = 'ExportTooLargeError';
  }
}

/**
 * Fetches page after page (one request at a time, so the server is never flooded) until every
 * row of the filter is in, reporting progress after each page and then every row. Fails with
 * ExportTooLargeError as soon as the first page shows more than `cap` rows.
 */
export function collectFunctionRows(
  fetchPage: (page: number, pageSize: number) => Observable<FunctionPage>,
  cap = EXPORT_ROW_CAP,
  pageSize = EXPORT_PAGE_SIZE,
): Observable<ExportProgress> {
  return defer(() => {
    const rows: FunctionRow[] = [];
    let total = 0;
    const fetch = (page: number) =>
      fetchPage(page, pageSize).pipe(
        tap((answer) => {
          if (answer.total > cap) throw new ExportTooLargeError(answer.total, cap);
        }),
      );
    const progress = fetch(1).pipe(
      // An empty page ends the walk too, should the total shrink under it.
      expand((answer) => (answer.items.length > 0 && answer.page * pageSize < answer.total ? fetch(answer.page + 1) : EMPTY)),
      map((answer): ExportProgress => {
        total = answer.total;
        rows.push(...answer.items);
        return { kind: 'progress', fetched: rows.length, total };
      }),
    );
    return concat(progress, defer(() => of<ExportProgress>({ kind: 'done', rows, total })));
  });
}
