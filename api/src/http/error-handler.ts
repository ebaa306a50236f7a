import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, NotFoundError } from '../errors';
import type { Logger } from '../logger';

/** JSON 404 for any /api path no route answered. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new NotFoundError(`No API route ${req.method} ${req.originalUrl.split('?')[0]}.`));
};

/** Maps every error to one JSON shape; never sends a stack to the client. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    const known = err instanceof AppError;
    // body-parser and friends mark client faults with a 4xx status of their own.
    const status = known ? err.status : typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
    if (status >= 500) logger.error({ err, url: req.originalUrl }, 'request failed');
    const code = known ? err.code : status === 500 ? 'internal' : (err?.type ?? 'bad_request');
    const message = status === 500 && !known ? 'Something went wrong on our side; the details are in the server log.' : err.message;
    if (res.headersSent) return;
    res.status(status).json({ error: { code, message, ...(known && err.details !== undefined ? { details: err.details } : {}) } });
  };
}
