import type { Routes } from '@angular/router';

/** Child routes of /stock; everyone signed in reads (access on the parent in app.routes.ts), authors and admins edit. */
export const stockRoutes: Routes = [
  {
    path: '',
    loadComponent: () => import('./stock-page').then((m) => m.StockPage),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'materials' },
      {
        path: 'materials',
        title: 'Materials · Stock · Kerfbook',
        loadComponent: () => import('./stock-materials').then((m) => m.StockMaterials),
      },
      {
        path: 'wheels',
        title: 'Wheels · Stock · Kerfbook',
        loadComponent: () => import('./stock-wheels').then((m) => m.StockWheels),
      },
      {
        path: 'machines',
        title: 'Machines · Stock · Kerfbook',
        loadComponent: () => import('./stock-machines').then((m) => m.StockMachines),
      },
      {
        path: 'wheel-selection',
        title: 'Wheel selection · Stock · Kerfbook',
        loadComponent: () => import('./wheel-selection').then((m) => m.WheelSelection),
      },
    ],
  },
];
