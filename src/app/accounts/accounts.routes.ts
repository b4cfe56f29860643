import { Routes } from '@angular/router';

/** Pages anyone may open: signing in and following the e-mailed links. */
export const accountsRoutes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in - Riffle',
    loadComponent: () => import('./sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: 'forgot-password',
    title: 'Forgot password - Riffle',
    loadComponent: () => import('./forgot-password-page').then((m) => m.ForgotPasswordPage),
  },
  {
    path: 'reset-password',
    title: 'New password - Riffle',
    loadComponent: () => import('./reset-password-page').then((m) => m.ResetPasswordPage),
  },
  {
    path: 'accept-invitation',
    title: 'Join Riffle',
    loadComponent: () => import('./accept-invitation-page').then((m) => m.AcceptInvitationPage),
  },
  { path: '', pathMatch: 'full', redirectTo: 'sign-in' },
];
