import { roles, type Role } from '../../shared/vocabularies';

/** The pages the toolbar offers; a link with `roles` shows only to signed-in users with one of them. */
export interface NavigationLink {
  label: string;
  icon: string;
  path: string;
  /** Leave out for pages everyone may open. */
  roles?: readonly Role[];
  /** A page served outside the Angular app (opened in a new tab). */
  external?: boolean;
}

export const navigationLinks: readonly NavigationLink[] = [
  { label: 'Overview', icon: 'water', path: '/' },
  { label: 'API reference', icon: 'integration_instructions', path: '/api/docs', external: true },
  { label: 'Design', icon: 'tune', path: '/design', roles: ['designer', 'admin', 'integrator'] },
  // every role: the catalog is open to all who sign in
  { label: 'Catalog', icon: 'inventory_2', path: '/catalog', roles },
  { label: 'Curve tables', icon: 'upload_file', path: '/curve-imports', roles: ['supplier-admin', 'admin'] },
  { label: 'Users', icon: 'group', path: '/admin/users', roles: ['admin'] },
  { label: 'Audit log', icon: 'policy', path: '/admin/audit-log', roles: ['admin'] },
  { label: 'Demo mailbox', icon: 'mail', path: '/admin/demo-mailbox', roles: ['admin'] },
];
