import { HttpClient, HttpErrorResponse, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';

import { quietErrors } from './api-error';
import { ErrorNotice, SnackBarErrorHandler, errorNoticeInterceptor } from './error-notice';

describe('error notices', () => {
  let client: HttpClient;
  let http: HttpTestingController;
  let show: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([errorNoticeInterceptor])), provideHttpClientTesting()],
    });
    client = TestBed.inject(HttpClient);
    http = TestBed.inject(HttpTestingController);
    show = jest.spyOn(TestBed.inject(ErrorNotice), 'show');
    jest.spyOn(console, 'error').mockImplementation(() => undefined);
  });

  afterEach(() => http.verify());

  describe('errorNoticeInterceptor', () => {
    it('should show the server message of a failed API call and still fail the call', async () => {
      const done = firstValueFrom(client.put('/api/setups/7', {}));
      http.expectOne('/api/setups/7').flush({ error: 'Set-up 7 was not found.' }, { status: 404, statusText: 'Not Found' });
      await expect(done).rejects.toMatchObject({ status: 404 });
      expect(show).toHaveBeenCalledWith('Set-up 7 was not found.');
    });

    it('should stay quiet for a call marked quiet', async () => {
      const done = firstValueFrom(client.post('/api/auth/login', {}, { context: quietErrors() }));
      http.expectOne('/api/auth/login').flush({ error: 'E-mail or password is incorrect.' }, { status: 401, statusText: 'Unauthorized' });
      await expect(done).rejects.toMatchObject({ status: 401 });
      expect(show).not.toHaveBeenCalled();
    });

    it('should stay quiet on success', async () => {
      const done = firstValueFrom(client.get('/api/setups'));
      http.expectOne('/api/setups').flush([]);
      await done;
      expect(show).not.toHaveBeenCalled();
    });
  });

  describe('ErrorNotice', () => {
    it('should open the snack bar with the message', async () => {
      show.mockRestore();
      const open = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
      await TestBed.inject(ErrorNotice).show('Gauge block set not found.');
      expect(open).toHaveBeenCalledWith('Gauge block set not found.', 'Dismiss', expect.objectContaining({ politeness: 'assertive' }));
    });
  });

  describe('SnackBarErrorHandler', () => {
    it('should show an uncaught error', () => {
      const handler = TestBed.runInInjectionContext(() => new SnackBarErrorHandler());
      handler.handleError(new Error('Drawing: scale must be > 0'));
      expect(show).toHaveBeenCalledWith('Unexpected error: Drawing: scale must be > 0');
    });

    it('should not show a failed HTTP call twice', () => {
      const handler = TestBed.runInInjectionContext(() => new SnackBarErrorHandler());
      handler.handleError(new HttpErrorResponse({ status: 500 }));
      expect(show).not.toHaveBeenCalled();
      expect(console.error).toHaveBeenCalled();
    });
  });
});
