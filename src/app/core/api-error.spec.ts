import { HttpErrorResponse } from '@angular/common/http';

import { QUIET_ERRORS, apiErrorDetail, apiErrorMessage, apiFieldErrors, quietErrors } from './api-error';

describe('apiErrorMessage', () => {
  const response = (status: number, error: unknown, statusText = '') => new HttpErrorResponse({ status, error, statusText });

  it('should use the JSON error message', () => {
    expect(apiErrorMessage(response(429, { error: 'Too many attempts. Wait 5 minutes.' }))).toBe('Too many attempts. Wait 5 minutes.');
  });

  it('should use a plain-text body but never an HTML page', () => {
    expect(apiErrorMessage(response(502, ' Bad gateway '))).toBe('Bad gateway');
    expect(apiErrorMessage(response(502, '<html><body>oops</body></html>', 'Bad Gateway'))).toBe('The request failed (status 502).');
  });

  it('should say the server is unreachable for status 0', () => {
    expect(apiErrorMessage(response(0, new ProgressEvent('error')))).toMatch(/could not be reached/);
  });

  it('should fall back to the status when there is no message', () => {
    expect(apiErrorMessage(response(500, null))).toBe('The request failed (status 500).');
  });

  it('should use the message of a plain Error', () => {
    expect(apiErrorMessage(new Error('Drawing: scale must be > 0'))).toBe('Drawing: scale must be > 0');
    expect(apiErrorMessage('??')).toBe('Something went wrong.');
  });
});

describe('apiFieldErrors', () => {
  it('should return the string messages of `fields`', () => {
    const err = new HttpErrorResponse({ status: 400, error: { error: 'Check the form.', fields: { email: 'Enter your e-mail address.', n: 3 } } });
    expect(apiFieldErrors(err)).toEqual({ email: 'Enter your e-mail address.' });
  });

  it('should return an empty record without fields', () => {
    expect(apiFieldErrors(new HttpErrorResponse({ status: 401, error: { error: 'No.' } }))).toEqual({});
    expect(apiFieldErrors(new Error('x'))).toEqual({});
  });
});

describe('apiErrorDetail', () => {
  it('should follow the message with each field\'s own reason', () => {
    const err = new HttpErrorResponse({ status: 400, error: { error: 'Some fields are not valid.', fields: { partCount: 'Part count must be a whole number.' } } });
    expect(apiErrorDetail(err)).toBe('Some fields are not valid. Part count must be a whole number.');
  });

  it('should be the message alone without fields', () => {
    expect(apiErrorDetail(new HttpErrorResponse({ status: 409, error: { error: 'Already closed.' } }))).toBe('Already closed.');
  });
});

describe('quietErrors', () => {
  it('should mark a context quiet', () => {
    expect(quietErrors().get(QUIET_ERRORS)).toBe(true);
  });
});
