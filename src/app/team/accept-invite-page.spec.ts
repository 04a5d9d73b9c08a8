import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import AcceptInvitePage from './accept-invite-page';

describe('AcceptInvitePage', () => {
  let fixture: ComponentFixture<AcceptInvitePage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  afterEach(() => http.verify());

  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  }

  async function openForm(): Promise<void> {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AcceptInvitePage);
    fixture.componentRef.setInput('token', 'a'.repeat(43));
    el = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne(`/api/access/invitations/${'a'.repeat(43)}`).flush({ email: 'new@example.test', role: 'apprentice', teamName: 'Test shop', expiresAt: '2030-01-01T00:00:00Z' });
    await settle();
  }

  async function submit(name: string, password: string): Promise<void> {
    const [nameInput, passwordInput] = Array.from(el.querySelectorAll('input'));
    nameInput!.value = name;
    nameInput!.dispatchEvent(new Event('input'));
    passwordInput!.value = password;
    passwordInput!.dispatchEvent(new Event('input'));
    (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
    await settle();
  }

  it('should say a password over 200 characters is too long, and send nothing', async () => {
    await openForm();
    await submit('Ada', 'p'.repeat(5000));
    http.expectNone((r) => r.method === 'POST');
    expect(el.querySelector('mat-error')?.textContent).toContain('Use at most 200 characters.');
  });

  it('should refuse a password of spaces only, and send nothing', async () => {
    await openForm();
    await submit('Ada', ' '.repeat(12));
    http.expectNone((r) => r.method === 'POST');
    expect(el.querySelector('mat-error')?.textContent).toContain('not only spaces');
  });

  it('should say why a name over 120 characters is not taken, and send nothing', async () => {
    await openForm();
    await submit('W'.repeat(121), 'long enough password');
    http.expectNone((r) => r.method === 'POST');
    expect(el.querySelector('mat-error')?.textContent).toContain('Keep the name under 120 characters.');
  });
});
