import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { SessionService } from './session-service';

/** Pages for some roles only, named in the route's `data.roles`; others go to the overview. */
export const roleGuard: CanActivateFn = (route, state) => {
  const session = inject(SessionService);
  const router = inject(Router);
  if (!session.token()) return router.createUrlTree(['/accounts/sign-in'], { queryParams: { returnTo: state.url } });
  return session.hasRole(route.data['roles'] as readonly string[] | undefined) ? true : router.createUrlTree(['/']);
};
