import type { z } from 'zod';
import { fieldErrors } from '../../shared/api/field-errors';
import { HttpError } from './http-error';

/** Parses a request body with a shared schema, or throws a 400 naming each bad field. */
export function parseBody<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
  if (body === undefined || body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw new HttpError(400, 'Send a JSON object as the request body.', {});
  }
  const result = schema.safeParse(body);
  if (!result.success) throw new HttpError(400, 'Some fields are not valid.', fieldErrors(result.error));
  return result.data;
}

/** Parses a positive integer route id, or throws a 404 (an id that cannot exist is simply not found). */
export function parseId(raw: string | string[] | undefined, what = 'set-up'): number {
  const text = Array.isArray(raw) ? raw[0] : raw;
  const n = /^\d{1,10}$/.test(text ?? '') ? Number(text) : NaN;
  if (!Number.isSafeInteger(n) || n < 1 || n > 4_294_967_295) throw new HttpError(404, `No ${what} with that id.`);
  return n;
}
