import { HttpClient, HttpErrorResponse, HttpInterceptorFn, HttpRequest } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, shareReplay, switchMap, throwError } from 'rxjs';

import { quietErrors } from './api-error';

/** The header the server reads the CSRF token from. */
export const CSRF_HEADER = 'X-CSRF-Token';
/** Where the session's CSRF token is fetched. */
export const CSRF_URL = '/api/auth/csrf';

/** Methods that change state and so must carry the token. */
const UNSAFE_METHODS: ReadonlySet<string> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** Holds the session's CSRF token, fetched once and shared until it is dropped. */
@Injectable({ providedIn: 'root' })
export class CsrfToken {
  private readonly http = inject(HttpClient);
  private cached: Observable<string> | null = null;

  /** The token, fetched from the server on first use and cached after that. */
  token(): Observable<string> {
    this.cached ??= this.http.get<unknown>(CSRF_URL, { context: quietErrors() }).pipe(
      map(parseToken),
      catchError((err: unknown) => {
        // A failed fetch must not stay cached: the next call tries again.
        this.cached = null;
        return throwError(() => err);
      }),
      shareReplay(1),
    );
    return this.cached;
  }

  /** Forgets the cached token (the session changed: signed in, signed out, or the server refused it). */
  reset(): void {
    this.cached = null;
  }
}

/** Whether a request needs the CSRF header: a state-changing call to the API outside /api/calc/. */
export function needsCsrfToken(req: HttpRequest<unknown>): boolean {
  return UNSAFE_METHODS.has(req.method) && req.url.startsWith('/api/') && !req.url.startsWith('/api/calc/');
}

/**
 * Adds `X-CSRF-Token` to state-changing API calls. When the server answers 403 with a CSRF
 * complaint (the session was renewed), fetches a fresh token and retries once.
 */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (!needsCsrfToken(req)) return next(req);
  const csrf = inject(CsrfToken);
  const sendWithToken = () =>
    csrf.token().pipe(switchMap(token => next(req.clone({ setHeaders: { [CSRF_HEADER]: token } }))));
  return sendWithToken().pipe(
    catchError((err: unknown) => {
      if (!isCsrfRefusal(err)) return throwError(() => err);
      csrf.reset();
      return sendWithToken();
    }),
  );
};

/** Whether an error is the server refusing a missing or stale CSRF token. */
export function isCsrfRefusal(err: unknown): boolean {
  if (!(err instanceof HttpErrorResponse) || err.status !== 403) return false;
  const body: unknown = err.error;
  const message = typeof body === 'object' && body !== null ? (body as { error?: unknown }).error : body;
  return typeof message === 'string' && /csrf/i.test(message);
}

/** Reads `{"token": "..."}`, refusing any other shape. */
function parseToken(body: unknown): string {
  const token = typeof body === 'object' && body !== null ? (body as { token?: unknown }).token : undefined;
  if (typeof token !== 'string' || token === '') {
    throw new Error(`CsrfToken: ${CSRF_URL} did not return {"token": "..."}.`);
  }
  return token;
}
