// Routes of the builds feature; the moment date adapter is provided here because only these pages pick dates.
import { provideMomentDateAdapter } from '@angular/material-moment-adapter';
import { Routes } from '@angular/router';
import { BuildShell } from './layout/build-shell';
import { BuildForm } from './pages/build-form';
import { BuildList } from './pages/build-list';
import { BuildOverview } from './pages/build-overview';

export const buildsRoutes: Routes = [
  {
    path: '',
    providers: [provideMomentDateAdapter()],
    children: [
      { path: '', title: 'Your builds · Tallyhood', component: BuildList },
      { path: 'new', title: 'New build · Tallyhood', component: BuildForm },
      {
        path: ':buildId',
        component: BuildShell,
        children: [
          { path: '', title: 'Build · Tallyhood', component: BuildOverview },
          { path: 'edit', title: 'Edit build · Tallyhood', component: BuildForm },
          { path: 'crew', loadChildren: () => import('../crew/crew.routes').then((m) => m.crewRoutes) },
          { path: 'receipts', loadChildren: () => import('../receipts/receipts.routes').then((m) => m.receiptsRoutes) },
          { path: 'cores', loadChildren: () => import('../receipts/receipts.routes').then((m) => m.coresRoutes) },
          { path: 'review', loadChildren: () => import('../review/review.routes').then((m) => m.reviewRoutes) },
          { path: 'exports', loadChildren: () => import('../exports/exports.routes').then((m) => m.exportsRoutes) },
          { path: 'ledger', loadChildren: () => import('../ledger/ledger.routes').then((m) => m.ledgerRoutes) },
          { path: 'alerts', loadChildren: () => import('../alerts/alerts.routes').then((m) => m.alertsRoutes) },
          { path: 'settings', loadChildren: () => import('../settings/settings.routes').then((m) => m.settingsRoutes) },
          // Parts, Budgets and Inventory share one lazy chunk; listed last so other sections never load it.
          { path: '', loadChildren: () => import('../parts/parts.routes').then((m) => m.partsRoutes) },
        ],
      },
    ],
  },
];
