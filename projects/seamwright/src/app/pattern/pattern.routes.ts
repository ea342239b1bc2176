import { Routes } from '@angular/router';
import { PatternPageComponent } from './pattern-page.component';
import { unsavedChangesGuard } from './board/unsaved-changes.guard';

/** The pattern page's parts, each reachable by URL. */
export const patternRoutes: Routes = [
  {
    path: '',
    component: PatternPageComponent,
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'board' },
      {
        path: 'board',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./board/board-page.component').then((m) => m.BoardPageComponent),
        title: 'Drafting board · Seamwright',
      },
      { path: 'quilt', canDeactivate: [unsavedChangesGuard], loadComponent: () => import('./quilt/quilt-page.component').then((m) => m.QuiltPageComponent), title: 'Quilt · Seamwright' },
      { path: 'cutting', loadComponent: () => import('./cutting/cutting-page.component').then((m) => m.CuttingPageComponent), title: 'Cutting list · Seamwright' },
      { path: 'print', loadComponent: () => import('./print/print-page.component').then((m) => m.PrintPageComponent), title: 'Print · Seamwright' },
      { path: 'share', loadComponent: () => import('./share/share-page.component').then((m) => m.SharePageComponent), title: 'Share · Seamwright' },
      { path: 'history', loadComponent: () => import('./history/history-page.component').then((m) => m.HistoryPageComponent), title: 'History · Seamwright' },
      {
        path: 'history/:revisionNumber',
        loadComponent: () => import('./history/revision-view.component').then((m) => m.RevisionViewComponent),
        title: 'Revision · Seamwright',
      },
      { path: 'sewing-log', loadComponent: () => import('./sewing-log/sewing-log-page.component').then((m) => m.SewingLogPageComponent), title: 'Sewing log · Seamwright' },
      { path: 'sew', loadComponent: () => import('./guided-sewing/guided-sewing-page.component').then((m) => m.GuidedSewingPageComponent), title: 'Guided sewing · Seamwright' },
      { path: '**', loadComponent: () => import('../not-found/not-found.component').then((m) => m.NotFoundComponent) },
    ],
  },
];
