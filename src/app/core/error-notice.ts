import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { ErrorHandler, Injectable, Injector, inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';

import { QUIET_ERRORS, apiErrorMessage } from './api-error';

/** How long an error message stays on screen, in milliseconds. */
const NOTICE_DURATION_MS = 8_000;

/** Shows error messages in one snack bar at the bottom of the screen. */
@Injectable({ providedIn: 'root' })
export class ErrorNotice {
  private readonly injector = inject(Injector);

  /**
   * Opens the snack bar with `message`, replacing any message already shown. Resolves once it is
   * open; the snack bar code is loaded on the first error, keeping it out of the start-up bundle.
   */
  async show(message: string): Promise<void> {
    const { MatSnackBar } = await import('@angular/material/snack-bar');
    this.injector.get(MatSnackBar).open(message, 'Dismiss', {
      duration: NOTICE_DURATION_MS,
      politeness: 'assertive',
      panelClass: 'error-notice',
    });
  }
}

/** Shows the server's error message of every failed `/api/` call, unless the call is marked quiet. */
export const errorNoticeInterceptor: HttpInterceptorFn = (req, next) => {
  if (!req.url.startsWith('/api/') || req.context.get(QUIET_ERRORS)) return next(req);
  const notice = inject(ErrorNotice);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse) void notice.show(apiErrorMessage(err));
      return throwError(() => err);
    }),
  );
};

/** App-wide ErrorHandler: logs every uncaught error and shows those not already shown by the HTTP layer. */
@Injectable()
export class SnackBarErrorHandler implements ErrorHandler {
  // Resolved lazily: the snack bar depends on services that themselves need the ErrorHandler.
  private readonly injector = inject(Injector);

  /** Logs the error and puts its message in the snack bar. */
  handleError(error: unknown): void {
    console.error(error);
    // Failed HTTP calls were already shown (or deliberately kept quiet) by errorNoticeInterceptor.
    if (error instanceof HttpErrorResponse) return;
    void this.injector.get(ErrorNotice).show(`Unexpected error: ${apiErrorMessage(error)}`);
  }
}
