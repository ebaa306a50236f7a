import { HttpErrorResponse } from '@angular/common/http';

import type { ApiErrorBody } from './api-types';

/** Turns a failed API call into one sentence a person can act on. */
export function apiErrorMessage(error: unknown): string {
  if (!(error instanceof HttpErrorResponse)) {
    return 'Something went wrong. Please try again.';
  }
  if (isApiErrorBody(error.error)) {
    return error.error.error.message;
  }
  if (error.status === 0) {
    return 'The Seamline server could not be reached. Check your connection and try again.';
  }
  return `The server answered with status ${error.status}. Please try again.`;
}

function isApiErrorBody(body: unknown): body is ApiErrorBody {
  const inner = (body as Partial<ApiErrorBody> | null)?.error;
  return typeof inner === 'object' && inner !== null && typeof inner.message === 'string';
}
