import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, CanActivateFn, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';

import { Auth, AuthUser } from './auth';
import { hasRole, signedIn } from './auth-guards';
import { ErrorNotice } from './error-notice';

const APPRENTICE: AuthUser = { id: 4, email: 'apprentice@demo.test', name: 'Robin Ashdown', role: 'apprentice' };
const ADMIN: AuthUser = { id: 1, email: 'admin@demo.test', name: 'Jo Kestrel', role: 'admin' };

describe('auth guards', () => {
  let show: jest.Mock;

  /** Runs a guard for `url` with `user` signed in (or nobody). */
  async function runGuard(guard: CanActivateFn, url: string, user: AuthUser | null): Promise<unknown> {
    TestBed.overrideProvider(Auth, { useValue: { ready: () => Promise.resolve(user) } });
    const state = { url } as RouterStateSnapshot;
    return TestBed.runInInjectionContext(() => guard({} as ActivatedRouteSnapshot, state));
  }

  /** The URL a guard's UrlTree points at. */
  function target(result: unknown): string {
    expect(result).toBeInstanceOf(UrlTree);
    return TestBed.inject(Router).serializeUrl(result as UrlTree);
  }

  beforeEach(() => {
    show = jest.fn(() => Promise.resolve());
    TestBed.configureTestingModule({
      providers: [provideRouter([]), { provide: ErrorNotice, useValue: { show } }],
    });
  });

  describe('signedIn', () => {
    it('should let a signed-in user through', async () => {
      await expect(runGuard(signedIn, '/library', APPRENTICE)).resolves.toBe(true);
    });

    it('should send an anonymous visitor to sign-in with next', async () => {
      expect(target(await runGuard(signedIn, '/library?page=2', null))).toBe('/sign-in?next=%2Flibrary%3Fpage%3D2');
    });
  });

  describe('hasRole', () => {
    it('should let a user with an allowed role through', async () => {
      await expect(runGuard(hasRole('admin', 'lead'), '/team', ADMIN)).resolves.toBe(true);
      expect(show).not.toHaveBeenCalled();
    });

    it('should send another role home with a notice naming both roles', async () => {
      expect(target(await runGuard(hasRole('admin', 'lead'), '/team', APPRENTICE))).toBe('/');
      expect(show).toHaveBeenCalledWith(expect.stringMatching(/Admin, Lead hand.*Apprentice/));
    });

    it('should send an anonymous visitor to sign-in', async () => {
      expect(target(await runGuard(hasRole('admin'), '/team', null))).toBe('/sign-in?next=%2Fteam');
    });
  });
});
