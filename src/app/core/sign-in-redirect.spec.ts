import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import { Auth } from './auth';
import { signInRedirectInterceptor } from './sign-in-redirect';

const UNAUTHORIZED = { status: 401, statusText: 'Unauthorized' };

describe('signInRedirectInterceptor', () => {
  let client: HttpClient;
  let http: HttpTestingController;
  let router: Router;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'library', component: BlankPage },
          { path: 'sign-in', component: BlankPage },
        ]),
        provideHttpClient(withInterceptors([signInRedirectInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    client = TestBed.inject(HttpClient);
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    await router.navigateByUrl('/library?sort=name');
  });

  afterEach(() => http.verify());

  describe('a 401 from an API call', () => {
    it('should send the user to /sign-in with next set to the current page', async () => {
      const navigate = jest.spyOn(router, 'navigate');
      const done = firstValueFrom(client.get('/api/setups'));
      http.expectOne('/api/setups').flush({ error: 'Sign in first.' }, UNAUTHORIZED);
      await expect(done).rejects.toMatchObject({ status: 401 });
      expect(navigate).toHaveBeenCalledTimes(1);
      await navigate.mock.results[0].value;
      expect(router.url).toBe('/sign-in?next=%2Flibrary%3Fsort%3Dname');
    });

    it('should not redirect again from the sign-in page itself', async () => {
      await router.navigateByUrl('/sign-in?next=%2Flibrary');
      const navigate = jest.spyOn(router, 'navigate');
      const done = firstValueFrom(client.get('/api/setups'));
      http.expectOne('/api/setups').flush({ error: 'Sign in first.' }, UNAUTHORIZED);
      await expect(done).rejects.toMatchObject({ status: 401 });
      expect(navigate).not.toHaveBeenCalled();
    });

    it('should forget the signed-in user', async () => {
      const markSignedOut = jest.spyOn(TestBed.inject(Auth), 'markSignedOut');
      const done = firstValueFrom(client.post('/api/setups', {}));
      http.expectOne('/api/setups').flush({ error: 'Sign in first.' }, UNAUTHORIZED);
      await expect(done).rejects.toMatchObject({ status: 401 });
      expect(markSignedOut).toHaveBeenCalled();
    });
  });

  describe('calls whose 401 is an answer', () => {
    it.each(['/api/auth/me', '/api/auth/login'])('should stay on the page for %s', async url => {
      const navigate = jest.spyOn(router, 'navigate');
      const done = firstValueFrom(client.post(url, {}));
      http.expectOne(url).flush({ error: 'E-mail or password is incorrect.' }, UNAUTHORIZED);
      await expect(done).rejects.toMatchObject({ status: 401 });
      expect(navigate).not.toHaveBeenCalled();
      expect(router.url).toBe('/library?sort=name');
    });
  });

  describe('other failures', () => {
    it('should not redirect on a 403', async () => {
      const navigate = jest.spyOn(router, 'navigate');
      const done = firstValueFrom(client.delete('/api/setups/3'));
      http.expectOne('/api/setups/3').flush({ error: 'Not yours.' }, { status: 403, statusText: 'Forbidden' });
      await expect(done).rejects.toMatchObject({ status: 403 });
      expect(navigate).not.toHaveBeenCalled();
    });
  });
});

@Component({ template: '' })
class BlankPage {}
