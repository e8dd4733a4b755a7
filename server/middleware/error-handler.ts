import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { ZodError } from 'zod';
import { dottedPath, fieldIssues } from '../../shared/contracts/field-issues.ts';
import { AppError, databaseUnavailable, isDatabaseUnavailable } from '../lib/errors.ts';

/** Answers unknown /api paths with the JSON error shape instead of the client app. */
export const apiNotFound: RequestHandler = (req, _res, next) =>
  next(new AppError({ code: 'not_found', status: 404, message: `No API route ${req.method} ${req.originalUrl.split('?')[0]}.` }));

/** The one error middleware, registered last: typed errors → { error: { code, message, field? } }. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (error: unknown, req, res, _next) => {
    if (res.headersSent) {
      logger.error({ err: error }, 'error after the response started');
      res.end();
      return;
    }
    // A handler may have set another type (CSV, text) before it failed.
    res.removeHeader('Content-Disposition');
    res.type('application/json');
    if (error instanceof ZodError) {
      // The first problem as message and field (what a form shows first), and every problem in `issues`.
      const issues = fieldIssues(error.issues, dottedPath);
      const first = issues[0];
      const field = first && first.field !== 'body' ? first.field : undefined;
      res.status(400).json({ error: { code: 'invalid_input', message: first?.message ?? 'Invalid input', ...(field ? { field } : {}), issues } });
      return;
    }
    if (!(error instanceof AppError) && isDatabaseUnavailable(error)) {
      // Logged without the request's query string or the query's bound values (session ids).
      logger.warn({ err: error, method: req.method, path: req.path }, 'database unreachable');
      error = databaseUnavailable(error);
    }
    if (error instanceof AppError && error.expose) {
      for (const [k, v] of Object.entries(error.headers ?? {})) res.setHeader(k, v);
      res.status(error.status).json({
        error: {
          code: error.code,
          message: error.message,
          ...(error.field ? { field: error.field } : {}),
          ...(error.details ? { details: error.details } : {}),
          ...(error.issues ? { issues: error.issues } : {}),
        },
      });
      return;
    }
    // body-parser errors carry `type` and `status`.
    const parserError = error as { type?: string; status?: number; limit?: number };
    if (parserError?.type === 'entity.parse.failed') {
      res.status(400).json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON.' } });
      return;
    }
    if (parserError?.type === 'entity.too.large') {
      res.status(413).json({ error: { code: 'body_too_large', message: `The request body is larger than the ${parserError.limit ? Math.round(parserError.limit / 1024) + ' kB' : ''} this route accepts.` } });
      return;
    }
    if (parserError?.type === 'encoding.unsupported' || parserError?.type === 'charset.unsupported') {
      res.status(415).json({ error: { code: 'unsupported_encoding', message: 'The request body encoding is not supported; send UTF-8 JSON.' } });
      return;
    }
    // Other body-parser refusals (a compressed body that does not decompress, an aborted upload) are the client's.
    if ((parserError?.status === 400 || parserError?.status === 415) && (error as { expose?: boolean }).expose) {
      res.status(parserError.status).json({ error: { code: 'unreadable_body', message: 'The request body could not be read: it does not match its Content-Encoding or Content-Type. Send UTF-8 JSON, uncompressed or correctly compressed.' } });
      return;
    }
    logger.error({ err: error, method: req.method, path: req.path }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side; it has been logged.' } });
  };
}
