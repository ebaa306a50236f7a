import { Routes } from '@angular/router';

import { ALL_ROLES } from './api-types';
import { redirectSignedIn } from './auth/redirect-signed-in';
import { requireRole } from './auth/require-role';
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
      {
        path: 'snapshots/:snapshotId/functions',
        title: 'Functions · Seamline',
        canActivate: [requireRole(...ALL_ROLES)],
        loadComponent: () => import('./functions/functions').then((m) => m.Functions),
      },
      {
        path: 'snapshots/:snapshotId/gravity',
        title: 'Gravity · Seamline',
        canActivate: [requireRole(...ALL_ROLES)],
        loadComponent: () => import('./gravity/gravity').then((m) => m.Gravity),
      },
      {
        path: 'snapshots/:snapshotId/functions/:functionId',
        title: 'Flow · Seamline',
        canActivate: [requireRole(...ALL_ROLES)],
        loadComponent: () => import('./flow/flow').then((m) => m.Flow),
      },
      {
        path: 'snapshots/:snapshotId/atlas',
        title: 'Atlas · Seamline',
        canActivate: [requireRole(...ALL_ROLES)],
        loadComponent: () => import('./atlas/atlas').then((m) => m.Atlas),
      },
    ],
  },
  { path: '**', redirectTo: 'overview' },
];
