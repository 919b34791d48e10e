import type { Routes } from '@angular/router';

/** Child routes of /people; the admin-only access is declared on the parent in app.routes.ts. */
export const peopleRoutes: Routes = [
  {
    path: '',
    title: 'People · Kerfbook',
    loadComponent: () => import('./people-list').then((m) => m.PeopleList),
  },
];
