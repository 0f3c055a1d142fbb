// Routes of the ledger feature inside a build: one page, lazy-loaded with chart.js so no other section carries it.
import { Routes } from '@angular/router';
import { LedgerPage } from './pages/ledger-page';

export const ledgerRoutes: Routes = [{ path: '', title: 'Ledger · Tallyhood', component: LedgerPage }];
