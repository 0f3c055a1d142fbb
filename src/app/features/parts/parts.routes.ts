// Routes of the bill of materials inside a build: parts, budgets and inventory, each loaded when first visited.
import { Routes } from '@angular/router';
import { BudgetsPage } from './pages/budgets-page';
import { InventoryPage } from './pages/inventory-page';
import { PartsPage } from './pages/parts-page';

export const partsRoutes: Routes = [
  { path: 'parts', title: 'Parts · Tallyhood', component: PartsPage },
  { path: 'budgets', title: 'Budgets · Tallyhood', component: BudgetsPage },
  { path: 'inventory', title: 'Inventory · Tallyhood', component: InventoryPage },
];
