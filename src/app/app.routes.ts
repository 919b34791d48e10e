import { inject } from '@angular/core';
import type { Routes } from '@angular/router';
import { type AccessData, accessGuard } from './core/session/access-guard';
import { Session } from './core/session/session';
import { isOnlyOperator } from './core/session/home-page';

/**
 * The one route table. Every route declares who may open it in `data.access` (public,
 * signedIn or a list of roles), checked by accessGuard; nav-items.ts repeats the access for
 * the entries it shows. Pages load lazily; a feature with several pages brings its own table
 * (recipes.routes.ts, operator.routes.ts, stock.routes.ts, people.routes.ts).
 */
export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Kerfbook',
    data: { access: 'public' } satisfies AccessData,
    loadComponent: () => import('./sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'forgot-password',
    title: 'Forgot password · Kerfbook',
    data: { access: 'public' } satisfies AccessData,
    loadComponent: () => import('./password-links/forgot-password').then((m) => m.ForgotPassword),
  },
  {
    // Invitation and password-reset links from mails: /set-password?token=…
    path: 'set-password',
    title: 'Set your password · Kerfbook',
    data: { access: 'public' } satisfies AccessData,
    loadComponent: () => import('./password-links/set-password').then((m) => m.SetPassword),
  },
  {
    path: '',
    canActivate: [accessGuard],
    data: { access: 'signedIn' } satisfies AccessData,
    loadComponent: () => import('./core/shell/shell').then((m) => m.Shell),
    children: [
      // A person who only runs the saw starts at the finder; everyone else at Today.
      { path: '', pathMatch: 'full', redirectTo: () => (isOnlyOperator(inject(Session).roles()) ? 'finder' : 'today') },
      {
        path: 'today',
        title: 'Today · Kerfbook',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./today/today').then((m) => m.Today),
      },
      {
        // Library, recipe page, editor, review, compare and acknowledgement: /library and /recipes/…
        path: '',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadChildren: () => import('./recipes/recipes.routes').then((m) => m.recipesRoutes),
      },
      {
        // The pages at the saw: /finder, /check and /cuts.
        path: '',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadChildren: () => import('./operator/operator.routes').then((m) => m.operatorRoutes),
      },
      {
        path: 'stock',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadChildren: () => import('./stock/stock.routes').then((m) => m.stockRoutes),
      },
      {
        path: 'trail',
        title: 'Trail · Kerfbook',
        canActivate: [accessGuard],
        data: { access: ['auditor', 'admin'] } satisfies AccessData,
        loadComponent: () => import('./trail/trail').then((m) => m.Trail),
      },
      {
        path: 'people',
        canActivate: [accessGuard],
        data: { access: ['admin'] } satisfies AccessData,
        loadChildren: () => import('./people/people.routes').then((m) => m.peopleRoutes),
      },
      {
        path: 'lab-settings',
        title: 'Lab settings · Kerfbook',
        canActivate: [accessGuard],
        data: { access: ['admin'] } satisfies AccessData,
        loadComponent: () => import('./lab-settings/lab-settings').then((m) => m.LabSettings),
      },
      {
        // Development only: the mails the local catcher received (the server answers 404 in production).
        path: 'outbox',
        title: 'Outbox · Kerfbook',
        canActivate: [accessGuard],
        data: { access: ['admin'] } satisfies AccessData,
        loadComponent: () => import('./outbox/outbox').then((m) => m.Outbox),
      },
      {
        path: 'api-reference',
        title: 'API reference · Kerfbook',
        canActivate: [accessGuard],
        data: { access: ['admin'] } satisfies AccessData,
        loadComponent: () => import('./api-reference/api-reference').then((m) => m.ApiReference),
      },
      {
        path: 'account',
        title: 'My account · Kerfbook',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./account/account').then((m) => m.Account),
      },
      {
        path: 'not-allowed',
        title: 'Not allowed · Kerfbook',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./not-allowed/not-allowed').then((m) => m.NotAllowed),
      },
      // A signed-in person who follows a dead link stays in the app, with its navigation;
      // anyone else falls through to the public page below.
      {
        path: '**',
        title: 'Page not found · Kerfbook',
        canMatch: [() => inject(Session).isSignedIn()],
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./not-found/not-found').then((m) => m.NotFound),
      },
    ],
  },
  {
    path: '**',
    title: 'Page not found · Kerfbook',
    data: { access: 'public' } satisfies AccessData,
    loadComponent: () => import('./not-found/not-found').then((m) => m.NotFound),
  },
];
