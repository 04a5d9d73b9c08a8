import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ConnectionError, ConnectionRefusedError, ConnectionTimedOutError, UniqueConstraintError } from 'sequelize';
import { HttpError } from './http-error';

/** Unknown /api paths answer JSON, never the app's HTML. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: `No such API route: ${req.method} ${req.originalUrl}` });
};

function isDatabaseDown(err: unknown): boolean {
  return err instanceof ConnectionError || err instanceof ConnectionRefusedError || err instanceof ConnectionTimedOutError ||
    (err instanceof Error && /ECONNREFUSED|pool timeout|Connection.*(closed|lost)|ER_GET_CONNECTION_TIMEOUT/i.test(err.message));
}

/**
 * Turns every error into a JSON body {error, fields?}. Client mistakes keep their 4xx status;
 * a database outage is a 503; anything else is logged and answered with a plain 500 message.
 */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  if (res.headersSent) return;
  if (err instanceof HttpError) {
    res.status(err.status).json(err.fields ? { error: err.message, fields: err.fields } : { error: err.message });
    return;
  }
  const e = err as { status?: number; statusCode?: number; type?: string; message?: string; code?: string };
  const status = e.status ?? e.statusCode;
  if (e.type === 'entity.parse.failed') {
    res.status(400).json({ error: 'The request body is not valid JSON.' });
    return;
  }
  if (e.type === 'entity.too.large') {
    res.status(413).json({ error: 'The request body is too large.' });
    return;
  }
  if (typeof status === 'number' && status >= 400 && status < 500) {
    res.status(status).json({ error: e.message || 'The request could not be processed.' });
    return;
  }
  if (err instanceof UniqueConstraintError) {
    // Two requests raced past a route's own check for a taken name: the database kept the first.
    res.status(409).json({ error: 'Something of that name was saved just now; choose another name and try again.' });
    return;
  }
  if (isDatabaseDown(err)) {
    res.status(503).json({ error: 'The database is not answering. Try again in a moment.' });
    return;
  }
  console.error(`[error] ${req.method} ${req.originalUrl}:`, err);
  res.status(500).json({ error: 'Something went wrong on the server. The problem has been logged.' });
};
