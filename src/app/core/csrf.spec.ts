import { HttpClient, HttpErrorResponse, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';

import { CSRF_HEADER, CSRF_URL, CsrfToken, csrfInterceptor, isCsrfRefusal } from './csrf';

const CSRF_REFUSAL = {
  error: 'Missing or invalid CSRF token: fetch GET /api/auth/csrf and send it as the X-CSRF-Token header.',
};

describe('csrfInterceptor', () => {
  let client: HttpClient;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([csrfInterceptor])), provideHttpClientTesting()],
    });
    client = TestBed.inject(HttpClient);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  describe('state-changing API calls', () => {
    it.each(['POST', 'PUT', 'PATCH', 'DELETE'])('should add the token to a %s', async method => {
      const done = firstValueFrom(client.request(method, '/api/setups/4', { body: { name: 'Wedge' } }));
      http.expectOne(CSRF_URL).flush({ token: 'tok-1' });
      const req = http.expectOne('/api/setups/4');
      expect(req.request.method).toBe(method);
      expect(req.request.headers.get(CSRF_HEADER)).toBe('tok-1');
      req.flush({ id: 4 });
      await expect(done).resolves.toEqual({ id: 4 });
    });

    it('should fetch the token once and reuse it', async () => {
      const first = firstValueFrom(client.post('/api/setups', { name: 'A' }));
      http.expectOne(CSRF_URL).flush({ token: 'tok-1' });
      http.expectOne('/api/setups').flush({ id: 1 });
      await first;
      const second = firstValueFrom(client.delete('/api/setups/1'));
      http.expectNone(CSRF_URL);
      const req = http.expectOne('/api/setups/1');
      expect(req.request.headers.get(CSRF_HEADER)).toBe('tok-1');
      req.flush(null, { status: 204, statusText: 'No Content' });
      await second;
    });

    it('should fetch a fresh token after reset', async () => {
      const first = firstValueFrom(client.post('/api/setups', {}));
      http.expectOne(CSRF_URL).flush({ token: 'tok-1' });
      http.expectOne('/api/setups').flush({});
      await first;
      TestBed.inject(CsrfToken).reset();
      const second = firstValueFrom(client.post('/api/setups', {}));
      http.expectOne(CSRF_URL).flush({ token: 'tok-2' });
      const req = http.expectOne('/api/setups');
      expect(req.request.headers.get(CSRF_HEADER)).toBe('tok-2');
      req.flush({});
      await second;
    });
  });

  describe('calls that need no token', () => {
    it('should not add it to a GET', async () => {
      const done = firstValueFrom(client.get('/api/setups'));
      const req = http.expectOne('/api/setups');
      expect(req.request.headers.has(CSRF_HEADER)).toBe(false);
      http.expectNone(CSRF_URL);
      req.flush([]);
      await done;
    });

    it('should not add it to a stateless calculation under /api/calc/', async () => {
      const done = firstValueFrom(client.post('/api/calc/sine-bar', { angle: '14.5' }));
      http.expectNone(CSRF_URL);
      const req = http.expectOne('/api/calc/sine-bar');
      expect(req.request.headers.has(CSRF_HEADER)).toBe(false);
      req.flush({});
      await done;
    });

    it('should not add it outside /api/', async () => {
      const done = firstValueFrom(client.post('/other/place', {}));
      http.expectNone(CSRF_URL);
      const req = http.expectOne('/other/place');
      expect(req.request.headers.has(CSRF_HEADER)).toBe(false);
      req.flush({});
      await done;
    });
  });

  describe('a 403 refusing the token', () => {
    it('should fetch a new token and retry once', async () => {
      const done = firstValueFrom(client.put('/api/setups/9', { name: 'B' }));
      http.expectOne(CSRF_URL).flush({ token: 'stale' });
      http.expectOne('/api/setups/9').flush(CSRF_REFUSAL, { status: 403, statusText: 'Forbidden' });
      http.expectOne(CSRF_URL).flush({ token: 'fresh' });
      const retry = http.expectOne('/api/setups/9');
      expect(retry.request.headers.get(CSRF_HEADER)).toBe('fresh');
      expect(retry.request.body).toEqual({ name: 'B' });
      retry.flush({ id: 9 });
      await expect(done).resolves.toEqual({ id: 9 });
    });

    it('should give up after the one retry', async () => {
      const done = firstValueFrom(client.post('/api/setups', {}));
      http.expectOne(CSRF_URL).flush({ token: 'a' });
      http.expectOne('/api/setups').flush(CSRF_REFUSAL, { status: 403, statusText: 'Forbidden' });
      http.expectOne(CSRF_URL).flush({ token: 'b' });
      http.expectOne('/api/setups').flush(CSRF_REFUSAL, { status: 403, statusText: 'Forbidden' });
      await expect(done).rejects.toMatchObject({ status: 403 });
      http.expectNone(CSRF_URL);
    });

    it('should not retry a 403 about something else (a role refusal)', async () => {
      const done = firstValueFrom(client.delete('/api/setups/3'));
      http.expectOne(CSRF_URL).flush({ token: 'a' });
      http.expectOne('/api/setups/3')
        .flush({ error: 'Apprentices may not delete set-ups of others.' }, { status: 403, statusText: 'Forbidden' });
      await expect(done).rejects.toMatchObject({ status: 403 });
      http.expectNone(CSRF_URL);
    });
  });

  describe('a failed token fetch', () => {
    it('should fail the call and try again on the next one', async () => {
      const first = firstValueFrom(client.post('/api/setups', {}));
      http.expectOne(CSRF_URL).flush({ error: 'down' }, { status: 503, statusText: 'Unavailable' });
      await expect(first).rejects.toMatchObject({ status: 503 });
      const second = firstValueFrom(client.post('/api/setups', {}));
      http.expectOne(CSRF_URL).flush({ token: 'ok' });
      http.expectOne('/api/setups').flush({ id: 1 });
      await expect(second).resolves.toEqual({ id: 1 });
    });

    it('should refuse a body without a token', async () => {
      const done = firstValueFrom(client.post('/api/setups', {}));
      http.expectOne(CSRF_URL).flush({ csrf: 'x' });
      await expect(done).rejects.toThrow(/did not return/);
    });
  });
});

describe('isCsrfRefusal', () => {
  const response = (status: number, error: unknown) => new HttpErrorResponse({ status, error });

  it('should recognise a 403 whose message mentions CSRF', () => {
    expect(isCsrfRefusal(response(403, CSRF_REFUSAL))).toBe(true);
    expect(isCsrfRefusal(response(403, 'invalid csrf token'))).toBe(true);
  });

  it('should reject other statuses and other 403s', () => {
    expect(isCsrfRefusal(response(400, CSRF_REFUSAL))).toBe(false);
    expect(isCsrfRefusal(response(403, { error: 'Not your set-up.' }))).toBe(false);
    expect(isCsrfRefusal(response(403, null))).toBe(false);
    expect(isCsrfRefusal(new Error('CSRF'))).toBe(false);
  });
});
