import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';

import { Auth } from '../core/auth';
import SignInPage, { safeNextUrl } from './sign-in-page';

const MACHINIST = { id: 3, email: 'machinist@demo.test', name: 'Sam Tanager', role: 'machinist' };

describe('SignInPage', () => {
  let fixture: ComponentFixture<SignInPage>;
  let loader: HarnessLoader;
  let http: HttpTestingController;
  let navigateByUrl: jest.SpyInstance;

  beforeEach(async () => {
    configureTestingModule();
    http = TestBed.inject(HttpTestingController);
    navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fixture = TestBed.createComponent(SignInPage);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  describe('invalid input', () => {
    it('should show a message under each empty field and send nothing', async () => {
      await submit();
      expect(await errorsOf('E-mail')).toEqual(['Enter your e-mail address.']);
      expect(await errorsOf('Password')).toEqual(['Enter your password.']);
      http.expectNone('/api/auth/login');
    });

    it('should refuse an address without an @', async () => {
      await fill('lead.demo.test', 'long-enough-pw');
      await submit();
      expect(await errorsOf('E-mail')).toEqual(['Enter an e-mail address like name@example.com.']);
      expect(await errorsOf('Password')).toEqual([]);
      http.expectNone('/api/auth/login');
    });
  });

  describe('valid input', () => {
    it('should POST the trimmed e-mail and the password', async () => {
      await fill('  machinist@demo.test ', 'pa55 word');
      await submit();
      const req = http.expectOne('/api/auth/login');
      expect(req.request.method).toBe('POST');
      expect(req.request.body).toEqual({ email: 'machinist@demo.test', password: 'pa55 word' });
      req.flush({ user: MACHINIST });
      await fixture.whenStable();
      expect(TestBed.inject(Auth).user()).toEqual(MACHINIST);
    });

    it('should go to next after signing in', async () => {
      fixture.componentRef.setInput('next', '/library?kind=taper');
      await signInAs(MACHINIST);
      expect(navigateByUrl).toHaveBeenCalledWith('/library?kind=taper');
    });

    it('should go home without next', async () => {
      await signInAs(MACHINIST);
      expect(navigateByUrl).toHaveBeenCalledWith('/');
    });

    it('should go home when next points to another site', async () => {
      fixture.componentRef.setInput('next', '//elsewhere.example/steal');
      await signInAs(MACHINIST);
      expect(navigateByUrl).toHaveBeenCalledWith('/');
    });
  });

  describe('server refusal', () => {
    it('should show the 401 message and stay on the page', async () => {
      await fill('machinist@demo.test', 'wrong-password');
      await submit();
      http.expectOne('/api/auth/login')
        .flush({ error: 'E-mail or password is incorrect.' }, { status: 401, statusText: 'Unauthorized' });
      await settle();
      expect(alertText()).toBe('E-mail or password is incorrect.');
      expect(navigateByUrl).not.toHaveBeenCalled();
      expect(await (await submitButton()).isDisabled()).toBe(false);
    });

    it('should show the throttling message on a 429', async () => {
      await fill('machinist@demo.test', 'wrong-password');
      await submit();
      http.expectOne('/api/auth/login').flush(
        { error: 'Too many failed sign-ins. Try again in 10 minutes.' },
        { status: 429, statusText: 'Too Many Requests' },
      );
      await settle();
      expect(alertText()).toBe('Too many failed sign-ins. Try again in 10 minutes.');
    });

    it('should put a field message from a 400 under its field', async () => {
      await fill('machinist@demo.test', 'x');
      await submit();
      http.expectOne('/api/auth/login').flush(
        { error: 'Check the highlighted fields.', fields: { password: 'That password is too long.' } },
        { status: 400, statusText: 'Bad Request' },
      );
      await fixture.whenStable();
      expect(await errorsOf('Password')).toEqual(['That password is too long.']);
    });

    it('should clear the old message on the next attempt', async () => {
      await fill('machinist@demo.test', 'wrong-password');
      await submit();
      http.expectOne('/api/auth/login').flush({ error: 'E-mail or password is incorrect.' }, { status: 401, statusText: 'Unauthorized' });
      await fixture.whenStable();
      await submit();
      expect(alertText()).toBeNull();
      http.expectOne('/api/auth/login').flush({ user: MACHINIST });
      await fixture.whenStable();
    });
  });

  describe('demo hint', () => {
    it('should list the demo e-mail addresses and no password', () => {
      const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
      expect(text).toContain('Demo accounts: admin@demo.test, lead@demo.test, machinist@demo.test, apprentice@demo.test');
      expect(text.toLowerCase()).not.toMatch(/password:/);
    });
  });

  function configureTestingModule(): void {
    TestBed.configureTestingModule({
      imports: [SignInPage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
  }

  async function fill(email: string, password: string): Promise<void> {
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=email]' }))).setValue(email);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=password]' }))).setValue(password);
  }

  function submitButton(): Promise<MatButtonHarness> {
    return loader.getHarness(MatButtonHarness.with({ text: /Sign in/ }));
  }

  async function submit(): Promise<void> {
    await (await submitButton()).click();
  }

  async function signInAs(user: typeof MACHINIST): Promise<void> {
    await fill(user.email, 'pa55 word');
    await submit();
    http.expectOne('/api/auth/login').flush({ user });
    await settle();
  }

  async function errorsOf(label: string): Promise<string[]> {
    return (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getTextErrors();
  }

  /** Lets the page react to a flushed response: the sign-in promise settles, then the view updates. */
  async function settle(): Promise<void> {
    await new Promise(resolve => setTimeout(resolve));
    await fixture.whenStable();
  }

  function alertText(): string | null {
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role=alert] .server-error-text');
    return alert ? (alert.textContent ?? '').trim() : null;
  }
});

describe('safeNextUrl', () => {
  it('should keep a same-site path with its query', () => {
    expect(safeNextUrl('/library?kind=taper')).toBe('/library?kind=taper');
    expect(safeNextUrl('/team')).toBe('/team');
  });

  it('should fall back to home for anything else', () => {
    expect(safeNextUrl(undefined)).toBe('/');
    expect(safeNextUrl('')).toBe('/');
    expect(safeNextUrl('https://elsewhere.example/')).toBe('/');
    expect(safeNextUrl('//elsewhere.example/')).toBe('/');
    expect(safeNextUrl('/\\elsewhere.example/')).toBe('/');
    expect(safeNextUrl('/sign-in?next=%2F')).toBe('/');
  });
});
