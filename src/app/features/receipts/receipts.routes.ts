// Routes of the receipts feature inside a build: the list with uploads and the check screen; cores and returns beside them.
import { Routes } from '@angular/router';
import { CoresPage } from './pages/cores-page';
import { ReceiptCheck } from './pages/receipt-check';
import { ReceiptList } from './pages/receipt-list';

export const receiptsRoutes: Routes = [
  { path: '', title: 'Receipts · Tallyhood', component: ReceiptList },
  { path: ':receiptId', title: 'Check receipt · Tallyhood', component: ReceiptCheck },
];

/** Same chunk as the receipts, since a core is always reached from a receipt's line. */
export const coresRoutes: Routes = [{ path: '', title: 'Cores and returns · Tallyhood', component: CoresPage }];
