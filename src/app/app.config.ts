import { provideHttpClient, withInterceptors } from '@angular/common/http';
import {
  ApplicationConfig,
  ErrorHandler,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { MAT_ICON_DEFAULT_OPTIONS } from '@angular/material/icon';
import { TitleStrategy, provideRouter, withComponentInputBinding, withInMemoryScrolling } from '@angular/router';

import { routes } from './app.routes';
import { csrfInterceptor } from './core/csrf';
import { SnackBarErrorHandler, errorNoticeInterceptor } from './core/error-notice';
import { PageTitle } from './core/page-title';
import { signInRedirectInterceptor } from './core/sign-in-redirect';

/** Application-wide providers. */
export const appConfig: ApplicationConfig = {
  providers: [
    provideZonelessChangeDetection(),
    provideBrowserGlobalErrorListeners(),
    provideRouter(routes, withComponentInputBinding(), withInMemoryScrolling({ scrollPositionRestoration: 'top' })),
    // Outermost first: the error notice sees the final outcome, after a 401 redirect or a CSRF retry.
    provideHttpClient(withInterceptors([errorNoticeInterceptor, signInRedirectInterceptor, csrfInterceptor])),
    { provide: ErrorHandler, useClass: SnackBarErrorHandler },
    { provide: TitleStrategy, useClass: PageTitle },
    { provide: MAT_ICON_DEFAULT_OPTIONS, useValue: { fontSet: 'material-symbols-outlined' } },
  ],
};
