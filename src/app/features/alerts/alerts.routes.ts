// Routes of the mail alerts feature inside a build.
import { Routes } from '@angular/router';
import { AlertSettings } from './pages/alert-settings';

export const alertsRoutes: Routes = [{ path: '', title: 'Mail alerts · Tallyhood', component: AlertSettings }];
