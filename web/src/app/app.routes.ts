import { Routes } from '@angular/router';

import { redirectSignedIn } from './auth/redirect-signed-in';
import { requireSession } from './auth/require-session';

/** Top-level routes: the public sign-in page and the signed-in shell with its screens. */
export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Seamline',
    canActivate: [redirectSignedIn],
    loadComponent: () => import('./auth/sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: '',
    canActivate: [requireSession],
    loadComponent: () => import('./shell/shell').then((m) => m.Shell),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'overview' },
      {
        path: 'overview',
        title: 'Overview · Seamline',
        loadComponent: () => import('./overview/overview').then((m) => m.Overview),
      },
    ],
  },
  { path: '**', redirectTo: 'overview' },
];
