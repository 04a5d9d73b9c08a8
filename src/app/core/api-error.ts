import { HttpContext, HttpContextToken, HttpErrorResponse } from '@angular/common/http';

/** Marks a request whose failures the caller shows itself, so no global snack bar is raised. */
export const QUIET_ERRORS = new HttpContextToken<boolean>(() => false);

/** An HttpContext for a request whose errors the caller reports (a form showing them inline). */
export function quietErrors(context: HttpContext = new HttpContext()): HttpContext {
  return context.set(QUIET_ERRORS, true);
}

/** The server's `{"error": "..."}` message of a failed call, or a plain fallback naming the status. */
export function apiErrorMessage(err: unknown): string {
  if (err instanceof HttpErrorResponse) {
    const body: unknown = err.error;
    if (isErrorBody(body)) return body.error;
    if (typeof body === 'string' && body.trim() && !body.trimStart().startsWith('<')) return body.trim();
    if (err.status === 0) return 'The Slantwise server could not be reached. Check the connection and try again.';
    return `The request failed (status ${err.status}).`;
  }
  if (err instanceof Error && err.message) return err.message;
  return 'Something went wrong.';
}

/**
 * The error message followed by each field's own message ("Some fields are not valid. Part count
 * must be a whole number."), for forms that have no place beside each field to show them.
 */
export function apiErrorDetail(err: unknown): string {
  const message = apiErrorMessage(err);
  // Field messages the summary already says are not repeated.
  const fields = Object.values(apiFieldErrors(err)).filter((f) => !message.includes(f));
  return fields.length ? `${message} ${fields.join(' ')}` : message;
}

/** The per-field messages of a 400 body `{"error", "fields": {name: message}}`, or an empty record. */
export function apiFieldErrors(err: unknown): Readonly<Record<string, string>> {
  if (!(err instanceof HttpErrorResponse) || !isErrorBody(err.error)) return {};
  const fields: unknown = err.error.fields;
  if (typeof fields !== 'object' || fields === null) return {};
  const out: Record<string, string> = {};
  for (const [name, message] of Object.entries(fields)) {
    if (typeof message === 'string') out[name] = message;
  }
  return out;
}

/** Whether a JSON body has the API's error shape. */
function isErrorBody(body: unknown): body is { error: string; fields?: unknown } {
  return typeof body === 'object' && body !== null && typeof (body as { error?: unknown }).error === 'string';
}
