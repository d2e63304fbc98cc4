import { Routes } from '@angular/router';
import { PlaceholderPage } from '../shared/placeholder-page';

export const shopRoutes: Routes = [
  { path: '', component: PlaceholderPage, data: { heading: 'Merch', text: 'Limited-run shirts and club merch arrive here with the storefront work (issue 3).' }, title: 'Merch — Padside' },
];
