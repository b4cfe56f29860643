import { Routes } from '@angular/router';
import { roleGuard } from './core/role-guard';
import { signedInGuard } from './core/signed-in-guard';

export const appRoutes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Riffle',
    loadComponent: () => import('./home/home-page').then((m) => m.HomePage),
  },
  { path: 'accounts', loadChildren: () => import('./accounts/accounts.routes').then((m) => m.accountsRoutes) },
  {
    path: 'account',
    title: 'Your account - Riffle',
    canActivate: [signedInGuard],
    loadComponent: () => import('./accounts/account-page').then((m) => m.AccountPage),
  },
  {
    path: 'account/profile',
    title: 'Company profile - Riffle',
    canActivate: [roleGuard],
    data: { roles: ['designer', 'admin'] },
    loadComponent: () => import('./profile/company-profile-page').then((m) => m.CompanyProfilePage),
  },
  {
    path: 'admin',
    canActivate: [roleGuard],
    data: { roles: ['admin'] },
    loadChildren: () => import('./admin/admin.routes').then((m) => m.adminRoutes),
  },
  { path: 'design', loadChildren: () => import('./design/design.routes').then((m) => m.designRoutes) },
  {
    path: 'catalog',
    canActivate: [signedInGuard],
    loadChildren: () => import('./catalog/catalog.routes').then((m) => m.catalogRoutes),
  },
  {
    path: 'curve-imports',
    title: 'Load curve tables - Riffle',
    canActivate: [roleGuard],
    data: { roles: ['supplier-admin', 'admin'] },
    loadComponent: () => import('./curve-import/curve-import-page').then((m) => m.CurveImportPage),
  },
  { path: '**', redirectTo: '' },
];
