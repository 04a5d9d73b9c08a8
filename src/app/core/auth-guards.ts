import { inject } from '@angular/core';
import { CanActivateFn, Router, UrlTree } from '@angular/router';

import { Auth, ROLE_LABELS, Role } from './auth';
import { ErrorNotice } from './error-notice';

/** Lets a signed-in user through; anyone else goes to /sign-in with `next` set to the wanted page. */
export const signedIn: CanActivateFn = async (_route, state) => {
  const router = inject(Router);
  const user = await inject(Auth).ready();
  return user ? true : signInTree(router, state.url);
};

/** Lets through a signed-in user holding one of `roles`; others see a notice and go home. */
export function hasRole(...roles: readonly Role[]): CanActivateFn {
  return async (_route, state) => {
    const router = inject(Router);
    const notice = inject(ErrorNotice);
    const user = await inject(Auth).ready();
    if (!user) return signInTree(router, state.url);
    if (roles.includes(user.role)) return true;
    void notice.show(`This area is open to ${roles.map(r => ROLE_LABELS[r]).join(', ')}; you are signed in as ${ROLE_LABELS[user.role]}.`);
    return router.createUrlTree(['/']);
  };
}

/** The sign-in page, told where to return afterwards. */
function signInTree(router: Router, next: string): UrlTree {
  return router.createUrlTree(['/sign-in'], { queryParams: { next } });
}
