import type { Routes } from '@angular/router';

export const catalogRoutes: Routes = [
  {
    path: '',
    title: 'Pump catalog - Riffle',
    loadComponent: () => import('./catalog-page').then((m) => m.CatalogPage),
  },
  { path: ':pumpId', title: 'Pump - Riffle', loadComponent: () => import('./pump-page').then((m) => m.PumpPage) },
];
