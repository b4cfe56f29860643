import type { Routes } from '@angular/router';

/** The five steps of a design, each its own lazily loaded page under the shell. */
export const designRoutes: Routes = [
  {
    path: '',
    loadComponent: () => import('./design-shell').then((m) => m.DesignShell),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'system' },
      {
        path: 'system',
        title: 'Site & system - Riffle',
        loadComponent: () => import('./site-and-system/system-builder-page').then((m) => m.SystemBuilderPage),
      },
      {
        path: 'band',
        title: 'Flow band - Riffle',
        loadComponent: () => import('./flow-band/flow-planner-page').then((m) => m.FlowPlannerPage),
      },
      {
        path: 'candidates',
        title: 'Candidates - Riffle',
        loadComponent: () => import('./candidates/pump-search-page').then((m) => m.PumpSearchPage),
      },
      {
        path: 'compare',
        title: 'Compare - Riffle',
        loadComponent: () => import('./compare/pump-comparison-page').then((m) => m.PumpComparisonPage),
      },
      {
        path: 'projects',
        title: 'Projects - Riffle',
        loadComponent: () => import('./projects/projects-page').then((m) => m.ProjectsPage),
      },
      {
        path: 'projects/:projectId',
        title: 'Project history - Riffle',
        loadComponent: () => import('./projects/project-history-page').then((m) => m.ProjectHistoryPage),
      },
      {
        path: 'projects/:projectId/proposal',
        title: 'Send the proposal - Riffle',
        loadComponent: () => import('./projects/proposal-page').then((m) => m.ProposalPage),
      },
      {
        path: 'report',
        title: 'Report - Riffle',
        loadComponent: () => import('./report/selection-report-page').then((m) => m.SelectionReportPage),
      },
    ],
  },
];
