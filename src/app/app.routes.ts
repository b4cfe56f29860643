import { Routes } from '@angular/router';

export const appRoutes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Riffle',
    loadComponent: () => import('./home/home-page').then((m) => m.HomePage),
  },
  // Every other page holds forms: their routes come with the form-field defaults, so the home page loads no form code.
  { path: '', loadChildren: () => import('./form-pages.routes').then((m) => m.formPagesRoutes) },
];
