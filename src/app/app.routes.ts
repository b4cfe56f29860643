import { Routes } from '@angular/router';

export const appRoutes: Routes = [
  { path: '', pathMatch: 'full', title: 'Riffle', loadComponent: () => import('./home/home-page').then((m) => m.HomePage) },
  { path: '**', redirectTo: '' },
];
