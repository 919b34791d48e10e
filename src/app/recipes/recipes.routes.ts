import type { Routes } from '@angular/router';
import { type AccessData, accessGuard } from '../core/session/access-guard';
import { unsavedChangesGuard } from './editor/unsaved-changes-guard';
import { numericIdParam } from './numeric-id-param';

/**
 * The recipe pages: library, recipe, editor, review, compare and acknowledgement. Loaded under
 * an empty path, so the URLs are the ones mails and bookmarks know (/library, /recipes/:id?v=N,
 * /recipes/:id/acknowledge?v=N …). Every route declares its own access, checked by accessGuard.
 */
export const recipesRoutes: Routes = [
  {
    path: 'recipes/new',
    title: 'New recipe · Kerfbook',
    canActivate: [accessGuard],
    canDeactivate: [unsavedChangesGuard],
    data: { access: ['author'] } satisfies AccessData,
    loadComponent: () => import('./editor/recipe-editor').then((m) => m.RecipeEditor),
  },
  {
    path: 'recipes/:id/edit',
    title: 'Edit recipe · Kerfbook',
    canActivate: [accessGuard],
    canDeactivate: [unsavedChangesGuard],
    data: { access: ['author'] } satisfies AccessData,
    loadComponent: () => import('./editor/recipe-editor').then((m) => m.RecipeEditor),
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
    loadComponent: () => import('./recipe-page/recipe-page').then((m) => m.RecipePage),
  },
];
