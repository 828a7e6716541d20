import { inject } from '@angular/core';
import { RedirectCommand, Router, type CanActivateFn } from '@angular/router';
import type { Permission } from 'wick-core';
import { AuthStore } from './auth-store';

/**
 * Opens the route only for people whose roles grant `permission` (or anyone signed in, for `'signed-in'`).
 * Otherwise the sign-in page (anonymous) or the 403 page (missing role) is shown at the same address, so
 * reloading after signing in lands on the page that was asked for.
 */
export function roleGuard(permission: Permission | 'signed-in'): CanActivateFn {
  return async (route, state) => {
    const auth = inject(AuthStore);
    const router = inject(Router);
    await auth.load();
    const area = (route.data['title'] as string | undefined) ?? '';
    if (auth.status() === 'anonymous') {
      const signIn = router.createUrlTree(['/sign-in'], { queryParams: { returnTo: state.url, area } });
      return new RedirectCommand(signIn, { browserUrl: state.url });
    }
    if (auth.status() !== 'signed-in' || (permission !== 'signed-in' && !auth.can(permission))) {
      const forbidden = router.createUrlTree(['/forbidden'], { queryParams: { need: permission, area } });
      return new RedirectCommand(forbidden, { browserUrl: state.url });
    }
    return true;
  };
}
