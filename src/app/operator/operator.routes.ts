import type { Routes } from '@angular/router';
import { type AccessData, accessGuard } from '../core/session/access-guard';

/**
 * The pages at the saw: the finder, checking a printed sheet's code and tracing a specimen.
 * Loaded under an empty path, so the URLs stay /finder, /check/:code (the QR code on every
 * bench sheet) and /cuts; every route declares its own access.
 */
export const operatorRoutes: Routes = [
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
    loadComponent: () => import('./specimen-trace/specimen-trace').then((m) => m.SpecimenTrace),
  },
];
