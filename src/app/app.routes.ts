import { inject } from '@angular/core';
import type { Routes } from '@angular/router';
import type { Role } from '../../shared/roles';
import { type AccessData, accessGuard } from './core/session/access-guard';
import { Session } from './core/session/session';
import { unsavedChangesGuard } from './recipe-editor/unsaved-changes-guard';
import { numericIdParam } from './recipe/numeric-id-param';

function isOnlyOperator(roles: readonly Role[]): boolean {
  return roles.length > 0 && roles.every((r) => r === 'operator');
}

/**
 * The one route table. Every route declares who may open it in `data.access` (public,
 * signedIn or a list of roles), checked by accessGuard; nav-items.ts repeats the access for
 * the entries it shows. Pages load lazily.
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
        path: 'recipes/new',
        title: 'New recipe · Kerfbook',
        canActivate: [accessGuard],
        canDeactivate: [unsavedChangesGuard],
        data: { access: ['author'] } satisfies AccessData,
        loadComponent: () => import('./recipe-editor/recipe-editor').then((m) => m.RecipeEditor),
      },
      {
        path: 'recipes/:id/edit',
        title: 'Edit recipe · Kerfbook',
        canActivate: [accessGuard],
        canDeactivate: [unsavedChangesGuard],
        data: { access: ['author'] } satisfies AccessData,
        loadComponent: () => import('./recipe-editor/recipe-editor').then((m) => m.RecipeEditor),
      },
      {
        path: 'recipes/:id/review',
        title: 'Review · Kerfbook',
        canMatch: [numericIdParam],
        canActivate: [accessGuard],
        data: { access: ['approver'] } satisfies AccessData,
        loadComponent: () => import('./review/review-page').then((m) => m.ReviewPage),
      },
      {
        path: 'library',
        title: 'Library · Kerfbook',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./library/library').then((m) => m.Library),
      },
      {
        // Before the generic recipes/:id, and numeric ids only like it.
        path: 'recipes/:id/compare',
        title: 'Compare versions · Kerfbook',
        canMatch: [numericIdParam],
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./compare/compare-page').then((m) => m.ComparePage),
      },
      {
        // The link in a "new version in use" mail: /recipes/:id/acknowledge?v=N
        path: 'recipes/:id/acknowledge',
        title: 'Acknowledge a version · Kerfbook',
        canMatch: [numericIdParam],
        canActivate: [accessGuard],
        data: { access: ['operator'] } satisfies AccessData,
        loadComponent: () => import('./acknowledge/acknowledge-page').then((m) => m.AcknowledgePage),
      },
      {
        // Numeric ids only, so /recipes/new (the editor) never lands here whatever the order.
        path: 'recipes/:id',
        title: 'Recipe · Kerfbook',
        canMatch: [numericIdParam],
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./recipe/recipe-page').then((m) => m.RecipePage),
      },
      {
        path: 'finder',
        title: 'Find a recipe · Kerfbook',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./finder/finder').then((m) => m.Finder),
      },
      {
        // The QR code on a bench sheet points here; signed-out visitors come back after signing in.
        path: 'check/:code',
        title: 'Check a sheet · Kerfbook',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./check/check-page').then((m) => m.CheckPage),
      },
      {
        path: 'check',
        title: 'Check a sheet · Kerfbook',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./check/check-page').then((m) => m.CheckPage),
      },
      {
        path: 'cuts',
        title: 'Trace a specimen · Kerfbook',
        canActivate: [accessGuard],
        data: { access: 'signedIn' } satisfies AccessData,
        loadComponent: () => import('./cuts/specimen-trace').then((m) => m.SpecimenTrace),
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
    ],
  },
  {
    path: '**',
    title: 'Page not found · Kerfbook',
    data: { access: 'public' } satisfies AccessData,
    loadComponent: () => import('./not-found/not-found').then((m) => m.NotFound),
  },
];
