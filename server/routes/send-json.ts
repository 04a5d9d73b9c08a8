import type { Response } from 'express';

/**
 * Sends JSON that is already text or bytes, as it is: no re-encoding and no ETag (Express would
 * hash every body for one). For answers that are never revalidated: calculation answers to POSTs
 * and library reads, which are fetched fresh each time.
 */
export function sendJsonText(res: Response, json: string | Buffer, status = 200): void {
  res.status(status).setHeader('Content-Type', 'application/json; charset=utf-8');
  res.end(json);
}
