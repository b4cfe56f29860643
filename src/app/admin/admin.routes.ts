import { Routes } from '@angular/router';

/** Site-admin pages; the parent route lets only admins in. */
export const adminRoutes: Routes = [
  {
    path: 'users',
    title: 'Users - Riffle',
    loadComponent: () => import('./admin-users-page').then((m) => m.AdminUsersPage),
  },
  {
    path: 'audit-log',
    title: 'Audit log - Riffle',
    loadComponent: () => import('./audit-log-page').then((m) => m.AuditLogPage),
  },
  {
    path: 'demo-mailbox',
    title: 'Demo mailbox - Riffle',
    loadComponent: () => import('./demo-mailbox-page').then((m) => m.DemoMailboxPage),
  },
  { path: '', pathMatch: 'full', redirectTo: 'users' },
];
