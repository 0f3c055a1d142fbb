// Routes of the exports feature inside a build: the downloads, and the build sheet laid out for print.
import { Routes } from '@angular/router';
import { BuildSheetPage } from './pages/build-sheet-page';
import { ExportsPage } from './pages/exports-page';

export const exportsRoutes: Routes = [
  { path: '', title: 'Exports · Tallyhood', component: ExportsPage },
  { path: 'build-sheet', title: 'Build sheet · Tallyhood', component: BuildSheetPage },
];
