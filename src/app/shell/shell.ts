import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatRippleModule } from '@angular/material/core';
import { MatIconModule } from '@angular/material/icon';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';

import { Auth, ROLE_LABELS } from '../core/auth';
import { AccountMenu } from './account-menu';
import { AREAS, Area } from './areas';
import { LogoMark } from './logo-mark';

/** Below this width the navigation slides over the page instead of sitting beside it. */
export const HANDSET_QUERY = '(max-width: 959.98px)';

/** A headed group of navigation links. */
interface NavGroup {
  readonly heading: string;
  readonly areas: readonly Area[];
}

/** The frame around every page: toolbar with account menu, area navigation and the routed page. */
@Component({
  selector: 'app-shell',
  imports: [
    LogoMark, AccountMenu, RouterOutlet, RouterLink, RouterLinkActive,
    MatToolbarModule, MatSidenavModule, MatRippleModule, MatIconModule, MatButtonModule,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
})
export class Shell {
  protected readonly auth = inject(Auth);
  private readonly router = inject(Router);

  /** The areas in the navigation: calculators (open to all), then the areas that store work. */
  protected readonly navGroups: readonly NavGroup[] = [
    { heading: 'Calculators', areas: AREAS.filter(area => !area.needsSignIn) },
    { heading: 'Team work', areas: AREAS.filter(area => area.needsSignIn) },
  ];
  /** Whether the screen is narrow enough to hide the navigation behind the menu button. */
  protected readonly handset = signal(false);
  /** Whether the navigation is open (always, on a wide screen). */
  protected readonly navOpen = signal(true);
  /** The current URL, to come back to after signing in. */
  private readonly currentUrl = toSignal(
    this.router.events.pipe(
      filter((e): e is NavigationEnd => e instanceof NavigationEnd),
      map(e => e.urlAfterRedirects),
    ),
    { initialValue: this.router.url },
  );
  /** Query parameters of the Sign in link: return here afterwards, unless here is home or sign-in. */
  protected readonly signInParams = computed(() => {
    const url = this.currentUrl();
    return url === '/' || url.startsWith('/sign-in') ? {} : { next: url };
  });
  /** Whether the sign-in page is showing (its own form makes the toolbar's Sign in redundant). */
  protected readonly onSignInPage = computed(() => this.currentUrl().startsWith('/sign-in'));
  /** The signed-in user's role as a label. */
  protected readonly roleLabel = computed(() => {
    const user = this.auth.user();
    return user ? ROLE_LABELS[user.role] : '';
  });

  constructor() {
    inject(BreakpointObserver)
      .observe(HANDSET_QUERY)
      .pipe(takeUntilDestroyed())
      .subscribe(state => this.fitNavigation(state.matches));
  }

  /** Opens or closes the navigation (the menu button on narrow screens). */
  protected toggleNav(): void {
    this.navOpen.update(open => !open);
  }

  /** After following a link on a narrow screen, gets the navigation out of the way. */
  protected closeNavOnHandset(): void {
    if (this.handset()) this.navOpen.set(false);
  }

  /** Keeps the state in step when the drawer closes itself (backdrop click, Escape). */
  protected markNavClosed(): void {
    this.navOpen.set(false);
  }

  private fitNavigation(handset: boolean): void {
    this.handset.set(handset);
    this.navOpen.set(!handset);
  }
}
