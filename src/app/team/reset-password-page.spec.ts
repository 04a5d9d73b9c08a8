import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import ResetPasswordPage from './reset-password-page';

describe('ResetPasswordPage', () => {
  let fixture: ComponentFixture<ResetPasswordPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function open(token?: string): Promise<void> {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ResetPasswordPage);
    if (token) fixture.componentRef.setInput('token', token);
    el = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  /** Lets the page's awaited request settle and re-render. */
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  }

  describe('without a token', () => {
    it('should ask for a link and show the server\'s one answer', async () => {
      await open();
      const input = el.querySelector('input')!;
      input.value = 'lead@demo.test';
      input.dispatchEvent(new Event('input'));
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      const req = http.expectOne('/api/access/password-reset');
      expect(req.request.body).toEqual({ email: 'lead@demo.test' });
      req.flush({ message: 'If that address belongs to an active Slantwise account, a reset link is on its way.' }, { status: 202, statusText: 'Accepted' });
      await settle();
      expect(el.textContent).toContain('a reset link is on its way');
    });

    it('should send nothing for an address without an @', async () => {
      await open();
      const input = el.querySelector('input')!;
      input.value = 'lead';
      input.dispatchEvent(new Event('input'));
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      http.expectNone('/api/access/password-reset');
    });
  });

  describe('with a token', () => {
    const TOKEN = 'a'.repeat(43);

    it('should check the link, then save the new password', async () => {
      await open(TOKEN);
      http.expectOne(`/api/access/password-reset/${TOKEN}`).flush({ valid: true });
      await settle();
      const input = el.querySelector('input[type=password]') as HTMLInputElement;
      input.value = 'a-long-new-password';
      input.dispatchEvent(new Event('input'));
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      const req = http.expectOne('/api/access/password-reset/complete');
      expect(req.request.body).toEqual({ token: TOKEN, password: 'a-long-new-password' });
      req.flush(null, { status: 204, statusText: 'No Content' });
      await settle();
      expect(el.textContent).toContain('Your password is changed');
    });

    it.each([
      ['p'.repeat(201), 'Use at most 200 characters.'],
      [' '.repeat(12), 'not only spaces'],
      ['short', 'Use at least 10 characters.'],
    ])('should say what is wrong with the password %#, and send nothing', async (password, message) => {
      await open(TOKEN);
      http.expectOne(`/api/access/password-reset/${TOKEN}`).flush({ valid: true });
      await settle();
      const input = el.querySelector('input[type=password]') as HTMLInputElement;
      input.value = password;
      input.dispatchEvent(new Event('input'));
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      await settle();
      http.expectNone('/api/access/password-reset/complete');
      expect(el.querySelector('mat-error')?.textContent).toContain(message);
    });

    it('should say when the link is used up', async () => {
      await open(TOKEN);
      http.expectOne(`/api/access/password-reset/${TOKEN}`).flush({ error: 'This link has expired or was already used. Ask for a new one.' }, { status: 410, statusText: 'Gone' });
      await settle();
      expect(el.querySelector('[role=alert]')!.textContent).toContain('expired or was already used');
    });
  });
});
