// Lets signed-in people through; sends everyone else to sign in and back afterwards.
import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { Session } from './session';

export const authGuard: CanActivateFn = async (_route, state) => {
  const router = inject(Router);
  const user = await inject(Session).load();
  return user ? true : router.createUrlTree(['/sign-in'], { queryParams: { returnTo: state.url } });
};
