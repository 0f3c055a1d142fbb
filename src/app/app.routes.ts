// Top-level routes: each feature loads when first visited.
import { Routes } from '@angular/router';
import { authGuard } from './core/auth/auth-guard';
import { authRoutes } from './features/auth/auth.routes';

export const routes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'builds' },
  ...authRoutes,
  {
    path: 'builds',
    canActivate: [authGuard],
    loadChildren: () => import('./features/builds/builds.routes').then((m) => m.buildsRoutes),
  },
  {
    path: 'invites/:token',
    title: 'Invite · Tallyhood',
    loadComponent: () => import('./features/crew/pages/invite-accept').then((m) => m.InviteAccept),
  },
  { path: '**', title: 'Page not found · Tallyhood', loadComponent: () => import('./not-found').then((m) => m.NotFound) },
];
