// Sign-in, sign-up (and its mailed link) and password reset pages, each loaded on first visit.
import { Routes } from '@angular/router';

export const authRoutes: Routes = [
  { path: 'sign-in', title: 'Sign in · Tallyhood', loadComponent: () => import('./pages/sign-in').then((m) => m.SignIn) },
  { path: 'sign-up', title: 'Create an account · Tallyhood', loadComponent: () => import('./pages/sign-up').then((m) => m.SignUp) },
  {
    path: 'sign-up/confirm/:token',
    title: 'Finish creating your account · Tallyhood',
    loadComponent: () => import('./pages/sign-up-confirm').then((m) => m.SignUpConfirm),
  },
  {
    path: 'reset-password',
    title: 'Reset your password · Tallyhood',
    loadComponent: () => import('./pages/reset-request').then((m) => m.ResetRequest),
  },
  {
    path: 'reset-password/:token',
    title: 'Set a new password · Tallyhood',
    loadComponent: () => import('./pages/reset-confirm').then((m) => m.ResetConfirm),
  },
];
