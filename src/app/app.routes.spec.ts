import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, TitleStrategy, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { routes } from './app.routes';
import { signedIn } from './core/auth-guards';
import { PageTitle } from './core/page-title';
import { AREAS } from './shell/areas';

describe('routes', () => {
  it('should have one lazily loaded route per area, guarded exactly when the area needs sign-in', () => {
    for (const area of AREAS) {
      const matching = routes.filter(r => r.path === area.path);
      expect(matching).toHaveLength(1);
      // An area is one page (loadComponent) or a small set of child pages (loadChildren), never eager.
      expect(matching[0].loadComponent ?? matching[0].loadChildren).toBeDefined();
      expect(matching[0].component).toBeUndefined();
      expect((matching[0].canActivate ?? []).includes(signedIn)).toBe(area.needsSignIn);
    }
  });

  describe('navigation', () => {
    let harness: RouterTestingHarness;
    let http: HttpTestingController;

    beforeEach(async () => {
      TestBed.configureTestingModule({
        providers: [
          provideRouter(routes, withComponentInputBinding()),
          provideHttpClient(),
          provideHttpClientTesting(),
          { provide: TitleStrategy, useClass: PageTitle },
        ],
      });
      http = TestBed.inject(HttpTestingController);
      harness = await RouterTestingHarness.create();
    });

    afterEach(() => http.verify());

    it('should send an anonymous visitor of a stored-work area to sign-in', async () => {
      const navigation = harness.navigateByUrl('/library');
      // The guard asks who is signed in once the router reaches it.
      await new Promise(resolve => setTimeout(resolve));
      http.expectOne('/api/auth/session').flush({ user: null });
      await navigation;
      expect(TestBed.inject(Router).url).toBe('/sign-in?next=%2Flibrary');
    });

    it('should show the not-found page for an unknown address', async () => {
      await harness.navigateByUrl('/no/such/page');
      expect(harness.routeNativeElement?.querySelector('h1')?.textContent).toBe('Page not found');
    });

    it('should show the home page with a card per area and the caution', async () => {
      await harness.navigateByUrl('/');
      const cards = harness.routeNativeElement?.querySelectorAll('.area-link') ?? [];
      expect(Array.from(cards).map(a => a.getAttribute('href'))).toEqual(AREAS.map(area => '/' + area.path));
      expect(harness.routeNativeElement?.querySelector('.caution')?.textContent).toMatch(/clamp the work securely.*eye\s+protection.*local regulations/s);
    });
  });
});
