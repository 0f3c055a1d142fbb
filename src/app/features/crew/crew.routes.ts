// Routes of the crew feature inside a build.
import { Routes } from '@angular/router';
import { CrewPage } from './pages/crew-page';

export const crewRoutes: Routes = [{ path: '', title: 'Crew · Tallyhood', component: CrewPage }];
