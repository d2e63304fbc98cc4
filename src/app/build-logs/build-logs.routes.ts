import { Routes } from '@angular/router';
import { PlaceholderPage } from '../shared/placeholder-page';

export const buildLogRoutes: Routes = [
  { path: '', component: PlaceholderPage, data: { heading: 'Build logs', text: 'Build logs arrive here with the build-log and sponsor work (issue 5).' }, title: 'Build logs — Padside' },
];
