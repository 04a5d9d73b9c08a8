import { BreakpointObserver, BreakpointState } from '@angular/cdk/layout';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Provider, computed, signal } from '@angular/core';
import { ComponentFixture, DeferBlockState, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSidenavHarness } from '@angular/material/sidenav/testing';
import { Router, provideRouter } from '@angular/router';
import { of } from 'rxjs';

import { Auth, AuthUser } from '../core/auth';
import { AREAS } from './areas';
import { Shell } from './shell';

const LEAD: AuthUser = { id: 2, email: 'lead@demo.test', name: 'Morgan Vale', role: 'lead' };

describe('Shell', () => {
  let fixture: ComponentFixture<Shell>;
  let loader: HarnessLoader;
  let auth: FakeAuth;

  describe('on a desktop screen', () => {
    beforeEach(async () => {
      await createShell({ handset: false, user: null });
    });

    it('should show the product name and logo mark', () => {
      expect(text('.brand')).toBe('Slantwise');
      expect(element().querySelector('.brand app-logo-mark svg')).not.toBeNull();
    });

    it('should link to home and to every area', () => {
      const links = Array.from(element().querySelectorAll<HTMLAnchorElement>('.nav-link'));
      expect(links.map(a => a.getAttribute('href'))).toEqual(['/', ...AREAS.map(area => '/' + area.path)]);
      expect(links.map(a => a.querySelector('.nav-label')?.textContent?.trim())).toEqual(['Home', ...AREAS.map(area => area.label)]);
      expect(links.every(a => (a.querySelector('mat-icon')?.textContent ?? '').trim().length > 0)).toBe(true);
    });

    it('should group calculators apart from team work', () => {
      expect(Array.from(element().querySelectorAll('.nav-heading')).map(h => h.textContent?.trim())).toEqual(['Calculators', 'Team work']);
    });

    it('should keep the navigation open beside the page, with no menu button', async () => {
      const sidenav = await loader.getHarness(MatSidenavHarness);
      expect(await sidenav.getMode()).toBe('side');
      expect(await sidenav.isOpen()).toBe(true);
      expect(element().querySelector('.menu-button')).toBeNull();
    });
  });

  describe('when anonymous', () => {
    beforeEach(async () => {
      await createShell({ handset: false, user: null });
    });

    it('should offer Sign in', async () => {
      const signIn = await loader.getHarness(MatButtonHarness.with({ text: /Sign in/ }));
      expect(await (await signIn.host()).getAttribute('href')).toBe('/sign-in');
      expect(element().querySelector('app-account-menu')).toBeNull();
    });

    it('should mark the four areas that need sign-in with a lock', () => {
      const locked = Array.from(element().querySelectorAll('.nav-link'))
        .filter(a => a.querySelector('.lock'))
        .map(a => a.querySelector('.nav-label')?.textContent?.trim());
      expect(locked).toEqual(['Batch runs', 'Set-up library', 'Training', 'Team']);
    });

    it('should not offer Sign in before the session is known', async () => {
      auth.loadedState.set(false);
      await fixture.whenStable();
      expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Sign in/ }))).toHaveLength(0);
    });
  });

  describe('when signed in', () => {
    beforeEach(async () => {
      await createShell({ handset: false, user: LEAD });
    });

    it('should show the name and role instead of Sign in', async () => {
      expect(text('.toolbar')).toContain('Morgan Vale');
      expect(text('.role-badge')).toBe('Lead hand');
      expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Sign in/ }))).toHaveLength(0);
      expect(element().querySelector('.lock')).toBeNull();
    });

    it('should sign out from the account menu and go home', async () => {
      const navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
      await renderAccountMenu();
      const menu = await loader.getHarness(MatMenuHarness);
      await menu.open();
      const overlay = document.querySelector('.mat-mdc-menu-panel')?.textContent ?? '';
      expect(overlay).toContain('lead@demo.test');
      expect(overlay).toContain('Role: Lead hand');
      await menu.clickItem({ text: /Sign out/ });
      await fixture.whenStable();
      expect(auth.signOut).toHaveBeenCalledTimes(1);
      expect(navigateByUrl).toHaveBeenCalledWith('/');
    });

    it('should stay put when signing out fails', async () => {
      auth.signOut.mockRejectedValueOnce(new Error('offline'));
      const navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
      await renderAccountMenu();
      const menu = await loader.getHarness(MatMenuHarness);
      await menu.open();
      await menu.clickItem({ text: /Sign out/ });
      await fixture.whenStable();
      expect(navigateByUrl).not.toHaveBeenCalled();
    });
  });

  describe('on a screen narrower than 960 px', () => {
    beforeEach(async () => {
      await createShell({ handset: true, user: null });
    });

    it('should hide the navigation behind a menu button', async () => {
      const sidenav = await loader.getHarness(MatSidenavHarness);
      expect(await sidenav.getMode()).toBe('over');
      expect(await sidenav.isOpen()).toBe(false);
      const menuButton = await loader.getHarness(MatButtonHarness.with({ selector: '.menu-button' }));
      await menuButton.click();
      expect(await sidenav.isOpen()).toBe(true);
      expect(await (await menuButton.host()).getAttribute('aria-expanded')).toBe('true');
    });

    it('should close the navigation after a link is followed', async () => {
      jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
      const menuButton = await loader.getHarness(MatButtonHarness.with({ selector: '.menu-button' }));
      await menuButton.click();
      expect(await (await menuButton.host()).getAttribute('aria-expanded')).toBe('true');
      element().querySelector<HTMLAnchorElement>('a.nav-link[href="/taper"]')?.click();
      await fixture.whenStable();
      expect(await (await menuButton.host()).getAttribute('aria-expanded')).toBe('false');
    });

    it('should keep the menu button in step when the drawer is closed with Escape', async () => {
      const menuButton = await loader.getHarness(MatButtonHarness.with({ selector: '.menu-button' }));
      await menuButton.click();
      const drawer = element().querySelector('mat-sidenav') as HTMLElement;
      drawer.dispatchEvent(new KeyboardEvent('keydown', { key: 'Escape', keyCode: 27, bubbles: true }));
      await new Promise(resolve => setTimeout(resolve));
      await fixture.whenStable();
      expect(await (await menuButton.host()).getAttribute('aria-expanded')).toBe('false');
      expect(await (await loader.getHarness(MatSidenavHarness)).isOpen()).toBe(false);
    });
  });

  async function createShell(options: { handset: boolean; user: AuthUser | null }): Promise<void> {
    auth = new FakeAuth(options.user);
    configureTestingModule([
      { provide: Auth, useValue: auth },
      { provide: BreakpointObserver, useValue: { observe: () => of<BreakpointState>({ matches: options.handset, breakpoints: {} }) } },
    ]);
    fixture = TestBed.createComponent(Shell);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  function configureTestingModule(extraProviders: Provider[]): void {
    TestBed.configureTestingModule({ imports: [Shell], providers: [provideRouter([]), ...extraProviders] });
  }

  async function renderAccountMenu(): Promise<void> {
    const [block] = await fixture.getDeferBlocks();
    await block.render(DeferBlockState.Complete);
    await fixture.whenStable();
  }

  function element(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }

  function text(selector: string): string {
    return (element().querySelector(selector)?.textContent ?? '').replace(/\s+/g, ' ').trim();
  }
});

/** Stands in for Auth: the same signals, with the user set by the test. */
class FakeAuth {
  readonly userState = signal<AuthUser | null>(null);
  readonly loadedState = signal(true);
  readonly user = this.userState.asReadonly();
  readonly loaded = this.loadedState.asReadonly();
  readonly signedIn = computed(() => this.userState() !== null);
  readonly signOut = jest.fn(() => {
    this.userState.set(null);
    return Promise.resolve();
  });

  constructor(user: AuthUser | null) {
    this.userState.set(user);
  }
}
