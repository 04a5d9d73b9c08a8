import { HttpErrorResponse, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { Auth, AuthUser, isRole, parseAuthUser } from './auth';
import { CsrfToken } from './csrf';

const LEAD: AuthUser = { id: 2, email: 'lead@demo.test', name: 'Morgan Vale', role: 'lead' };

describe('Auth', () => {
  let auth: Auth;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    auth = TestBed.inject(Auth);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  describe('load', () => {
    it('should set the user from GET /api/auth/session', async () => {
      const loaded = auth.load();
      const req = http.expectOne('/api/auth/session');
      expect(req.request.method).toBe('GET');
      req.flush({ user: LEAD });
      await expect(loaded).resolves.toEqual(LEAD);
      expect(auth.user()).toEqual(LEAD);
      expect(auth.signedIn()).toBe(true);
      expect(auth.loaded()).toBe(true);
    });

    it('should mean nobody when the session has no user', async () => {
      expect(auth.loaded()).toBe(false);
      const loaded = auth.load();
      http.expectOne('/api/auth/session').flush({ user: null });
      await expect(loaded).resolves.toBeNull();
      expect(auth.user()).toBeNull();
      expect(auth.signedIn()).toBe(false);
      expect(auth.loaded()).toBe(true);
    });

    it('should mean nobody when the server fails', async () => {
      const warn = jest.spyOn(console, 'warn').mockImplementation(() => undefined);
      const loaded = auth.load();
      http.expectOne('/api/auth/session').flush({ error: 'The database is not answering.' }, { status: 503, statusText: 'Service Unavailable' });
      await expect(loaded).resolves.toBeNull();
      expect(warn).toHaveBeenCalled();
      expect(auth.user()).toBeNull();
      expect(auth.signedIn()).toBe(false);
      expect(auth.loaded()).toBe(true);
    });

    it('should mean nobody when the server sends a user of the wrong shape', async () => {
      const warn = jest.spyOn(console, 'warn').mockImplementation(() => undefined);
      const loaded = auth.load();
      http.expectOne('/api/auth/session').flush({ user: { id: 2, email: 'lead@demo.test', name: 'Morgan Vale', role: 'owner' } });
      await expect(loaded).resolves.toBeNull();
      expect(warn).toHaveBeenCalled();
    });
  });

  describe('ready', () => {
    it('should ask the server only once', async () => {
      const first = auth.ready();
      const second = auth.ready();
      http.expectOne('/api/auth/session').flush({ user: LEAD });
      await expect(first).resolves.toEqual(LEAD);
      await expect(second).resolves.toEqual(LEAD);
      await expect(auth.ready()).resolves.toEqual(LEAD);
      http.expectNone('/api/auth/session');
    });
  });

  describe('signIn', () => {
    it('should POST the credentials and keep the returned user', async () => {
      const reset = jest.spyOn(TestBed.inject(CsrfToken), 'reset');
      const signedIn = auth.signIn('lead@demo.test', 'pa55word-long');
      const req = http.expectOne('/api/auth/login');
      expect(req.request.method).toBe('POST');
      expect(req.request.body).toEqual({ email: 'lead@demo.test', password: 'pa55word-long' });
      req.flush({ user: LEAD });
      await expect(signedIn).resolves.toEqual(LEAD);
      expect(auth.user()).toEqual(LEAD);
      expect(reset).toHaveBeenCalled();
      await expect(auth.ready()).resolves.toEqual(LEAD);
    });

    it('should reject with the server response on a 401 and stay anonymous', async () => {
      const signedIn = auth.signIn('lead@demo.test', 'wrong');
      http.expectOne('/api/auth/login')
        .flush({ error: 'E-mail or password is incorrect.' }, { status: 401, statusText: 'Unauthorized' });
      await expect(signedIn).rejects.toBeInstanceOf(HttpErrorResponse);
      await expect(signedIn).rejects.toMatchObject({ status: 401, error: { error: 'E-mail or password is incorrect.' } });
      expect(auth.user()).toBeNull();
    });
  });

  describe('signOut', () => {
    it('should POST /api/auth/logout and forget the user', async () => {
      const signedIn = auth.signIn('lead@demo.test', 'pa55word-long');
      http.expectOne('/api/auth/login').flush({ user: LEAD });
      await signedIn;
      const signedOut = auth.signOut();
      const req = http.expectOne('/api/auth/logout');
      expect(req.request.method).toBe('POST');
      req.flush(null, { status: 204, statusText: 'No Content' });
      await signedOut;
      expect(auth.user()).toBeNull();
      await expect(auth.ready()).resolves.toBeNull();
    });

    it('should forget the user even when the server call fails', async () => {
      const signedIn = auth.signIn('lead@demo.test', 'pa55word-long');
      http.expectOne('/api/auth/login').flush({ user: LEAD });
      await signedIn;
      const signedOut = auth.signOut();
      http.expectOne('/api/auth/logout').flush({ error: 'Internal Server Error' }, { status: 500, statusText: 'Server Error' });
      await expect(signedOut).rejects.toMatchObject({ status: 500 });
      expect(auth.user()).toBeNull();
    });
  });

  describe('markSignedOut', () => {
    it('should forget the user without a server call', async () => {
      const signedIn = auth.signIn('lead@demo.test', 'pa55word-long');
      http.expectOne('/api/auth/login').flush({ user: LEAD });
      await signedIn;
      auth.markSignedOut();
      expect(auth.signedIn()).toBe(false);
    });
  });
});

describe('parseAuthUser', () => {
  it('should keep exactly the four fields', () => {
    expect(parseAuthUser({ ...LEAD, teamId: 7 })).toEqual(LEAD);
  });

  it('should refuse a missing or mistyped field', () => {
    expect(() => parseAuthUser(null)).toThrow(/no user/);
    expect(() => parseAuthUser({ ...LEAD, id: '2' })).toThrow(/valid id/);
    expect(() => parseAuthUser({ ...LEAD, name: undefined })).toThrow(/valid id/);
    expect(() => parseAuthUser({ ...LEAD, role: 'owner' })).toThrow(/role/);
  });
});

describe('isRole', () => {
  it('should accept the four roles only', () => {
    expect(['admin', 'lead', 'machinist', 'apprentice'].every(isRole)).toBe(true);
    expect(isRole('owner')).toBe(false);
    expect(isRole('toString')).toBe(false);
    expect(isRole(3)).toBe(false);
  });
});
