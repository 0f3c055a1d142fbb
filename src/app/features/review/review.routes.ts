// Routes of the review feature inside a build: the partner's queue with the chosen receipt.
import { Routes } from '@angular/router';
import { ReviewPage } from './pages/review-page';

export const reviewRoutes: Routes = [{ path: '', title: 'Review · Tallyhood', component: ReviewPage }];
