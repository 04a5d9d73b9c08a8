import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';

import { Auth } from './auth';

/** Calls whose 401 is an answer, not a lost session: asking who is signed in, and signing in. */
const OWN_401_URLS: ReadonlySet<string> = new Set(['/api/auth/me', '/api/auth/login']);

/** Sends the user to /sign-in?next=… when an API call answers 401 (the session is gone). */
export const signInRedirectInterceptor: HttpInterceptorFn = (req, next) => {
  if (!req.url.startsWith('/api/') || OWN_401_URLS.has(req.url)) return next(req);
  const auth = inject(Auth);
  const router = inject(Router);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse && err.status === 401) {
        auth.markSignedOut();
        const here = router.url;
        if (!here.startsWith('/sign-in')) {
          void router.navigate(['/sign-in'], { queryParams: { next: here } });
        }
      }
      return throwError(() => err);
    }),
  );
};
