// Routes of a build's settings: one page that gathers the build's details, its crew and each person's mail alerts.
import { Routes } from '@angular/router';
import { SettingsPage } from './pages/settings-page/settings-page';

export const settingsRoutes: Routes = [{ path: '', title: 'Settings · Tallyhood', component: SettingsPage }];
